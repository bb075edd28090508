// Everything the result screen shows, from the measured regions and what the device knows about
// the camera: the verdict (shared/analysis/verdict), pixel density and IEC 62676-4 level,
// baseline and day/night comparisons, and a refocus hint for a defocus-disk kernel.
import {
  effectivePixelDensity,
  evaluateVerdict,
  focusErrorFromDiskRadius,
  iecLevelsFor,
  median,
  motionBlurHint,
  TASK_DEFAULTS,
  type EffectiveDensity,
  type FocusError,
  type IecLevel,
  type MotionBlurHint,
  type PsfEstimate,
  type TaskId,
  type Verdict,
  type VerdictReason,
  type VerdictThresholds,
} from '@shared/analysis'
import type { Camera } from '@shared/schemas/cameras'
import type { CameraModel, Task } from '@shared/schemas/catalog'
import type { CheckMode } from '@shared/schemas/enums'
import type { PixelDensityRecord } from '@/db/checks'
import { isValidRegion, representativeRegion, verdictEdges, type RegionState } from './regionRules'
import { densityFromLens, densityFromScale, type ScaleMeasure } from './density'

/** What the device knows about the camera when the check is judged. */
export interface CheckContext {
  camera: Camera
  task: Task | null
  model: CameraModel | null
  /** The commissioning baseline's MTF50, c/p. */
  baselineMtf50CyPx: number | null
  /** Latest MTF50 of the other mode (day for a night check, night for a day check). */
  otherModeMtf50CyPx: number | null
}

export interface DensityReport extends PixelDensityRecord {
  iec2014: IecLevel | null
  draft2025: IecLevel | null
  /** Blur-adjusted density: an estimate of our own, not a standard quantity. */
  effective: EffectiveDensity | null
}

export interface RefocusReport {
  radiusPx: number
  targetDistanceM: number
  focus: FocusError
}

export interface CheckReport {
  verdict: Verdict
  medianMtf50CyPx: number | null
  validCount: number
  representativeId: string | null
  density: DensityReport | null
  baselineRatio: number | null
  dayNight: { dayMtf50CyPx: number; nightMtf50CyPx: number; ratio: number } | null
  refocus: RefocusReport | null
  /** Why no refocus distances are given (when there is a kernel but no hint). */
  refocusNote: string | null
  haze: VerdictReason | null
  motion: MotionBlurHint
}

/** Engine task id of a server task id (`plate_reading` → `plate-reading`), if it has one. */
export function engineTask(taskId: string): TaskId | undefined {
  const id = taskId.replace(/_/g, '-')
  return id in TASK_DEFAULTS ? (id as TaskId) : undefined
}

/** The camera's effective thresholds (per-camera overrides already applied by the server). */
export function thresholdsOf(ctx: CheckContext): Partial<VerdictThresholds> {
  const t = ctx.task
  return {
    minMtf50CyPx: ctx.camera.minMtf50CyPx,
    minPixelDensityPxPerM: ctx.camera.requiredPxPerM,
    ...(t
      ? {
          marginalBand: t.marginalBand,
          driftMarginalRatio: t.driftWarnRatio,
          driftFailRatio: t.driftFailRatio,
          nightDayRatio: t.nightDayWarnRatio,
        }
      : {}),
  }
}

export function medianOf(values: number[]): number | null {
  return values.length ? median(values) : null
}

/** Refocus distances for a defocus-disk kernel, or why there are none. */
export function refocusFor(
  psf: PsfEstimate | null,
  ctx: Pick<CheckContext, 'camera' | 'model'>,
): { refocus: RefocusReport | null; note: string | null } {
  if (!psf) return { refocus: null, note: null }
  if (psf.model !== 'disk' || !psf.radiusPx) {
    return {
      refocus: null,
      note: 'The kernel fits a Gaussian better than a defocus disk, so no refocus distance is worked out; a Gaussian blur also comes from lens quality, processing or vibration.',
    }
  }
  const { camera, model } = ctx
  if (!model || camera.focalLengthMm === null || camera.targetDistanceM === null) {
    return {
      refocus: null,
      note: 'Refocus distances need the focal length, f-number, pixel pitch and target distance of this camera; some are not on the device.',
    }
  }
  try {
    const focus = focusErrorFromDiskRadius({
      radiusPx: psf.radiusPx,
      pixelPitchUm: model.pixelPitchUm,
      focalLengthMm: camera.focalLengthMm,
      fNumber: model.fNumber,
      targetDistanceM: camera.targetDistanceM,
    })
    return {
      refocus: { radiusPx: psf.radiusPx, targetDistanceM: camera.targetDistanceM, focus },
      note: null,
    }
  } catch (e) {
    return { refocus: null, note: (e as Error).message }
  }
}

/** IEC 62676-4 levels and the blur-adjusted estimate for a pixel density. */
export function densityReportOf(
  record: PixelDensityRecord,
  medianMtf50CyPx: number | null,
): DensityReport {
  const { iec2014, draft2025 } = iecLevelsFor(record.pxPerM)
  return {
    ...record,
    iec2014,
    draft2025,
    effective:
      medianMtf50CyPx !== null
        ? effectivePixelDensity({ pxPerM: record.pxPerM, mtf50CyPx: medianMtf50CyPx })
        : null,
  }
}

export function buildReport(
  regions: readonly RegionState[],
  mode: CheckMode,
  ctx: CheckContext,
  scale: ScaleMeasure | null,
): CheckReport {
  const valid = regions.filter((r) => r.enabled && isValidRegion(r))
  const medianMtf50CyPx = medianOf(valid.map((r) => r.measurement!.mtf50 as number))
  const densityRecord = densityFromScale(scale) ?? densityFromLens(ctx.camera, ctx.model)
  const other = ctx.otherModeMtf50CyPx
  const verdict = evaluateVerdict(
    {
      edges: verdictEdges(regions),
      baselineMtf50CyPx: ctx.baselineMtf50CyPx,
      pixelDensityPxPerM: densityRecord?.pxPerM ?? null,
      mode,
      dayMtf50CyPx: mode === 'night' ? other : null,
    },
    { task: engineTask(ctx.camera.taskId), thresholds: thresholdsOf(ctx) },
  )
  const rep = representativeRegion(regions)
  const { refocus, note } = refocusFor(rep?.measurement?.psf ?? null, ctx)
  let dayNight: CheckReport['dayNight'] = null
  if (medianMtf50CyPx !== null && other !== null && other > 0) {
    const day = mode === 'day' ? medianMtf50CyPx : other
    const night = mode === 'night' ? medianMtf50CyPx : other
    dayNight = { dayMtf50CyPx: day, nightMtf50CyPx: night, ratio: night / day }
  }
  const density = densityRecord ? densityReportOf(densityRecord, medianMtf50CyPx) : null
  return {
    verdict,
    medianMtf50CyPx,
    validCount: valid.length,
    representativeId: rep?.id ?? null,
    density,
    baselineRatio:
      medianMtf50CyPx !== null && ctx.baselineMtf50CyPx
        ? medianMtf50CyPx / ctx.baselineMtf50CyPx
        : null,
    dayNight,
    refocus,
    refocusNote: note,
    haze: verdict.reasons.find((r) => r.code === 'haze') ?? null,
    motion: motionBlurHint(
      valid.map((r) => ({ orientation: r.measurement!.orientation, mtf50: r.measurement!.mtf50 })),
    ),
  }
}
