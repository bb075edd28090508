import { assertInput, nonNegative, positive } from './validate'

export interface EffectiveDensityInput {
  /** Nominal pixel density at the target, px/m. */
  pxPerM: number
  /** Measured MTF50, cycles/pixel. */
  mtf50CyPx: number
  /** MTF50 of a well-focused camera of this kind. Default 0.30 c/p [ours; practice: sharp 0.25–0.35]. */
  referenceMtf50CyPx?: number
}

export interface EffectiveDensity {
  nominalPxPerM: number
  /** PD × min(1, MTF50 / reference) — an estimate of our own, not a standard quantity. */
  effectivePxPerM: number
  factor: number
  referenceMtf50CyPx: number
  isEstimate: true
}

/**
 * Blur-adjusted "effective" pixel density PD × min(1, MTF50 / MTF50_reference) [ours]: a soft
 * camera resolves like one with fewer pixels. Shown as an estimate beside the nominal density.
 */
export function effectivePixelDensity(input: EffectiveDensityInput): EffectiveDensity {
  assertInput(input, 'effectivePixelDensity')
  const pd = nonNegative('pxPerM', input.pxPerM)
  const mtf50 = nonNegative('mtf50CyPx', input.mtf50CyPx)
  const ref = positive('referenceMtf50CyPx', input.referenceMtf50CyPx ?? 0.3)
  const factor = Math.min(1, mtf50 / ref)
  return {
    nominalPxPerM: pd,
    effectivePxPerM: pd * factor,
    factor,
    referenceMtf50CyPx: ref,
    isEstimate: true,
  }
}
