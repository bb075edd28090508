import { decode } from 'image-js'
import {
  assertFrameSize,
  MAX_FRAME_PIXELS,
  readImageHeader,
} from '../../../shared/analysis/image/header'
import type { ImageHeader } from '../../../shared/analysis/image/header'
import type { RawImage } from '../../../shared/analysis/image/luminance'
import { AppError } from '../../errors'

export const UPLOAD_ERRORS = {
  noFile: 'upload.no_file',
  empty: 'upload.empty',
  tooLarge: 'upload.too_large',
  unsupportedType: 'upload.unsupported_type',
  badHeader: 'upload.bad_header',
  tooManyPixels: 'upload.too_many_pixels',
  undecodable: 'upload.undecodable',
  roiMismatch: 'upload.roi_mismatch',
  frameNotShared: 'upload.frame_not_shared',
  badField: 'upload.bad_field',
} as const

export interface InspectedImage {
  header: ImageHeader
  mime: 'image/png' | 'image/jpeg'
  ext: 'png' | 'jpg'
}

/**
 * Identifies a PNG or JPEG by its magic bytes (never by the type the client claims) and reads
 * its pixel size from the header, before anything is decoded: no file, zero bytes, another
 * format, a cut-short header or more than `maxPixels` each get their own clear 4xx.
 */
export function inspectImage(bytes: Uint8Array, maxPixels = MAX_FRAME_PIXELS): InspectedImage {
  if (bytes.length === 0) {
    throw new AppError(UPLOAD_ERRORS.empty, 'The uploaded file is empty (0 bytes).', 400)
  }
  let header: ImageHeader
  try {
    header = readImageHeader(bytes)
  } catch (err) {
    if (err instanceof TypeError) {
      throw new AppError(
        UPLOAD_ERRORS.unsupportedType,
        'The file is not a PNG or JPEG image (checked by its content, not its name or stated type).',
        415,
      )
    }
    const why = err instanceof Error ? err.message : String(err)
    throw new AppError(UPLOAD_ERRORS.badHeader, `The image header cannot be read: ${why}`, 422)
  }
  try {
    assertFrameSize(header, maxPixels)
  } catch (err) {
    throw new AppError(UPLOAD_ERRORS.tooManyPixels, (err as Error).message, 422, {
      width: header.width,
      height: header.height,
      maxPixels,
    })
  }
  return header.format === 'png'
    ? { header, mime: 'image/png', ext: 'png' }
    : { header, mime: 'image/jpeg', ext: 'jpg' }
}

/** Decodes with image-js; a damaged or cut-short file is a 422 naming the problem. */
export function decodeImage(bytes: Uint8Array, inspected: InspectedImage): RawImage {
  const kind = inspected.header.format.toUpperCase()
  let raw
  try {
    raw = decode(bytes).getRawImage()
  } catch (err) {
    const why = err instanceof Error ? err.message : String(err)
    throw new AppError(
      UPLOAD_ERRORS.undecodable,
      `The ${kind} file is damaged or cut short and cannot be decoded (${why}).`,
      422,
    )
  }
  if (raw.width !== inspected.header.width || raw.height !== inspected.header.height) {
    throw new AppError(
      UPLOAD_ERRORS.undecodable,
      `The ${kind} file decodes to ${raw.width} × ${raw.height} pixels, not the ${inspected.header.width} × ${inspected.header.height} its header states.`,
      422,
    )
  }
  if (raw.bitDepth !== 8 && raw.bitDepth !== 16) {
    throw new AppError(
      UPLOAD_ERRORS.undecodable,
      `Images with ${raw.bitDepth}-bit samples are not supported; use 8 or 16 bits.`,
      422,
    )
  }
  return {
    width: raw.width,
    height: raw.height,
    data: raw.data as Uint8Array | Uint16Array,
    channels: raw.channels,
    bitDepth: raw.bitDepth,
  }
}

/** Copies a rectangle out of interleaved raw pixels (so a big frame never becomes floats whole). */
export function cropRaw(raw: RawImage, x: number, y: number, w: number, h: number): RawImage {
  const c = raw.channels
  const Ctor = raw.data instanceof Uint16Array ? Uint16Array : Uint8Array
  const out = new Ctor(w * h * c)
  for (let row = 0; row < h; row++) {
    const from = ((y + row) * raw.width + x) * c
    out.set(raw.data.subarray(from, from + w * c), row * w * c)
  }
  return { width: w, height: h, data: out, channels: c, bitDepth: raw.bitDepth }
}
