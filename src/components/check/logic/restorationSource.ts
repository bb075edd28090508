// Where the restoration preview of a saved check gets its pixels: the PNG crop of the
// representative region kept on the device (lossless, the same pixels the analysis used), or
// the original frame when that crop is missing. A check made on another device has neither
// (a supervisor's screen fetches the region crop the inspector uploaded instead: `upload`).
import type { PsfModel, Roi } from '@shared/analysis'
import type { CheckBundle } from '@/db/checkRecords'
import type { RestorationRequest } from '@/workers/types'

/**
 * What a restoration needs of a measured edge: the fitted kernel and the flat-area noise. Both
 * the engine's EdgeMeasurement and a measurement read back from the server have this shape.
 */
export interface RestorationKernel {
  psf: { model: PsfModel; sigmaPx?: number | null; radiusPx?: number | null }
  noise: number | null
}

/** The worker request for one measured edge: its kernel and noise, the given pixels. */
export function restorationRequestOf(
  m: RestorationKernel,
  roi: Roi,
  method: RestorationRequest['method'],
): RestorationRequest {
  return {
    roi: { x: roi.x, y: roi.y, w: roi.w, h: roi.h },
    model: m.psf.model,
    sizePx: (m.psf.model === 'gaussian' ? m.psf.sigmaPx : m.psf.radiusPx) ?? 1,
    method,
    noiseSigma: m.noise !== null && m.noise > 0 ? m.noise : undefined,
  }
}

export type RestorationSource =
  | {
      available: true
      from: 'crop' | 'frame' | 'upload'
      /** The image to load into the worker, or how to fetch it (asked once, when first needed). */
      image: Blob | (() => Promise<Blob>)
      measurement: RestorationKernel
      /** The region within `image`. */
      roi: Roi
    }
  | { available: false; reason: string }

export const NO_PIXELS_REASON =
  'The restoration preview is not available: the pixels of this check’s regions are not kept on this device.'

export function restorationSourceOf(bundle: CheckBundle): RestorationSource {
  const rep = bundle.measurements.find(
    (m) => m.id === bundle.check.representativeId && m.enabled && m.valid,
  )
  if (!rep) {
    return { available: false, reason: 'This check has no measured edge to restore.' }
  }
  const crop = bundle.crops.find((c) => c.id === rep.id && c.blob.size > 0)
  if (crop) {
    return {
      available: true,
      from: 'crop',
      image: crop.blob,
      measurement: rep.measurement,
      roi: { x: 0, y: 0, w: crop.width, h: crop.height },
    }
  }
  if (bundle.frame && bundle.frame.blob.size > 0) {
    return {
      available: true,
      from: 'frame',
      image: bundle.frame.blob,
      measurement: rep.measurement,
      roi: rep.measurement.roi,
    }
  }
  return { available: false, reason: NO_PIXELS_REASON }
}
