// The first check of an imported file, from its header alone (nothing is decoded yet): is it a
// PNG or JPEG, and is it small enough to analyse on a phone?
import { assertFrameSize, readImageHeader, type ImageHeader } from '@shared/analysis'

/** Largest frame the app analyses: 24 megapixels. */
export const MAX_IMPORT_PIXELS = 24_000_000

/** Largest file the app reads, bytes (a 24 MP JPEG is far smaller). */
export const MAX_IMPORT_BYTES = 80 * 1024 * 1024

/** Bytes of the file's start that hold the header (JPEG EXIF blocks can be long). */
export const HEADER_BYTES = 256 * 1024

/** A file the app cannot take, with what to do about it. */
export class FrameImportError extends Error {
  constructor(
    readonly code: 'unsupported' | 'unreadable' | 'too-large' | 'empty',
    message: string,
  ) {
    super(message)
    this.name = 'FrameImportError'
  }
}

/** Header of an importable frame; throws a FrameImportError that says what to do. */
export function checkFrameHeader(bytes: Uint8Array): ImageHeader {
  if (bytes.length === 0) {
    throw new FrameImportError(
      'empty',
      'The file is empty. Choose the image again or take a photo.',
    )
  }
  let header: ImageHeader
  try {
    header = readImageHeader(bytes)
  } catch (error) {
    if (error instanceof TypeError) {
      throw new FrameImportError(
        'unsupported',
        'This file is not a PNG or JPEG image. Export the frame as PNG or JPEG, or take a photo.',
      )
    }
    throw new FrameImportError(
      'unreadable',
      `The image header cannot be read (${(error as Error).message}) The file may be damaged: export it again.`,
    )
  }
  try {
    assertFrameSize(header, MAX_IMPORT_PIXELS)
  } catch {
    const mp = ((header.width * header.height) / 1e6).toFixed(1)
    throw new FrameImportError(
      'too-large',
      `The image is ${header.width} × ${header.height} px (${mp} MP); the limit is ${MAX_IMPORT_PIXELS / 1e6} MP. Export a smaller snapshot or crop it around the target.`,
    )
  }
  return header
}
