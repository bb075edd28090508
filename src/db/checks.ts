// Checks made on this device, in IndexedDB: the check, its measured regions, the original frame
// (kept here; uploaded only when the inspector agrees) and a PNG crop of each measured region
// (uploaded after the check is accepted, for the server's re-check). Also the server's history
// of each camera and the camera models, cached for offline use.
import type { EdgeMeasurement, VerdictReason, VerdictThresholds } from '@shared/analysis'
import type { CameraModel } from '@shared/schemas/catalog'
import type { CheckMode, Verdict } from '@shared/schemas/enums'
import type { HistoryCheck } from '@shared/schemas/fleet'
import type { EdgeProfile } from '@/workers/types'

/** Dexie stores added by the checks feature (database version 2). */
export const CHECK_STORES = {
  checks: 'id, cameraId, capturedAt, [cameraId+capturedAt]',
  measurements: 'id, checkId',
  frames: 'checkId',
  crops: 'id, checkId',
  cameraHistory: 'cameraId',
  cameraModels: 'id',
} as const

export interface PixelDensityRecord {
  pxPerM: number
  /** `target`: a feature of known printed size measured in the frame; `lens`: F / (pitch · d). */
  source: 'target' | 'lens'
  /** How it was obtained, in words (e.g. "412 px over 120 mm on the target"). */
  detail: string
}

export interface CheckRecord {
  /** Client UUID (crypto.randomUUID), also the server's id. */
  id: string
  cameraId: number
  userId: number
  roundId: number | null
  capturedAt: string
  savedAt: string
  mode: CheckMode
  verdict: Verdict
  reasons: VerdictReason[]
  thresholds: VerdictThresholds
  medianMtf50CyPx: number | null
  pixelDensity: PixelDensityRecord | null
  baselineMtf50CyPx: number | null
  baselineRatio: number | null
  /** Latest MTF50 of the other mode when the check was made (day against night). */
  otherModeMtf50CyPx: number | null
  targetId: string | null
  targetWidthMm: number | null
  notes: string | null
  exposureNote: string | null
  lensNote: string | null
  /** The inspector agreed to upload the full frame. */
  shareFrame: boolean
  /** Marked as the camera's baseline on this device (queued for the server). */
  isBaseline: boolean
  frame: {
    name: string
    mime: string
    bytes: number
    width: number
    height: number
    orientation: number
  }
  /** The edge whose kernel the report shows. */
  representativeId: string | null
}

export interface MeasurementRecord {
  id: string
  checkId: string
  /** Position in the editor's list (1-based numbers are shown). */
  index: number
  source: 'found' | 'manual'
  enabled: boolean
  valid: boolean
  measurement: EdgeMeasurement
  profile: EdgeProfile | null
}

export interface FrameRecord {
  checkId: string
  blob: Blob
  mime: string
  width: number
  height: number
  /** Upload the full frame too (people or plates may be in it). */
  share: boolean
}

/** A measured region's original pixels, for the upload queue (`kind: 'roi'`). */
export interface CropRecord {
  /** The measurement's id. */
  id: string
  checkId: string
  kind: 'roi'
  blob: Blob
  mime: 'image/png'
  width: number
  height: number
  /** How the code values map to light (the upload's `encoding` field). */
  encoding: 'srgb'
}

/** The server's checks of one camera, as last fetched. */
export interface CameraHistoryRecord {
  cameraId: number
  fetchedAt: string
  baseline: { checkId: string; mtf50CyPx: number | null } | null
  checks: HistoryCheck[]
}

export type CameraModelRecord = CameraModel
