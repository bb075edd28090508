import { assertBorderRule, borderIndexTable, type BorderRule } from './border'
import type { Signal } from './types'
import { assertKernel1D, assertSignal } from './validate'

export interface Convolve1DOptions {
  /** How samples outside the signal are filled. Default `'reflect101'` (OpenCV's default). */
  border?: BorderRule
  /** Caller-owned output of the signal's length; a new Float64Array when omitted. */
  output?: Float64Array
}

/**
 * Discrete convolution y[i] = Σ_j k[j] · x[i + c − j], c = (len(k) − 1) / 2 (the kernel is flipped).
 * The kernel length must be odd; the output has the signal's length.
 * Matches scipy.ndimage.convolve1d and OpenCV filter2D with the flipped kernel.
 */
export function convolve1d(
  signal: Signal,
  kernel: Signal,
  options: Convolve1DOptions = {},
): Float64Array {
  assertKernel1D(kernel)
  const flipped = new Float64Array(kernel.length)
  for (let j = 0; j < kernel.length; j++) flipped[j] = kernel[kernel.length - 1 - j]
  return correlate1d(signal, flipped, options)
}

/**
 * Discrete correlation y[i] = Σ_j k[j] · x[i + j − c] (the kernel is not flipped), as OpenCV
 * filter2D and scipy.ndimage.correlate1d compute it. Same options as convolve1d.
 */
export function correlate1d(
  signal: Signal,
  kernel: Signal,
  options: Convolve1DOptions = {},
): Float64Array {
  assertSignal(signal)
  assertKernel1D(kernel)
  const border = options.border ?? 'reflect101'
  assertBorderRule(border)
  const n = signal.length
  const out = options.output ?? new Float64Array(n)
  if (out.length !== n) {
    throw new RangeError(`The output must have the signal's length ${n} (got ${out.length}).`)
  }
  const c = (kernel.length - 1) >> 1
  // Padded copy: positions −c … n − 1 + c.
  const index = borderIndexTable(n, c, c, border)
  const padded = new Float64Array(n + 2 * c)
  for (let j = 0; j < padded.length; j++) padded[j] = index[j] < 0 ? 0 : signal[index[j]]
  for (let i = 0; i < n; i++) {
    let acc = 0
    for (let j = 0; j < kernel.length; j++) acc += kernel[j] * padded[i + j]
    out[i] = acc
  }
  return out
}
