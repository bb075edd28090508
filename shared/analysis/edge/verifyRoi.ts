import { clippedFraction, type ClipThresholds } from '../image/clipping'
import { fitEdge } from '../mtf/edgeFit'
import { binEsf, BINS_PER_PX, flatAreaNoise } from '../mtf/esf'
import { edgeSign, extractEdgeSamples } from '../mtf/extract'
import { esfStats } from '../mtf/metrics'
import { edgeWarnings } from '../mtf/warnings'
import type { EdgeOrientation, GreyImage, Roi } from '../types'

export interface VerifiedEdge {
  roi: Roi
  orientation: EdgeOrientation
  angleDeg: number
  /** Michelson contrast (bright − dark)/(bright + dark). */
  contrast: number
  snr: number | null
  score: number
}

export interface VerifyLimits {
  minAngleDeg: number
  maxAngleDeg: number
  minContrast: number
  clip: ClipThresholds
}

/**
 * Checks a proposed region at full resolution: a single edge at a usable angle (2–20°, away
 * from the critical angles), not clipped, enough contrast and SNR, and flat on both sides
 * (the smoothed ESF stays near its plateau away from the edge).
 */
export function verifyRoi(
  image: GreyImage,
  roi: Roi,
  orientation: EdgeOrientation,
  limits: VerifyLimits,
): VerifiedEdge | null {
  if (clippedFraction(image, roi, limits.clip) > 0.005) return null
  const samples = extractEdgeSamples(image, roi, orientation)
  const sign = edgeSign(samples)
  let fit
  try {
    fit = fitEdge(samples, sign)
  } catch {
    return null
  }
  const angleDeg = (Math.atan(fit.slope) * 180) / Math.PI
  if (Math.abs(angleDeg) < limits.minAngleDeg || Math.abs(angleDeg) > limits.maxAngleDeg)
    return null
  const esf = binEsf(samples, fit)
  const stats = esfStats(esf, samples.cols / 2)
  const step = stats.right - stats.left
  const michelson = Math.abs(step) / Math.max(1e-12, stats.left + stats.right)
  if (michelson < limits.minContrast || sign * step <= 0) return null
  const noise = flatAreaNoise(samples, fit, esf, Math.max(4, 2 * stats.riseHorizontalPx))
  const snr = noise > 0 ? Math.abs(step) / noise : null
  if (snr !== null && snr < 10) return null

  const warnings = edgeWarnings({
    colsPx: samples.cols,
    rowsPx: fit.rowCount,
    tanTheta: fit.slope,
    riseHorizontalPx: stats.riseHorizontalPx,
    clippedFraction: 0,
    michelson,
    snr,
    overshoot: 0,
    undershoot: 0,
    sfrPeak: 1,
    profileNoise: 0,
  })
  if (warnings.includes('critical-angle') || warnings.includes('few-phase-cycles')) return null

  // Flat both sides: beyond 2 rises + 1 px (at least 6 px, room for a sharpening halo) the
  // 1-px-smoothed ESF stays within 15 % of the step of its plateau.
  const { values, counts, centreIndex } = esf
  const flatFrom = Math.round(Math.max(6, 2 * stats.riseHorizontalPx + 1) * BINS_PER_PX)
  for (let k = 2; k < values.length - 2; k++) {
    const d = k - centreIndex
    if (Math.abs(d) < flatFrom || counts[k] === 0) continue
    const smooth = (values[k - 2] + values[k - 1] + values[k] + values[k + 1]) / 4
    const plateau = d < 0 ? stats.left : stats.right
    if (Math.abs(smooth - plateau) > 0.15 * Math.abs(step)) return null
  }
  const rows = fit.rowCount
  const score = michelson * Math.sqrt(rows) * Math.min(1, samples.cols / 128)
  return { roi, orientation, angleDeg, contrast: michelson, snr, score }
}
