import type { EdgeWarning } from '../types'

/** Plain-words text for each warning code. */
export const EDGE_WARNING_MESSAGES: Record<EdgeWarning, string> = {
  'roi-too-narrow':
    'The region is too narrow for this blur (needs at least 64 px and 10 × the 10–90 % rise across the edge); the MTF reads high.',
  'few-phase-cycles':
    'The edge is too close to the axis for the region height (fewer than 4 phase cycles); use a taller region or a larger angle.',
  'critical-angle':
    'The edge angle is close to a critical angle (45°, 26.6°, 18.4°, 14.0°) where the sample phases repeat; tilt the target a little.',
  clipping: 'More than 0.5 % of the region is clipped to black or white; reduce exposure.',
  'low-contrast': 'The edge contrast is low for the noise; results are uncertain.',
  sharpening:
    'The edge overshoots: in-camera sharpening is likely, which inflates MTF50 (compare MTF50P).',
}

export interface WarningInputs {
  colsPx: number
  rowsPx: number
  tanTheta: number
  riseHorizontalPx: number
  clippedFraction: number
  michelson: number
  snr: number | null
  overshoot: number
  undershoot: number
  sfrPeak: number
  /** Noise of one 1-px average of the ESF as a fraction of the step (0 when noise-free). */
  profileNoise: number
}

/** Thresholds: DOMAIN.md engineering minimums [ours]; sharpening and contrast limits [ours]. */
export function edgeWarnings(w: WarningInputs): EdgeWarning[] {
  const out: EdgeWarning[] = []
  if (w.colsPx < Math.max(64, 10 * w.riseHorizontalPx)) out.push('roi-too-narrow')
  const t = Math.abs(w.tanTheta)
  if (w.rowsPx * t < 4) out.push('few-phase-cycles')
  // Phases repeat every k rows when tan θ = 1/k; the rows spread them over k·rows·|tan θ − 1/k|
  // of a pixel, which must cover at least two pixels to fill the four ¼-px bins evenly.
  for (let k = 1; k <= 4; k++) {
    if (k * w.rowsPx * Math.abs(t - 1 / k) < 2) {
      out.push('critical-angle')
      break
    }
  }
  if (w.clippedFraction > 0.005) out.push('clipping')
  if (w.michelson < 0.2 || (w.snr !== null && w.snr < 10)) out.push('low-contrast')
  const floor = 4 * w.profileNoise
  const halo = Math.min(w.overshoot, w.undershoot)
  if ((halo > 0.01 && halo > floor) || (w.sfrPeak > 1.05 && w.overshoot > Math.max(0.005, floor))) {
    out.push('sharpening')
  }
  return out
}
