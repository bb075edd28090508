/** Format and size of an encoded image, read from its header without decoding. */
export interface ImageHeader {
  format: 'png' | 'jpeg'
  width: number
  height: number
  /** Bits per sample: PNG IHDR bit depth or JPEG sample precision. */
  bitDepth: number
}

/** Largest frame the product decodes: 100 megapixels. */
export const MAX_FRAME_PIXELS = 100_000_000

const PNG_SIGNATURE = [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]

/**
 * Reads width and height from a PNG IHDR chunk or a JPEG SOFn segment.
 * Throws a TypeError when the bytes are neither PNG nor JPEG, a RangeError when the header
 * is cut short or malformed.
 */
export function readImageHeader(bytes: Uint8Array): ImageHeader {
  if (!(bytes instanceof Uint8Array)) throw new TypeError('The image file must be a byte array.')
  if (PNG_SIGNATURE.every((b, i) => bytes[i] === b)) return readPngHeader(bytes)
  if (bytes[0] === 0xff && bytes[1] === 0xd8) return readJpegHeader(bytes)
  throw new TypeError('The file is neither a PNG nor a JPEG image.')
}

function u16(bytes: Uint8Array, at: number): number {
  return (bytes[at] << 8) | bytes[at + 1]
}

function u32(bytes: Uint8Array, at: number): number {
  return ((bytes[at] << 24) | (bytes[at + 1] << 16) | (bytes[at + 2] << 8) | bytes[at + 3]) >>> 0
}

function readPngHeader(bytes: Uint8Array): ImageHeader {
  const isIhdr =
    bytes[12] === 0x49 && bytes[13] === 0x48 && bytes[14] === 0x44 && bytes[15] === 0x52
  if (bytes.length < 26 || !isIhdr) {
    throw new RangeError('The PNG file is cut short or has no IHDR header.')
  }
  const width = u32(bytes, 16)
  const height = u32(bytes, 20)
  if (width === 0 || height === 0) throw new RangeError('The PNG header gives a zero image size.')
  return { format: 'png', width, height, bitDepth: bytes[24] }
}

function readJpegHeader(bytes: Uint8Array): ImageHeader {
  let at = 2
  while (at + 3 < bytes.length) {
    if (bytes[at] !== 0xff) throw new RangeError('The JPEG file has a malformed marker sequence.')
    const marker = bytes[at + 1]
    if (marker === 0xff) {
      at += 1 // fill byte
      continue
    }
    if (marker === 0x01 || (marker >= 0xd0 && marker <= 0xd7)) {
      at += 2 // markers without a length
      continue
    }
    if (marker === 0xd9 || marker === 0xda) break // end of image / start of scan before any frame
    const length = u16(bytes, at + 2)
    const isSof =
      marker >= 0xc0 && marker <= 0xcf && marker !== 0xc4 && marker !== 0xc8 && marker !== 0xcc
    if (isSof) {
      if (at + 9 > bytes.length) break
      const height = u16(bytes, at + 5)
      const width = u16(bytes, at + 7)
      if (width === 0 || height === 0)
        throw new RangeError('The JPEG header gives a zero image size.')
      return { format: 'jpeg', width, height, bitDepth: bytes[at + 4] }
    }
    if (length < 2) throw new RangeError('The JPEG file has a malformed segment length.')
    at += 2 + length
  }
  throw new RangeError('The JPEG file is cut short before its frame header (SOF).')
}

/** Throws a RangeError when the header claims more than `maxPixels` pixels. */
export function assertFrameSize(header: ImageHeader, maxPixels = MAX_FRAME_PIXELS): void {
  const pixels = header.width * header.height
  if (pixels > maxPixels) {
    const mp = (pixels / 1e6).toFixed(1)
    throw new RangeError(
      `The image is ${header.width} × ${header.height} (${mp} MP), larger than the ${maxPixels / 1e6} MP limit.`,
    )
  }
}
