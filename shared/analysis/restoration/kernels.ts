import type { Kernel2D, Signal } from '../convolve/types'
import type { Spectrum2D } from '../fft/fft2d'
import { transform2dInPlace } from '../fft/fft2d'

/**
 * Throws unless the kernel is non-negative with a positive sum; returns a copy scaled to sum 1
 * (a blur kernel keeps the mean brightness). `what` names the kernel in the message.
 */
export function normalisedKernel(data: Signal, what = 'kernel'): Float64Array {
  let sum = 0
  for (let i = 0; i < data.length; i++) {
    const v = data[i]
    if (!Number.isFinite(v) || v < 0) {
      throw new RangeError(`The ${what} must hold finite non-negative values (index ${i} is ${v}).`)
    }
    sum += v
  }
  if (!(sum > 0)) throw new RangeError(`The ${what} must have a positive sum.`)
  const out = new Float64Array(data.length)
  for (let i = 0; i < data.length; i++) out[i] = data[i] / sum
  return out
}

/**
 * Transfer function of a 2-D kernel on a W × H grid: the kernel placed with its centre on pixel
 * (0, 0) (wrapped), so it adds no shift, then transformed. The kernel must fit in the grid.
 */
export function kernelSpectrum(
  kernel: Kernel2D,
  weights: Float64Array,
  width: number,
  height: number,
): Spectrum2D {
  if (kernel.width > width || kernel.height > height) {
    throw new RangeError(
      `The ${kernel.width} × ${kernel.height} kernel is larger than the ${width} × ${height} working grid.`,
    )
  }
  const re = new Float64Array(width * height)
  const im = new Float64Array(width * height)
  const cx = kernel.width >> 1
  const cy = kernel.height >> 1
  for (let j = 0; j < kernel.height; j++) {
    const y = (j - cy + height) % height
    for (let i = 0; i < kernel.width; i++) {
      const x = (i - cx + width) % width
      re[y * width + x] += weights[j * kernel.width + i]
    }
  }
  const s = { width, height, re, im }
  transform2dInPlace(s, false)
  return s
}
