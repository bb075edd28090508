import type { GreyLike } from '../convolve/types'
import { forEachFramePixel, makeBorderSampler } from './borderSampler'
import { resolveRegion, type FocusOptions, type ResolvedRegion } from './region'

export interface SumOrMeanOptions extends FocusOptions {
  /** `'sum'` (the published definition, default) or `'mean'` (per pixel, comparable across sizes). */
  reduce?: 'sum' | 'mean'
}

/**
 * Tenengrad (Krotkov, IJCV 1987): Σ (Gx² + Gy²) with the 3 × 3 Sobel operators
 * Gx = [[−1, 0, 1], [−2, 0, 2], [−1, 0, 1]], Gy its transpose, over every pixel.
 * Options: `roi`, `border` (default `'replicate'`), `reduce` (default `'sum'`).
 */
export function tenengrad(image: GreyLike, options: SumOrMeanOptions = {}): number {
  const r = resolveRegion(image, options)
  const reduce = checkReduce(options.reduce)
  const { data, stride, x0, y0, w, h } = r
  let sum = 0
  for (let y = 1; y < h - 1; y++) {
    const row = (y0 + y) * stride + x0
    const up = row - stride
    const down = row + stride
    // Sliding 3 × 3 window: columns a (x − 1), b (x), c (x + 1) of rows up, mid, down.
    let ua = data[up]
    let ub = data[up + 1]
    let ma = data[row]
    let da = data[down]
    let db = data[down + 1]
    for (let x = 1; x < w - 1; x++) {
      const uc = data[up + x + 1]
      const mc = data[row + x + 1]
      const dc = data[down + x + 1]
      const gx = uc + 2 * mc + dc - ua - 2 * ma - da
      const gy = da + 2 * db + dc - ua - 2 * ub - uc
      sum += gx * gx + gy * gy
      ua = ub
      ub = uc
      ma = data[row + x]
      da = db
      db = dc
    }
  }
  sum += frameSum(r)
  return reduce === 'mean' ? sum / (w * h) : sum
}

/** Σ(Gx² + Gy²) over the one-pixel frame, with the border rule (a separate closure scope). */
function frameSum(r: ResolvedRegion): number {
  const { w, h } = r
  let sum = 0
  const at = makeBorderSampler(r)
  forEachFramePixel(w, h, (x, y) => {
    const gx =
      at(x + 1, y - 1) +
      2 * at(x + 1, y) +
      at(x + 1, y + 1) -
      at(x - 1, y - 1) -
      2 * at(x - 1, y) -
      at(x - 1, y + 1)
    const gy =
      at(x - 1, y + 1) +
      2 * at(x, y + 1) +
      at(x + 1, y + 1) -
      at(x - 1, y - 1) -
      2 * at(x, y - 1) -
      at(x + 1, y - 1)
    sum += gx * gx + gy * gy
  })
  return sum
}

export function checkReduce(reduce: unknown): 'sum' | 'mean' {
  if (reduce === undefined) return 'sum'
  if (reduce !== 'sum' && reduce !== 'mean') {
    throw new TypeError(`Unknown reduce option ${JSON.stringify(reduce)}: use 'sum' or 'mean'.`)
  }
  return reduce
}
