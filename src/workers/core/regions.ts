// Finding and measuring edge regions, one region at a time so a bad one fails alone.
import { findEdges, measureEdge, type GreyImage } from '@shared/analysis'
import type { FoundRegion, ProgressFn, RegionOutcome, RegionRequest } from '../types'
import { clampRoi } from './frame'
import { edgeProfile } from './profile'

export function findRegions(image: GreyImage, onProgress?: ProgressFn): FoundRegion[] {
  onProgress?.(0, 'edges')
  const found = findEdges(image).map((e) => ({
    roi: e.roi,
    orientation: e.orientation,
    angleDeg: e.angleDeg,
    contrast: e.contrast,
  }))
  onProgress?.(1, 'edges')
  return found
}

/** Measures each region; errors become outcomes with the engine's message in plain words. */
export function measureRegions(
  image: GreyImage,
  requests: RegionRequest[],
  onProgress?: ProgressFn,
): RegionOutcome[] {
  const out: RegionOutcome[] = []
  requests.forEach((req, i) => {
    const roi = clampRoi(req.roi, image.width, image.height)
    if (!roi) {
      out.push({ id: req.id, roi: req.roi, ok: false, error: 'The region lies outside the frame.' })
    } else {
      try {
        const measurement = measureEdge(image, roi, { orientation: req.orientation })
        out.push({
          id: req.id,
          roi,
          ok: true,
          measurement,
          profile: edgeProfile(image, measurement),
        })
      } catch (error) {
        if (!(error instanceof RangeError || error instanceof TypeError)) throw error
        out.push({ id: req.id, roi, ok: false, error: error.message })
      }
    }
    onProgress?.((i + 1) / requests.length, 'measure')
  })
  return out
}
