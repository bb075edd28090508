import type { TaskId, VerdictThresholds } from './types'

export interface TaskDefaults {
  id: TaskId
  label: string
  minPixelDensityPxPerM: number
  pixelDensitySource: string
  minMtf50CyPx: number
  mtf50Source: string
}

const IEC = 'IEC 62676-4:2014 [std]'
const MTF_RULE =
  '[ours], placed on the common-practice rule of thumb for JPEG snapshots (sharp 0.25–0.35, soft 0.15–0.20, clearly defocused < 0.12 c/p) [practice]'

/**
 * Default thresholds per task. Pixel densities of the six surveillance tasks are the
 * IEC 62676-4:2014 levels; the rest and every MTF50 minimum are our own starting values.
 * A supervisor may change each per task and per camera.
 */
export const TASK_DEFAULTS: Readonly<Record<TaskId, TaskDefaults>> = {
  monitor: {
    id: 'monitor',
    label: 'Monitor',
    minPixelDensityPxPerM: 12.5,
    pixelDensitySource: IEC,
    minMtf50CyPx: 0.12,
    mtf50Source: MTF_RULE,
  },
  detect: {
    id: 'detect',
    label: 'Detect',
    minPixelDensityPxPerM: 25,
    pixelDensitySource: IEC,
    minMtf50CyPx: 0.12,
    mtf50Source: MTF_RULE,
  },
  observe: {
    id: 'observe',
    label: 'Observe',
    minPixelDensityPxPerM: 62.5,
    pixelDensitySource: IEC,
    minMtf50CyPx: 0.15,
    mtf50Source: MTF_RULE,
  },
  recognise: {
    id: 'recognise',
    label: 'Recognise',
    minPixelDensityPxPerM: 125,
    pixelDensitySource: IEC,
    minMtf50CyPx: 0.18,
    mtf50Source: MTF_RULE,
  },
  identify: {
    id: 'identify',
    label: 'Identify',
    minPixelDensityPxPerM: 250,
    pixelDensitySource: IEC,
    minMtf50CyPx: 0.2,
    mtf50Source: MTF_RULE,
  },
  inspect: {
    id: 'inspect',
    label: 'Inspect',
    minPixelDensityPxPerM: 1000,
    pixelDensitySource: IEC,
    minMtf50CyPx: 0.25,
    mtf50Source: MTF_RULE,
  },
  'plate-reading': {
    id: 'plate-reading',
    label: 'Plate reading',
    minPixelDensityPxPerM: 250,
    pixelDensitySource:
      '[ours]: the identify level; characters about 75 mm tall [memory] then span ≈ 19 px, above the ≈ 15 px vendor figure [practice]',
    minMtf50CyPx: 0.25,
    mtf50Source: MTF_RULE,
  },
  'process-inspection': {
    id: 'process-inspection',
    label: 'Process inspection',
    minPixelDensityPxPerM: 1000,
    pixelDensitySource: '[ours]: the inspect level; set it from the smallest defect to be seen',
    minMtf50CyPx: 0.25,
    mtf50Source: MTF_RULE,
  },
}

/** Thresholds that do not depend on the task (DESIGN.md starting values; haze rule [ours]). */
export const COMMON_THRESHOLDS: Omit<VerdictThresholds, 'minMtf50CyPx' | 'minPixelDensityPxPerM'> =
  {
    marginalBand: 0.1,
    driftMarginalRatio: 0.8,
    driftFailRatio: 0.6,
    nightDayRatio: 0.8,
    hazeProbeCyPx: 0.05,
    hazeMaxLowFrequencyMtf: 0.9,
    hazeRatio: 0.85,
  }

/** Thresholds for a task, with overrides (per camera) applied on top. */
export function thresholdsFor(
  task: TaskId | undefined,
  overrides: Partial<VerdictThresholds> = {},
): VerdictThresholds {
  let base: Partial<VerdictThresholds> = {}
  if (task !== undefined) {
    const t = TASK_DEFAULTS[task]
    if (!t) {
      throw new TypeError(
        `Unknown task ${JSON.stringify(task)}: use one of ${Object.keys(TASK_DEFAULTS).join(', ')}.`,
      )
    }
    base = { minMtf50CyPx: t.minMtf50CyPx, minPixelDensityPxPerM: t.minPixelDensityPxPerM }
  }
  const merged = {
    ...COMMON_THRESHOLDS,
    ...base,
    ...stripUndefined(overrides),
  } as VerdictThresholds
  for (const key of ['minMtf50CyPx', 'minPixelDensityPxPerM'] as const) {
    if (merged[key] === undefined) {
      throw new TypeError(
        `Give a task or thresholds.${key}: the verdict needs a minimum to compare with.`,
      )
    }
  }
  for (const [key, value] of Object.entries(merged)) {
    if (typeof value !== 'number' || !Number.isFinite(value) || value < 0) {
      throw new RangeError(`Threshold ${key} must be a finite number ≥ 0 (got ${String(value)}).`)
    }
  }
  if (merged.driftFailRatio > merged.driftMarginalRatio) {
    throw new RangeError(
      `Threshold driftFailRatio (${merged.driftFailRatio}) must not exceed driftMarginalRatio (${merged.driftMarginalRatio}).`,
    )
  }
  return merged
}

function stripUndefined<T extends object>(o: T): Partial<T> {
  return Object.fromEntries(Object.entries(o).filter(([, v]) => v !== undefined)) as Partial<T>
}
