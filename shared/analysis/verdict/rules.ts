import type { HazeEvidence } from './haze'
import type { VerdictReason, VerdictThresholds } from './types'

const cp = (v: number) => `${v.toFixed(3)} c/p`
const pct = (v: number) => `${Math.round(v * 100)} %`
const pxm = (v: number) => `${+v.toFixed(1)} px/m`

/** Median MTF50 against the task minimum: within marginalBand below → marginal, further → fail. */
export function sharpnessReason(
  medianMtf50: number,
  edges: number,
  t: VerdictThresholds,
  taskLabel: string,
  haze: boolean,
): VerdictReason {
  const min = t.minMtf50CyPx
  const shortfall = min > 0 ? 1 - medianMtf50 / min : 0
  const what = `Sharpness ${cp(medianMtf50)} (median MTF50 of ${edges} edge${edges === 1 ? '' : 's'})`
  const values = {
    medianMtf50CyPx: medianMtf50,
    minMtf50CyPx: min,
    edges,
    marginalBand: t.marginalBand,
  }
  if (medianMtf50 >= min) {
    return {
      code: 'sharpness',
      severity: 'ok',
      values,
      message: `${what} meets the ${cp(min)} minimum${taskLabel}.`,
    }
  }
  const advice = haze ? ' Clean the dome or window and check again before refocusing.' : ''
  // A shortfall of exactly the band (e.g. 0.18 against 0.20) counts as marginal despite rounding.
  if (shortfall <= t.marginalBand + 1e-9) {
    return {
      code: 'sharpness',
      severity: 'marginal',
      values,
      message: `${what} is ${pct(shortfall)} below the ${cp(min)} minimum${taskLabel}, within the ${pct(t.marginalBand)} margin.${advice}`,
    }
  }
  return {
    code: 'sharpness',
    severity: 'fail',
    values,
    message: `${what} is ${pct(shortfall)} below the ${cp(min)} minimum${taskLabel}.${advice || ' Refocus the camera.'}`,
  }
}

/** MTF50 against the camera's own baseline. */
export function driftReason(
  medianMtf50: number,
  baseline: number,
  t: VerdictThresholds,
): VerdictReason {
  const ratio = medianMtf50 / baseline
  const values = { ratio, medianMtf50CyPx: medianMtf50, baselineMtf50CyPx: baseline }
  const head = `MTF50 is ${pct(ratio)} of the commissioning baseline (${cp(medianMtf50)} against ${cp(baseline)})`
  if (ratio < t.driftFailRatio) {
    return {
      code: 'drift',
      severity: 'fail',
      values,
      message: `${head}; below ${pct(t.driftFailRatio)} fails.`,
    }
  }
  if (ratio < t.driftMarginalRatio) {
    return {
      code: 'drift',
      severity: 'marginal',
      values,
      message: `${head}; below ${pct(t.driftMarginalRatio)} is marginal.`,
    }
  }
  return { code: 'drift', severity: 'ok', values, message: `${head}.` }
}

/** Pixel density at the target plane against the task's minimum: below → fail. */
export function densityReason(
  pxPerM: number,
  t: VerdictThresholds,
  taskLabel: string,
): VerdictReason {
  const min = t.minPixelDensityPxPerM
  const values = { pixelDensityPxPerM: pxPerM, minPixelDensityPxPerM: min }
  if (pxPerM < min) {
    return {
      code: 'pixel-density',
      severity: 'fail',
      values,
      message: `Pixel density ${pxm(pxPerM)} at the target is below the ${pxm(min)} needed${taskLabel}; refocusing cannot fix this — zoom in, move the camera closer or change the lens.`,
    }
  }
  return {
    code: 'pixel-density',
    severity: 'ok',
    values,
    message: `Pixel density ${pxm(pxPerM)} at the target meets the ${pxm(min)} needed${taskLabel}.`,
  }
}

/** Night check against the day MTF50: a low ratio names an infrared focus shift. */
export function nightReason(
  nightMtf50: number,
  dayMtf50: number,
  t: VerdictThresholds,
): VerdictReason {
  const ratio = nightMtf50 / dayMtf50
  const values = { ratio, nightMtf50CyPx: nightMtf50, dayMtf50CyPx: dayMtf50 }
  const head = `At night MTF50 is ${pct(ratio)} of the day value (${cp(nightMtf50)} against ${cp(dayMtf50)})`
  if (ratio < t.nightDayRatio) {
    return {
      code: 'infrared-focus-shift',
      severity: 'marginal',
      values,
      message: `${head}: likely infrared focus shift. Focus with the iris open in night mode, or fit an infrared-corrected lens.`,
    }
  }
  return { code: 'night-day', severity: 'ok', values, message: `${head}.` }
}

/** Haze: low MTF at a low frequency although the edge is steep. */
export function hazeReason(e: HazeEvidence, t: VerdictThresholds): VerdictReason | null {
  const ratio = e.measuredMtf / e.predictedMtf
  if (!(e.measuredMtf < t.hazeMaxLowFrequencyMtf && ratio < t.hazeRatio)) return null
  return {
    code: 'haze',
    severity: 'marginal',
    values: {
      mtfAtProbe: e.measuredMtf,
      predictedMtfAtProbe: e.predictedMtf,
      probeCyPx: t.hazeProbeCyPx,
      rise1090Px: e.rise1090Px,
      edges: e.edges,
    },
    message:
      `Contrast is low at all frequencies (MTF ${e.measuredMtf.toFixed(2)} at ${t.hazeProbeCyPx} c/p, where the ` +
      `${e.rise1090Px.toFixed(1)} px edge width predicts ${e.predictedMtf.toFixed(2)}): likely a dirty or scratched dome ` +
      'or window. Clean it; do not refocus.',
  }
}
