import { toGreyImage } from '../../../shared/analysis/image/luminance'
import type { RawImage } from '../../../shared/analysis/image/luminance'
import { parseTransfer } from '../../../shared/analysis/image/transfer'
import { measureEdge } from '../../../shared/analysis/mtf/measureEdge'
import type { EdgeOrientation, Roi } from '../../../shared/analysis/types'
import type { Remeasure } from '../../../shared/schemas/checks'
import { cropRaw } from './image'

/** A server MTF50 further than this from the device's (relative) is recorded as a disagreement. */
export const DISAGREEMENT_RATIO = 0.02

export interface DeviceMeasurement {
  id: string
  roiX: number
  roiY: number
  roiW: number
  roiH: number
  orientation: EdgeOrientation
  mtf50CyPx: number
}

/**
 * The one place the server calls the engine: the slanted-edge MTF50 (ISO 12233 e-SFR, the same
 * shared/analysis code the device ran) of one region of decoded pixels.
 */
export function measureRegionMtf50(
  raw: RawImage,
  roi: Roi,
  orientation: EdgeOrientation,
  encoding: string,
): number | null {
  const transfer = parseTransfer(encoding)
  const crop = cropRaw(raw, roi.x, roi.y, roi.w, roi.h)
  const grey = toGreyImage(crop, { transfer })
  const result = measureEdge(
    grey,
    { x: 0, y: 0, w: roi.w, h: roi.h },
    { orientation, encodingInfo: { transfer, bitDepth: raw.bitDepth } },
  )
  return result.mtf50
}

/** Compares the server's MTF50 of `roi` (in `raw`) with the device's value for the measurement. */
export function remeasure(
  raw: RawImage,
  roi: Roi,
  m: DeviceMeasurement,
  encoding: string,
): Remeasure {
  const base = { measurementId: m.id, deviceMtf50CyPx: m.mtf50CyPx }
  let server: number | null
  try {
    server = measureRegionMtf50(raw, roi, m.orientation, encoding)
  } catch (err) {
    if (!(err instanceof RangeError)) throw err
    return {
      ...base,
      serverMtf50CyPx: null,
      relativeDifference: null,
      disagreement: true,
      error: err.message,
    }
  }
  if (server === null) {
    return {
      ...base,
      serverMtf50CyPx: null,
      relativeDifference: null,
      disagreement: true,
      error: 'The MTF does not fall to 0.5 within 1 cycle/pixel in the uploaded region.',
    }
  }
  const relativeDifference =
    m.mtf50CyPx > 0 ? Math.abs(server - m.mtf50CyPx) / m.mtf50CyPx : server === 0 ? 0 : Infinity
  return {
    ...base,
    serverMtf50CyPx: server,
    relativeDifference: Number.isFinite(relativeDifference) ? relativeDifference : null,
    disagreement: !(relativeDifference <= DISAGREEMENT_RATIO),
  }
}
