import { hazeEvidence } from './haze'
import { median } from './median'
import { densityReason, driftReason, hazeReason, nightReason, sharpnessReason } from './rules'
import { TASK_DEFAULTS, thresholdsFor } from './tasks'
import type {
  TaskId,
  Verdict,
  VerdictInput,
  VerdictReason,
  VerdictThresholds,
  VerdictValue,
} from './types'

export interface VerdictOptions {
  /** The camera's task; supplies the px/m and MTF50 minimums (TASK_DEFAULTS). */
  task?: TaskId
  /** Per-task or per-camera overrides of any threshold (COMMON_THRESHOLDS for the rest). */
  thresholds?: Partial<VerdictThresholds>
}

/**
 * DESIGN.md's verdict: sharpness (median MTF50 of the valid edges against the task minimum),
 * drift against the baseline, pixel density, day/night comparison and haze, each as a reason in
 * plain words with its numbers. The verdict is `fail` if any reason fails; otherwise
 * `inconclusive` when no edge could be measured; otherwise `marginal` if any reason is marginal;
 * otherwise `pass`. A task or thresholds.minMtf50CyPx and minPixelDensityPxPerM are required.
 */
export function evaluateVerdict(input: VerdictInput, options: VerdictOptions = {}): Verdict {
  if (input === null || typeof input !== 'object' || !Array.isArray(input.edges)) {
    throw new TypeError('The verdict needs an input with an edges array.')
  }
  const t = thresholdsFor(options.task, options.thresholds)
  const taskLabel = options.task ? ` for ${TASK_DEFAULTS[options.task].label.toLowerCase()}` : ''
  const reasons: VerdictReason[] = []
  const valid = input.edges.filter(
    (e) => e.valid && typeof e.mtf50CyPx === 'number' && Number.isFinite(e.mtf50CyPx),
  )
  const rejected = input.edges.length - valid.length
  if (rejected > 0) reasons.push(rejectedReason(input, rejected, valid.length))

  if (valid.length > 0) {
    const mtf50 = median(valid.map((e) => e.mtf50CyPx as number))
    const haze = hazeEvidence(valid, t.hazeProbeCyPx)
    const hazeFound = haze ? hazeReason(haze, t) : null
    reasons.push(sharpnessReason(mtf50, valid.length, t, taskLabel, hazeFound !== null))
    if (isPositive(input.baselineMtf50CyPx))
      reasons.push(driftReason(mtf50, input.baselineMtf50CyPx, t))
    if (input.mode === 'night' && isPositive(input.dayMtf50CyPx))
      reasons.push(nightReason(mtf50, input.dayMtf50CyPx, t))
    if (hazeFound) reasons.push(hazeFound)
  }
  if (typeof input.pixelDensityPxPerM === 'number' && Number.isFinite(input.pixelDensityPxPerM)) {
    reasons.push(densityReason(input.pixelDensityPxPerM, t, taskLabel))
  }
  return { verdict: combine(reasons, valid.length), reasons, thresholds: t }
}

function combine(reasons: readonly VerdictReason[], validEdges: number): VerdictValue {
  if (reasons.some((r) => r.severity === 'fail')) return 'fail'
  if (validEdges === 0) return 'inconclusive'
  if (reasons.some((r) => r.severity === 'marginal')) return 'marginal'
  return 'pass'
}

function rejectedReason(input: VerdictInput, rejected: number, validCount: number): VerdictReason {
  const warnings = [
    ...new Set(
      input.edges.filter((e) => !e.valid || e.mtf50CyPx == null).flatMap((e) => e.warnings ?? []),
    ),
  ]
  const why = warnings.length ? ` (${warnings.join('; ')})` : ''
  if (validCount === 0) {
    return {
      code: 'no-valid-edge',
      severity: 'info',
      values: { regions: input.edges.length },
      message:
        input.edges.length === 0
          ? 'No edge was found, so sharpness could not be judged. Show the camera the target and capture again.'
          : `None of the ${input.edges.length} edge regions could be measured${why}, so sharpness could not be judged. Reposition the target and capture again.`,
    }
  }
  return {
    code: 'edges-rejected',
    severity: 'info',
    values: { rejected, used: validCount },
    message: `${rejected} of ${input.edges.length} edge regions were not used${why}.`,
  }
}

function isPositive(v: number | null | undefined): v is number {
  return typeof v === 'number' && Number.isFinite(v) && v > 0
}
