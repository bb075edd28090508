import type { GreyLike } from '../convolve/types'
import { resolveRegion, type FocusRegion } from './region'

export interface NormalisedVarianceOptions {
  /** Region to measure; default the whole frame. */
  roi?: FocusRegion
}

/**
 * Normalised variance (Groen, Young & Ligthart, Cytometry 1985): (1 / (μ·N)) · Σ (I − μ)², the
 * population variance divided by the mean, which makes it less sensitive to exposure.
 * Throws a RangeError when the mean is zero (a black region has no defined value).
 */
export function normalisedVariance(
  image: GreyLike,
  options: NormalisedVarianceOptions = {},
): number {
  const { data, stride, x0, y0, w, h } = resolveRegion(image, { roi: options.roi })
  // Shifted single pass: subtracting the first sample keeps Σd² − (Σd)²/N accurate.
  const shift = data[y0 * stride + x0]
  let sum = 0
  let sumSq = 0
  for (let y = 0; y < h; y++) {
    const row = (y0 + y) * stride + x0
    for (let x = 0; x < w; x++) {
      const d = data[row + x] - shift
      sum += d
      sumSq += d * d
    }
  }
  const n = w * h
  const mean = shift + sum / n
  if (!(mean > 0)) {
    throw new RangeError(
      `Normalised variance needs a region with a positive mean (got ${mean}); is the image black?`,
    )
  }
  const variance = Math.max(0, (sumSq - (sum * sum) / n) / n)
  return variance / mean
}
