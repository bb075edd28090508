import type { GreyLike } from '../convolve/types'
import { resolveRegion, type FocusRegion } from './region'
import { checkReduce } from './tenengrad'

export interface BrennerOptions {
  /** Region to measure (measured as its own image); default the whole frame. */
  roi?: FocusRegion
  /** `'sum'` (default, the published definition) or `'mean'` over the (width − 2)·height pairs. */
  reduce?: 'sum' | 'mean'
}

/**
 * Brenner gradient (Brenner et al., J. Histochem. Cytochem. 1976): Σ (I(x + 2, y) − I(x, y))²
 * over every pair inside the region (x from 0 to width − 3). No samples outside the region are
 * needed, so there is no border rule. Needs a region at least 3 pixels wide.
 */
export function brenner(image: GreyLike, options: BrennerOptions = {}): number {
  const r = resolveRegion(image, { roi: options.roi })
  const reduce = checkReduce(options.reduce)
  const { data, stride, x0, y0, w, h } = r
  if (w < 3) {
    throw new RangeError(`The Brenner measure needs a region at least 3 pixels wide (got ${w}).`)
  }
  let sum = 0
  for (let y = 0; y < h; y++) {
    const row = (y0 + y) * stride + x0
    for (let x = 0; x < w - 2; x++) {
      const d = data[row + x + 2] - data[row + x]
      sum += d * d
    }
  }
  return reduce === 'mean' ? sum / ((w - 2) * h) : sum
}
