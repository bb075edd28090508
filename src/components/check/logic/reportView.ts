// One shape for the result screen, whether the check is in progress or saved.
import {
  motionBlurHint,
  type EdgeMeasurement,
  type MotionBlurHint,
  type VerdictReason,
  type VerdictThresholds,
  type VerdictValue,
} from '@shared/analysis'
import type { CheckRecord, MeasurementRecord } from '@/db/checks'
import type { EdgeProfile } from '@/workers/types'
import type { MtfCurve } from '../charts/options'
import { isValidRegion, type RegionState } from './regionRules'
import {
  densityReportOf,
  refocusFor,
  type CheckContext,
  type CheckReport,
  type DensityReport,
  type RefocusReport,
} from './report'

export interface ReportView {
  verdict: VerdictValue
  reasons: VerdictReason[]
  thresholds: VerdictThresholds
  medianMtf50CyPx: number | null
  validCount: number
  curves: MtfCurve[]
  representative: {
    label: string
    measurement: EdgeMeasurement
    profile: EdgeProfile | null
  } | null
  density: DensityReport | null
  baselineMtf50CyPx: number | null
  baselineRatio: number | null
  baselineRecorded: boolean
  dayNight: CheckReport['dayNight']
  refocus: RefocusReport | null
  refocusNote: string | null
  haze: VerdictReason | null
  motion: MotionBlurHint
}

interface UsedEdge {
  id: string
  number: number
  measurement: EdgeMeasurement
  profile: EdgeProfile | null
}

const edgeLabel = (e: UsedEdge) =>
  `edge ${e.number}, ${e.measurement.orientation}, ${Math.abs(e.measurement.angleDeg).toFixed(1)}°`

function curvesOf(used: UsedEdge[], repId: string | null): MtfCurve[] {
  return used.map((e) => ({
    label: `Edge ${e.number}`,
    points: e.measurement.mtf,
    emphasis: e.id === repId,
  }))
}

function representativeOf(used: UsedEdge[], repId: string | null): ReportView['representative'] {
  const rep = used.find((e) => e.id === repId)
  return rep ? { label: edgeLabel(rep), measurement: rep.measurement, profile: rep.profile } : null
}

export function liveReportView(
  report: CheckReport,
  regions: readonly RegionState[],
  baselineRecorded: boolean,
): ReportView {
  const used: UsedEdge[] = []
  regions.forEach((r, i) => {
    if (r.enabled && isValidRegion(r)) {
      used.push({ id: r.id, number: i + 1, measurement: r.measurement!, profile: r.profile })
    }
  })
  return {
    verdict: report.verdict.verdict,
    reasons: report.verdict.reasons,
    thresholds: report.verdict.thresholds,
    medianMtf50CyPx: report.medianMtf50CyPx,
    validCount: report.validCount,
    curves: curvesOf(used, report.representativeId),
    representative: representativeOf(used, report.representativeId),
    density: report.density,
    baselineMtf50CyPx:
      report.baselineRatio && report.medianMtf50CyPx
        ? report.medianMtf50CyPx / report.baselineRatio
        : null,
    baselineRatio: report.baselineRatio,
    baselineRecorded,
    dayNight: report.dayNight,
    refocus: report.refocus,
    refocusNote: report.refocusNote,
    haze: report.haze,
    motion: report.motion,
  }
}

/** A saved check; `ctx` (camera, model) adds the refocus hint when the device has them. */
export function savedReportView(
  check: CheckRecord,
  measurements: readonly MeasurementRecord[],
  ctx: Pick<CheckContext, 'camera' | 'model'> | null,
): ReportView {
  const used: UsedEdge[] = measurements
    .filter((m) => m.enabled && m.valid)
    .map((m) => ({ id: m.id, number: m.index, measurement: m.measurement, profile: m.profile }))
  const rep = used.find((e) => e.id === check.representativeId) ?? null
  const advice = ctx ? refocusFor(rep?.measurement.psf ?? null, ctx) : { refocus: null, note: null }
  const other = check.otherModeMtf50CyPx
  const median = check.medianMtf50CyPx
  const dayNight =
    median !== null && other !== null && other > 0
      ? check.mode === 'day'
        ? { dayMtf50CyPx: median, nightMtf50CyPx: other, ratio: other / median }
        : { dayMtf50CyPx: other, nightMtf50CyPx: median, ratio: median / other }
      : null
  return {
    verdict: check.verdict,
    reasons: check.reasons,
    thresholds: check.thresholds,
    medianMtf50CyPx: median,
    validCount: used.length,
    curves: curvesOf(used, check.representativeId),
    representative: representativeOf(used, check.representativeId),
    density: check.pixelDensity ? densityReportOf(check.pixelDensity, median) : null,
    baselineMtf50CyPx: check.baselineMtf50CyPx,
    baselineRatio: check.baselineRatio,
    baselineRecorded: check.baselineMtf50CyPx !== null || !!ctx?.camera.baselineCheckId,
    dayNight,
    refocus: advice.refocus,
    refocusNote: advice.note,
    haze: check.reasons.find((r) => r.code === 'haze') ?? null,
    motion: motionBlurHint(used.map((e) => e.measurement)),
  }
}
