import type { GreyLike } from '../convolve/types'
import { forEachFramePixel, makeBorderSampler } from './borderSampler'
import { resolveRegion, type FocusOptions, type ResolvedRegion } from './region'

/**
 * Variance of the Laplacian (Pech-Pacheco et al., ICPR 2000): the population variance over all
 * pixels of the response to [[0, 1, 0], [1, −4, 1], [0, 1, 0]] (as cv2.Laplacian(ksize=1).var()).
 * Options: `roi` (default whole frame), `border` (default `'replicate'`).
 * Scales with contrast² and with noise (+20σ²); no absolute threshold — compare with a baseline.
 */
export function laplacianVariance(image: GreyLike, options: FocusOptions = {}): number {
  const r = resolveRegion(image, options)
  const { data, stride, x0, y0, w, h } = r
  let sum = 0
  let sumSq = 0
  // Interior: all four neighbours inside the region; one fused pass with row offsets.
  for (let y = 1; y < h - 1; y++) {
    const row = (y0 + y) * stride + x0
    const up = row - stride
    const down = row + stride
    let left = data[row]
    let centre = data[row + 1]
    for (let x = 1; x < w - 1; x++) {
      const right = data[row + x + 1]
      const lap = data[up + x] + data[down + x] + left + right - 4 * centre
      sum += lap
      sumSq += lap * lap
      left = centre
      centre = right
    }
  }
  const frame = frameSums(r)
  sum += frame[0]
  sumSq += frame[1]
  const n = w * h
  const mean = sum / n
  return Math.max(0, sumSq / n - mean * mean)
}

/**
 * Σ and Σ² of the Laplacian over the one-pixel frame, with the border rule. Kept out of the main
 * function so its closure does not capture (and slow down) the interior loop's accumulators.
 */
function frameSums(r: ResolvedRegion): [number, number] {
  const at = makeBorderSampler(r)
  const acc: [number, number] = [0, 0]
  forEachFramePixel(r.w, r.h, (x, y) => {
    const lap = at(x, y - 1) + at(x, y + 1) + at(x - 1, y) + at(x + 1, y) - 4 * at(x, y)
    acc[0] += lap
    acc[1] += lap * lap
  })
  return acc
}
