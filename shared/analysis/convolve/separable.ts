import { assertBorderRule, borderIndexTable } from './border'
import type { Convolve2DOptions, ConvolvedImage } from './convolve2d'
import type { GreyLike, Signal } from './types'
import { assertGrey, assertKernel1D } from './validate'

/**
 * Separable 2-D convolution: convolve every row with `kernelX`, then every column with `kernelY`.
 * Equals convolve2d with the outer-product kernel kernelY ⊗ kernelX under every border rule, at
 * (len(kx) + len(ky)) instead of len(kx)·len(ky) multiplications per pixel. Kernels are flipped
 * (true convolution) and must have odd lengths. Options as convolve2d (default border `'reflect101'`).
 */
export function convolveSeparable(
  image: GreyLike,
  kernelX: Signal,
  kernelY: Signal,
  options: Convolve2DOptions = {},
): ConvolvedImage<Float32Array | Float64Array> {
  assertGrey(image)
  assertKernel1D(kernelX, 'horizontal kernel')
  assertKernel1D(kernelY, 'vertical kernel')
  const border = options.border ?? 'reflect101'
  assertBorderRule(border)
  const { width, height, data } = image
  const out = options.output ?? new Float32Array(width * height)
  if (out.length !== width * height) {
    throw new RangeError(`The output must hold ${width * height} samples (got ${out.length}).`)
  }
  const kx = flip(kernelX)
  const ky = flip(kernelY)
  const cx = kx.length >> 1
  const cy = ky.length >> 1
  const colIndex = borderIndexTable(width, cx, cx, border)
  const rowIndex = borderIndexTable(height, cy, cy, border)

  // Pass 1: rows, into a double-precision intermediate.
  const tmp = new Float64Array(width * height)
  const padRow = new Float64Array(width + 2 * cx)
  for (let y = 0; y < height; y++) {
    const base = y * width
    for (let p = 0; p < padRow.length; p++) {
      const s = colIndex[p]
      padRow[p] = s < 0 ? 0 : data[base + s]
    }
    for (let x = 0; x < width; x++) {
      let acc = 0
      for (let i = 0; i < kx.length; i++) acc += kx[i] * padRow[x + i]
      tmp[base + x] = acc
    }
  }

  // Pass 2: columns, accumulated row by row so memory is read in order.
  const acc = new Float64Array(width)
  for (let y = 0; y < height; y++) {
    acc.fill(0)
    for (let j = 0; j < ky.length; j++) {
      const sy = rowIndex[y + j]
      if (sy < 0) continue
      const w = ky[j]
      const base = sy * width
      for (let x = 0; x < width; x++) acc[x] += w * tmp[base + x]
    }
    out.set(acc, y * width)
  }
  return { width, height, data: out }
}

function flip(kernel: Signal): Float64Array {
  const out = new Float64Array(kernel.length)
  for (let j = 0; j < kernel.length; j++) out[j] = kernel[kernel.length - 1 - j]
  return out
}
