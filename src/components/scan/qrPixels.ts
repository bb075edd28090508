// QR decoding in plain JavaScript (the `jsqr` package) for browsers without a built-in barcode
// detector. Loaded on demand, so the camera list does not carry it.
import jsQRModule from 'jsqr'

// The package is CommonJS with an `exports.default`: bundlers unwrap it, Node's import does not.
const jsQR: typeof jsQRModule =
  (jsQRModule as unknown as { default?: typeof jsQRModule }).default ?? jsQRModule

/** The text of the QR code in an RGBA image, or null when none can be read. */
export function decodeQrPixels(
  rgba: Uint8ClampedArray,
  width: number,
  height: number,
): string | null {
  if (!Number.isInteger(width) || !Number.isInteger(height) || width <= 0 || height <= 0) {
    throw new RangeError(`The image must have a positive whole size (got ${width} × ${height}).`)
  }
  if (rgba.length !== width * height * 4) {
    throw new RangeError(
      `The image has ${rgba.length} bytes; ${width} × ${height} RGBA needs ${width * height * 4}.`,
    )
  }
  // Labels are printed dark on light: skipping the inverted pass halves the work per frame.
  const code = jsQR(rgba, width, height, { inversionAttempts: 'dontInvert' })
  return code ? code.data : null
}
