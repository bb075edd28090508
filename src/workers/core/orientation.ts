// EXIF orientation (TIFF tag 0x0112, values 1–8) applied to decoded RGBA pixels. Browsers apply
// it while decoding (createImageBitmap with imageOrientation 'from-image'); this is the fallback
// for a decoder that did not, and the rule for which way the frame's width and height go.

/** Orientations 5–8 turn the picture by a quarter: the stored width becomes the height. */
export function swapsAxes(orientation: number): boolean {
  return orientation >= 5 && orientation <= 8
}

/** Width and height of the picture as it should be shown. */
export function orientedSize(
  width: number,
  height: number,
  orientation: number,
): { width: number; height: number } {
  return swapsAxes(orientation) ? { width: height, height: width } : { width, height }
}

/** A valid EXIF orientation, or 1 (as stored) for anything else. */
export function normaliseOrientation(value: unknown): number {
  return typeof value === 'number' && Number.isInteger(value) && value >= 1 && value <= 8
    ? value
    : 1
}

/**
 * Did the decoder already turn the picture? Only visible for the quarter turns of a
 * non-square picture: the decoded size then equals the oriented size, not the stored one.
 */
export function decoderApplied(
  stored: { width: number; height: number },
  decoded: { width: number; height: number },
  orientation: number,
): boolean {
  if (!swapsAxes(orientation) || stored.width === stored.height) return true
  return decoded.width === stored.height && decoded.height === stored.width
}

/**
 * Source pixel (column, row in the stored picture) of display pixel (x, y), for a stored picture
 * of `w × h`. EXIF 274 [std, TIFF 6.0 / Exif 2.3]: 1 as stored, 2 mirrored left-right, 3 turned
 * 180°, 4 mirrored top-bottom, 5 transposed, 6 turned 90° clockwise for display, 7 transverse,
 * 8 turned 90° anticlockwise for display.
 */
export function sourceOf(
  x: number,
  y: number,
  w: number,
  h: number,
  orientation: number,
): [number, number] {
  switch (orientation) {
    case 2:
      return [w - 1 - x, y]
    case 3:
      return [w - 1 - x, h - 1 - y]
    case 4:
      return [x, h - 1 - y]
    case 5:
      return [y, x]
    case 6:
      return [y, h - 1 - x]
    case 7:
      return [w - 1 - y, h - 1 - x]
    case 8:
      return [w - 1 - y, x]
    default:
      return [x, y]
  }
}

/** A copy of interleaved RGBA pixels (`w × h` as stored) turned to display orientation. */
export function applyOrientation(
  rgba: Uint8ClampedArray<ArrayBuffer>,
  w: number,
  h: number,
  orientation: number,
): { width: number; height: number; data: Uint8ClampedArray<ArrayBuffer> } {
  if (rgba.length !== w * h * 4) {
    throw new RangeError(`The pixel buffer holds ${rgba.length} bytes, not ${w} × ${h} × 4.`)
  }
  const o = normaliseOrientation(orientation)
  const size = orientedSize(w, h, o)
  if (o === 1) return { ...size, data: rgba }
  const out = new Uint8ClampedArray(rgba.length)
  const src = rgba.byteOffset % 4 === 0 ? rgba : rgba.slice()
  const view32In = new Uint32Array(src.buffer, src.byteOffset, w * h)
  const view32Out = new Uint32Array(out.buffer)
  for (let y = 0; y < size.height; y++) {
    for (let x = 0; x < size.width; x++) {
      const [sx, sy] = sourceOf(x, y, w, h, o)
      view32Out[y * size.width + x] = view32In[sy * w + sx]
    }
  }
  return { ...size, data: out }
}
