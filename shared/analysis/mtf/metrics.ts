import { BINS_PER_PX, type Esf } from './esf'
import type { Sfr } from './sfr'

/** Grid of the reported MTF curve: 0 to 1 c/p in 0.01 c/p steps. */
export const CURVE_STEP_CY_PX = 0.01
export const CURVE_MAX_CY_PX = 1

export interface SfrSummary {
  curve: [number, number][]
  mtf50: number | null
  mtf50p: number | null
  mtf10: number | null
  mtfNyquist: number
  /** Largest SFR from 0 to 0.5 c/p (1 unless sharpened). */
  peak: number
}

/** The curve on the reporting grid and the summary frequencies (ISO 12233 step 12). */
export function summariseSfr(sfr: Sfr): SfrSummary {
  const points = Math.round(CURVE_MAX_CY_PX / CURVE_STEP_CY_PX) + 1
  const curve: [number, number][] = []
  for (let j = 0; j < points; j++) {
    const f = Math.round(j * CURVE_STEP_CY_PX * 1e6) / 1e6
    curve.push([f, sfr.at(f)])
  }
  const nyquistIndex = Math.round(0.5 / CURVE_STEP_CY_PX)
  let peak = 0
  let peakIndex = 0
  for (let j = 0; j <= nyquistIndex; j++) {
    if (curve[j][1] > peak) {
      peak = curve[j][1]
      peakIndex = j
    }
  }
  return {
    curve,
    mtf50: firstCrossing(sfr, curve, 0.5, 0),
    mtf50p: firstCrossing(sfr, curve, 0.5 * peak, peakIndex),
    mtf10: firstCrossing(sfr, curve, 0.1, 0),
    mtfNyquist: sfr.at(0.5),
    peak,
  }
}

/**
 * First frequency after grid index `from` where the SFR falls below `level`, refined by
 * bisection on the continuous transform; null when it stays above up to 1 c/p.
 */
export function firstCrossing(
  sfr: Sfr,
  curve: [number, number][],
  level: number,
  from: number,
): number | null {
  for (let j = from + 1; j < curve.length; j++) {
    if (curve[j][1] < level) {
      let lo = curve[j - 1][0]
      let hi = curve[j][0]
      for (let i = 0; i < 30; i++) {
        const mid = (lo + hi) / 2
        if (sfr.at(mid) >= level) lo = mid
        else hi = mid
      }
      return (lo + hi) / 2
    }
  }
  return null
}

export interface EsfStats {
  /** Plateau means on the low-dx and high-dx sides (linear luminance). */
  left: number
  right: number
  /** 10–90 % rise in horizontal pixels (multiply by cos θ for the normal). */
  riseHorizontalPx: number
  overshoot: number
  undershoot: number
}

/**
 * Plateaus from the outer 35 % of each half of the ESF, the 10–90 % rise walking outwards from
 * the edge, and the over/undershoot of the 1-px-smoothed ESF near the edge, as fractions of
 * the step (overshoot on the bright side, undershoot on the dark side).
 */
export function esfStats(esf: Esf, halfWidthPx: number): EsfStats {
  const { values, counts, centreIndex } = esf
  const n = values.length
  const plateauFrom = Math.max(2, 0.65 * halfWidthPx) * BINS_PER_PX
  let sumL = 0
  let nL = 0
  let sumR = 0
  let nR = 0
  for (let k = 0; k < n; k++) {
    if (counts[k] === 0) continue
    const d = k - centreIndex
    if (d <= -plateauFrom) {
      sumL += values[k] * counts[k]
      nL += counts[k]
    } else if (d >= plateauFrom) {
      sumR += values[k] * counts[k]
      nR += counts[k]
    }
  }
  const left = nL > 0 ? sumL / nL : values[0]
  const right = nR > 0 ? sumR / nR : values[n - 1]
  const step = right - left
  const norm = (k: number) => (values[k] - left) / step

  let k10 = 0
  for (let k = centreIndex; k > 0; k--) {
    if (norm(k - 1) <= 0.1) {
      k10 = k - 1 + (0.1 - norm(k - 1)) / (norm(k) - norm(k - 1) || 1)
      break
    }
  }
  let k90 = n - 1
  for (let k = centreIndex; k < n - 1; k++) {
    if (norm(k + 1) >= 0.9) {
      k90 = k + (0.9 - norm(k)) / (norm(k + 1) - norm(k) || 1)
      break
    }
  }
  const riseHorizontalPx = Math.max(0, (k90 - k10) / BINS_PER_PX)

  const reach = Math.round((Math.max(2 * riseHorizontalPx, 3) + 4) * BINS_PER_PX)
  let above = 0
  let below = 0
  for (let k = Math.max(2, centreIndex - reach); k <= Math.min(n - 3, centreIndex + reach); k++) {
    const smooth = (norm(k - 2) + norm(k - 1) + norm(k) + norm(k + 1)) / 4
    if (k >= centreIndex) above = Math.max(above, smooth - 1)
    else below = Math.max(below, -smooth)
  }
  const rising = step >= 0
  return {
    left,
    right,
    riseHorizontalPx,
    overshoot: rising ? above : below,
    undershoot: rising ? below : above,
  }
}
