import type { GreyLike } from '../convolve/types'
import { brenner } from './brenner'
import { laplacianVariance } from './laplacianVariance'
import { normalisedVariance } from './normalisedVariance'
import type { FocusOptions } from './region'
import { tenengrad, type SumOrMeanOptions } from './tenengrad'

export interface FocusMeasures {
  /** Variance of the Laplacian (population variance). */
  laplacianVariance: number
  /** Tenengrad Σ(Gx² + Gy²), or the per-pixel mean with `reduce: 'mean'`. */
  tenengrad: number
  /** Brenner Σ(I(x+2) − I(x))², or the per-pair mean with `reduce: 'mean'`. */
  brenner: number
  /** Normalised variance σ²/μ; null when the region's mean is not positive. */
  normalisedVariance: number | null
  /** The border rule used for the Laplacian and Tenengrad. */
  border: NonNullable<FocusOptions['border']>
}

/**
 * All four no-reference focus measures of one frame or region. Options as the single measures:
 * `roi` (default whole frame), `border` (default `'replicate'`), `reduce` (default `'sum'`).
 */
export function focusMeasures(image: GreyLike, options: SumOrMeanOptions = {}): FocusMeasures {
  const border = options.border ?? 'replicate'
  let nv: number | null = null
  const lv = laplacianVariance(image, { roi: options.roi, border })
  try {
    nv = normalisedVariance(image, { roi: options.roi })
  } catch {
    nv = null
  }
  return {
    laplacianVariance: lv,
    tenengrad: tenengrad(image, { roi: options.roi, border, reduce: options.reduce }),
    brenner: brenner(image, { roi: options.roi, reduce: options.reduce }),
    normalisedVariance: nv,
    border,
  }
}
