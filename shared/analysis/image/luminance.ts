import type { GreyImage, Transfer } from '../types'
import { linearisationTable } from './transfer'

/** Interleaved code values as decoders deliver them (grey, grey+alpha, RGB or RGBA). */
export interface RawImage {
  width: number
  height: number
  data: Uint8Array | Uint8ClampedArray | Uint16Array
  /** 1 grey, 2 grey + alpha, 3 RGB, 4 RGBA; alpha is ignored. */
  channels: number
  bitDepth: 8 | 16
}

/**
 * Luma weights for linear R, G, B. `rec709`: ITU-R BT.709 / sRGB primaries,
 * Y = 0.2126 R + 0.7152 G + 0.0722 B (the default). `rec601`: ITU-R BT.601,
 * Y = 0.299 R + 0.587 G + 0.114 B.
 */
export const LUMA_WEIGHTS = {
  rec709: [0.2126, 0.7152, 0.0722],
  rec601: [0.299, 0.587, 0.114],
} as const

export type LumaWeights = keyof typeof LUMA_WEIGHTS

export interface LuminanceOptions {
  /** @default 'rec709' */
  weights?: LumaWeights
  /** @default { kind: 'srgb' } */
  transfer?: Transfer
  /**
   * Caller-owned output of width × height samples, reused between frames of one size: a fresh
   * frame-sized array costs more in page faults than the conversion itself.
   */
  out?: Float32Array
}

/**
 * Linear luminance of a decoded frame: each channel is linearised through a look-up table
 * (`transfer`), then R, G, B are weighted in linear light (`weights`). Output values are 0..1.
 */
export function toGreyImage(raw: RawImage, options: LuminanceOptions = {}): GreyImage {
  const { weights = 'rec709', transfer = { kind: 'srgb' } } = options
  const { width, height, data, channels, bitDepth } = raw
  if (!Number.isInteger(width) || !Number.isInteger(height) || width < 1 || height < 1) {
    throw new RangeError(
      `The image must have positive integer width and height (got ${width} × ${height}).`,
    )
  }
  if (channels !== 1 && channels !== 2 && channels !== 3 && channels !== 4) {
    throw new RangeError(`The image must have 1 to 4 channels (got ${channels}).`)
  }
  const pixels = width * height
  if (!data || data.length !== pixels * channels) {
    throw new RangeError(
      `The image data holds ${data?.length} values, but ${width} × ${height} × ${channels} needs ${pixels * channels}.`,
    )
  }
  const w = LUMA_WEIGHTS[weights]
  if (!w) throw new RangeError(`Unknown luma weights "${String(weights)}": use rec709 or rec601.`)
  const lut = linearisationTable(transfer, bitDepth)
  if (options.out && options.out.length !== pixels) {
    throw new RangeError(
      `The output buffer holds ${options.out.length} samples, but the image needs ${pixels}.`,
    )
  }
  const out = options.out ?? new Float32Array(pixels)
  if (channels <= 2) {
    for (let i = 0, j = 0; i < pixels; i++, j += channels) out[i] = lut[data[j]]
  } else {
    const wr = w[0]
    const wg = w[1]
    const wb = w[2]
    for (let i = 0, j = 0; i < pixels; i++, j += channels) {
      out[i] = wr * lut[data[j]] + wg * lut[data[j + 1]] + wb * lut[data[j + 2]]
    }
  }
  return { width, height, data: out }
}
