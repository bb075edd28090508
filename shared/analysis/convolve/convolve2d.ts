import { assertBorderRule, type BorderRule } from './border'
import { padImage } from './pad'
import type { GreyLike, Kernel2D } from './types'
import { assertGrey, assertKernel2D } from './validate'

export interface Convolve2DOptions {
  /** How samples outside the image are filled. Default `'reflect101'` (OpenCV's default). */
  border?: BorderRule
  /** Caller-owned output buffer of width·height samples; a new Float32Array when omitted. */
  output?: Float32Array | Float64Array
}

export interface ConvolvedImage<T extends Float32Array | Float64Array = Float32Array> {
  width: number
  height: number
  data: T
}

/**
 * 2-D convolution (the kernel is flipped): out(x, y) = Σ k(i, j) · in(x + cx − i, y + cy − j).
 * Kernel width and height must be odd. Sums in double precision.
 * Matches scipy.ndimage.convolve; OpenCV filter2D computes the correlation (see correlate2d).
 */
export function convolve2d(
  image: GreyLike,
  kernel: Kernel2D,
  options: Convolve2DOptions = {},
): ConvolvedImage<Float32Array | Float64Array> {
  assertKernel2D(kernel)
  const n = kernel.width * kernel.height
  const flipped = new Float64Array(n)
  for (let i = 0; i < n; i++) flipped[i] = kernel.data[n - 1 - i]
  return correlate2d(image, { width: kernel.width, height: kernel.height, data: flipped }, options)
}

/** 2-D correlation (kernel not flipped), as OpenCV filter2D computes it. Options as convolve2d. */
export function correlate2d(
  image: GreyLike,
  kernel: Kernel2D,
  options: Convolve2DOptions = {},
): ConvolvedImage<Float32Array | Float64Array> {
  assertGrey(image)
  assertKernel2D(kernel)
  const border = options.border ?? 'reflect101'
  assertBorderRule(border)
  const { width, height } = image
  const out = options.output ?? new Float32Array(width * height)
  if (out.length !== width * height) {
    throw new RangeError(`The output must hold ${width * height} samples (got ${out.length}).`)
  }
  const cx = kernel.width >> 1
  const cy = kernel.height >> 1
  const padded = padImage(image, cx, cy, border)
  const pw = padded.width
  const src = padded.data
  const kw = kernel.width
  const kh = kernel.height
  const k = Float64Array.from(kernel.data)
  const row = new Float64Array(width)
  for (let y = 0; y < height; y++) {
    row.fill(0)
    for (let j = 0; j < kh; j++) {
      const base = (y + j) * pw
      for (let i = 0; i < kw; i++) {
        const w = k[j * kw + i]
        if (w === 0) continue
        const off = base + i
        for (let x = 0; x < width; x++) row[x] += w * src[off + x]
      }
    }
    out.set(row, y * width)
  }
  return { width, height, data: out }
}
