import { srgbToLinear } from '../analysis/image/transfer'
import type { Srgb8 } from './geometry'

/**
 * Target colours. The squares and the panel behind them are greys chosen for about 4:1 contrast
 * in linear light, not black on white: a moderate step keeps the edge away from clipping and
 * from in-camera sharpening's strongest overshoot [ours].
 *
 * Through the inverse sRGB curve (IEC 61966-2-1), code value 124 is reflectance ≈ 0.2016 and
 * 232 is ≈ 0.8070, a ratio of ≈ 4.00 (checked in the tests). The printed ratio depends on the
 * printer, ink and paper: print on matte paper (gloss adds glare), and let the engine measure
 * the contrast it actually sees.
 */
export const TARGET_DARK: Srgb8 = { r: 124, g: 124, b: 124 }
export const TARGET_LIGHT: Srgb8 = { r: 232, g: 232, b: 232 }
/** Text, QR code, scale bar and corner marks: full black for legibility. */
export const TARGET_INK: Srgb8 = { r: 0, g: 0, b: 0 }
/** Nominal linear reflectances the greys aim at. */
export const TARGET_NOMINAL_REFLECTANCE = { dark: 0.2, light: 0.8 } as const

export function srgbHex(c: Srgb8): string {
  const hex = (v: number) => v.toString(16).padStart(2, '0')
  return `#${hex(c.r)}${hex(c.g)}${hex(c.b)}`
}

/** Linear reflectance a grey prints at, if the print follows sRGB (green channel of a neutral grey). */
export function linearReflectance(c: Srgb8): number {
  return srgbToLinear(c.g / 255)
}

/** Light-to-dark ratio in linear light of the target's greys (≈ 4.00). */
export function targetContrastRatio(): number {
  return linearReflectance(TARGET_LIGHT) / linearReflectance(TARGET_DARK)
}
