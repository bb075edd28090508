/** One measured edge region, reduced to what the verdict needs (adapt the engine's measurement). */
export interface VerdictEdge {
  /** False when the region was rejected (clipped, too narrow, too few phase cycles …). */
  valid: boolean
  /** MTF50 along the edge normal, cycles/pixel; null when it could not be measured. */
  mtf50CyPx: number | null
  /** MTF curve as [frequency c/p, MTF] pairs in ascending frequency; needed for the haze check. */
  mtf?: readonly (readonly [number, number])[]
  /** 10–90 % rise of the edge, pixels; needed for the haze check. */
  rise1090Px?: number | null
  /** Warnings from the measurement, quoted when the edge is rejected. */
  warnings?: readonly string[]
}

/** What one check measured. */
export interface VerdictInput {
  edges: readonly VerdictEdge[]
  /** The camera's commissioning baseline MTF50, c/p (null or omitted: no drift check). */
  baselineMtf50CyPx?: number | null
  /** Pixel density at the target plane, px/m (null or omitted: not checked). */
  pixelDensityPxPerM?: number | null
  /** Day or infrared night check. Default `'day'`. */
  mode?: 'day' | 'night'
  /** For a night check: the camera's day MTF50, c/p, to name an infrared focus shift. */
  dayMtf50CyPx?: number | null
}

export type TaskId =
  | 'monitor'
  | 'detect'
  | 'observe'
  | 'recognise'
  | 'identify'
  | 'inspect'
  | 'plate-reading'
  | 'process-inspection'

/** Every number the verdict uses; all configurable per task and per camera. */
export interface VerdictThresholds {
  /** Task minimum for the median MTF50 of the valid edges, c/p. */
  minMtf50CyPx: number
  /** Fraction below the minimum that is still marginal. Default 0.10 (DESIGN.md). */
  marginalBand: number
  /** MTF50 / baseline below this is marginal. Default 0.8 (DESIGN.md, to be tuned). */
  driftMarginalRatio: number
  /** MTF50 / baseline below this fails. Default 0.6 (DESIGN.md, to be tuned). */
  driftFailRatio: number
  /** Task minimum pixel density, px/m. */
  minPixelDensityPxPerM: number
  /** Night / day MTF50 below this names an infrared focus shift. Default 0.8 (DESIGN.md). */
  nightDayRatio: number
  /** Low frequency probed for haze, c/p. Default 0.05 [ours]. */
  hazeProbeCyPx: number
  /** Haze needs the MTF at the probe below this … Default 0.9 [ours]. */
  hazeMaxLowFrequencyMtf: number
  /** … and below this fraction of what the edge's rise predicts. Default 0.85 [ours]. */
  hazeRatio: number
}

export type Severity = 'ok' | 'info' | 'marginal' | 'fail'

export interface VerdictReason {
  code:
    | 'sharpness'
    | 'drift'
    | 'pixel-density'
    | 'night-day'
    | 'infrared-focus-shift'
    | 'haze'
    | 'edges-rejected'
    | 'no-valid-edge'
  severity: Severity
  /** Plain words with the numbers. */
  message: string
  /** The numbers behind the message. */
  values: Record<string, number | string | null>
}

export type VerdictValue = 'pass' | 'marginal' | 'fail' | 'inconclusive'

export interface Verdict {
  verdict: VerdictValue
  reasons: VerdictReason[]
  /** The thresholds that were applied (after task defaults and overrides). */
  thresholds: VerdictThresholds
}
