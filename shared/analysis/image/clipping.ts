import type { EncodingInfo, GreyImage, Roi } from '../types'
import { decodeTransfer } from './transfer'
import { assertGreyImage, assertRoiInside } from './validate'

/** Linear-light thresholds below/above which a pixel counts as clipped. */
export interface ClipThresholds {
  low: number
  high: number
}

/**
 * Clipping thresholds half a code value inside the extremes: a pixel at code 0 or at the
 * maximum code (all channels) is clipped. Defaults to 8-bit sRGB.
 */
export function clipThresholds(
  encoding: EncodingInfo = { transfer: { kind: 'srgb' }, bitDepth: 8 },
): ClipThresholds {
  const maxCode = encoding.bitDepth === 16 ? 65535 : 255
  return {
    low: decodeTransfer(0.5 / maxCode, encoding.transfer),
    high: decodeTransfer((maxCode - 0.5) / maxCode, encoding.transfer),
  }
}

/**
 * Fraction of the pixels of `roi` (default: the whole image) at the code-value extremes.
 * Limitation: it sees luminance only, so a single clipped colour channel is not counted.
 */
export function clippedFraction(
  image: GreyImage,
  roi: Roi = { x: 0, y: 0, w: image.width, h: image.height },
  thresholds: ClipThresholds = clipThresholds(),
): number {
  assertGreyImage(image)
  assertRoiInside(roi, image.width, image.height)
  const { low, high } = thresholds
  const { data, width } = image
  let clipped = 0
  for (let r = roi.y; r < roi.y + roi.h; r++) {
    const end = r * width + roi.x + roi.w
    for (let i = r * width + roi.x; i < end; i++) {
      const v = data[i]
      if (v <= low || v >= high) clipped++
    }
  }
  return clipped / (roi.w * roi.h)
}
