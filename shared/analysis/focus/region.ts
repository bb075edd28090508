import { assertBorderRule, type BorderRule } from '../convolve/border'
import type { GreyLike } from '../convolve/types'
import { assertGrey } from '../convolve/validate'

/** A rectangle in pixels; `w`/`h` are accepted as short forms of `width`/`height`. */
export type FocusRegion =
  | { x: number; y: number; width: number; height: number }
  | { x: number; y: number; w: number; h: number }

export interface FocusOptions {
  /**
   * Region to measure; default the whole frame. The region is measured as an image of its own
   * (like a crop, OpenCV's BORDER_ISOLATED): pixels outside it are never read, the border rule
   * fills them, so the result depends only on the region's pixels.
   */
  roi?: FocusRegion
  /** How samples outside the region are filled. Default `'replicate'`. */
  border?: BorderRule
}

/** Validated region in frame coordinates plus the image stride. */
export interface ResolvedRegion {
  data: GreyLike['data']
  stride: number
  x0: number
  y0: number
  w: number
  h: number
  border: BorderRule
}

export function resolveRegion(image: GreyLike, options: FocusOptions): ResolvedRegion {
  assertGrey(image)
  const border = options.border ?? 'replicate'
  assertBorderRule(border)
  let x0 = 0
  let y0 = 0
  let w = image.width
  let h = image.height
  if (options.roi !== undefined) {
    const r = options.roi as Record<string, number>
    x0 = r.x
    y0 = r.y
    w = r.width ?? r.w
    h = r.height ?? r.h
    const ints = [x0, y0, w, h].every((v) => Number.isInteger(v))
    if (!ints || w < 1 || h < 1) {
      throw new RangeError(
        `The region must have integer x, y and a positive integer width and height (got ${x0}, ${y0}, ${w} × ${h}).`,
      )
    }
    if (x0 < 0 || y0 < 0 || x0 + w > image.width || y0 + h > image.height) {
      throw new RangeError(
        `The region ${w} × ${h} at (${x0}, ${y0}) does not fit inside the ${image.width} × ${image.height} image.`,
      )
    }
  }
  return { data: image.data, stride: image.width, x0, y0, w, h, border }
}
