// Frame-level helpers of the worker: luminance from decoded RGBA, region crops, preview size.
import { toGreyImage, type GreyImage, type Roi } from '@shared/analysis'

/** Linear luminance (Rec. 709 weights, inverse sRGB) of decoded 8-bit RGBA pixels. */
export function greyFromRgba(rgba: Uint8ClampedArray, width: number, height: number): GreyImage {
  return toGreyImage({ width, height, data: rgba, channels: 4, bitDepth: 8 })
}

/** The RGBA pixels of `roi` (inside a frame `width` px wide), row by row. */
export function cropRgba(
  rgba: Uint8ClampedArray<ArrayBuffer>,
  width: number,
  roi: Roi,
): Uint8ClampedArray<ArrayBuffer> {
  const height = rgba.length / 4 / width
  if (roi.x < 0 || roi.y < 0 || roi.x + roi.w > width || roi.y + roi.h > height) {
    throw new RangeError(
      `The region ${roi.x},${roi.y},${roi.w},${roi.h} does not lie inside the ${width} × ${height} frame.`,
    )
  }
  const out = new Uint8ClampedArray(roi.w * roi.h * 4)
  for (let r = 0; r < roi.h; r++) {
    const start = ((roi.y + r) * width + roi.x) * 4
    out.set(rgba.subarray(start, start + roi.w * 4), r * roi.w * 4)
  }
  return out
}

/** Longest side of the on-screen copy of a frame, px. */
export const PREVIEW_MAX_PX = 2048

/** Size of the on-screen copy: the frame scaled down (never up) to PREVIEW_MAX_PX. */
export function previewSize(
  width: number,
  height: number,
  maxPx = PREVIEW_MAX_PX,
): { width: number; height: number } {
  const scale = Math.min(1, maxPx / Math.max(width, height))
  return {
    width: Math.max(1, Math.round(width * scale)),
    height: Math.max(1, Math.round(height * scale)),
  }
}

/**
 * A region moved and cut to lie inside the frame with whole-pixel coordinates, or null when
 * nothing of it is left.
 */
export function clampRoi(roi: Roi, width: number, height: number): Roi | null {
  const x0 = Math.max(0, Math.round(roi.x))
  const y0 = Math.max(0, Math.round(roi.y))
  const x1 = Math.min(width, Math.round(roi.x + roi.w))
  const y1 = Math.min(height, Math.round(roi.y + roi.h))
  if (x1 <= x0 || y1 <= y0) return null
  return { x: x0, y: y0, w: x1 - x0, h: y1 - y0 }
}
