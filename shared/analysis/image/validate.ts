import type { GreyImage, Roi } from '../types'

/** Throws unless `image` is a grey image with a Float32Array of width × height samples. */
export function assertGreyImage(image: GreyImage, what = 'image'): void {
  if (image === null || typeof image !== 'object') {
    throw new TypeError(`The ${what} must be an object with width, height and data.`)
  }
  const { width, height, data } = image
  if (!Number.isInteger(width) || !Number.isInteger(height) || width < 1 || height < 1) {
    throw new RangeError(
      `The ${what} must have positive integer width and height (got ${width} × ${height}).`,
    )
  }
  if (!(data instanceof Float32Array)) {
    throw new TypeError(`The ${what} data must be a Float32Array of linear luminance.`)
  }
  if (data.length !== width * height) {
    throw new RangeError(
      `The ${what} data holds ${data.length} samples, but ${width} × ${height} needs ${width * height}.`,
    )
  }
}

/** Throws unless `roi` has integer coordinates and lies inside a `width × height` image. */
export function assertRoiInside(roi: Roi, width: number, height: number): void {
  if (roi === null || typeof roi !== 'object') {
    throw new TypeError('The region must be an object with x, y, w and h.')
  }
  const { x, y, w, h } = roi
  if (![x, y, w, h].every(Number.isInteger)) {
    throw new RangeError(`The region must have integer x, y, w and h (got ${x}, ${y}, ${w}, ${h}).`)
  }
  if (w < 1 || h < 1 || x < 0 || y < 0 || x + w > width || y + h > height) {
    throw new RangeError(
      `The region ${x},${y},${w},${h} does not lie inside the ${width} × ${height} image.`,
    )
  }
}
