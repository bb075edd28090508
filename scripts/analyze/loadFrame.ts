import { readFile, stat } from 'node:fs/promises'
import { decode } from 'image-js'
import { assertFrameSize, readImageHeader } from '../../shared/analysis/image/header'
import { toGreyImage } from '../../shared/analysis/image/luminance'
import type { EncodingInfo, GreyImage, Transfer } from '../../shared/analysis/types'

export interface LoadedFrame {
  image: GreyImage
  encodingInfo: EncodingInfo
}

/**
 * Reads a PNG (8/16-bit) or JPEG file, refuses files over 1 GiB and frames whose header claims
 * more than 100 MP before decoding, decodes it with image-js and converts it to linear luminance (Rec. 709).
 */
/** Largest file read at all (a 100 MP frame compresses well below this). */
export const MAX_FILE_BYTES = 1 << 30

export async function loadFrame(path: string, transfer: Transfer): Promise<LoadedFrame> {
  const info = await stat(path)
  if (info.isDirectory()) throw new TypeError('is a directory, not an image file.')
  if (info.size > MAX_FILE_BYTES) {
    throw new RangeError(
      `The file is ${(info.size / 2 ** 30).toFixed(1)} GiB, larger than the 1 GiB limit.`,
    )
  }
  const bytes = new Uint8Array(await readFile(path))
  const header = readImageHeader(bytes)
  assertFrameSize(header)
  let decoded
  try {
    decoded = decode(bytes)
  } catch (error) {
    const reason = error instanceof Error ? error.message : String(error)
    throw new RangeError(`The ${header.format.toUpperCase()} data cannot be decoded (${reason}).`)
  }
  const raw = decoded.getRawImage()
  const bitDepth = raw.bitDepth === 16 ? 16 : 8
  if (raw.bitDepth !== 8 && raw.bitDepth !== 16) {
    throw new RangeError(
      `Unsupported bit depth ${raw.bitDepth}: only 8- and 16-bit images are analysed.`,
    )
  }
  const image = toGreyImage(
    {
      width: raw.width,
      height: raw.height,
      data: raw.data as Uint8Array | Uint16Array,
      channels: raw.channels,
      bitDepth,
    },
    { transfer },
  )
  return { image, encodingInfo: { transfer, bitDepth } }
}
