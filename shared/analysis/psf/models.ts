import type { PsfModel } from '../types'

/**
 * Edge spread functions of the blur models, convolved with the pixel aperture projected on the
 * edge normal and with the ESF bin. Sources: Goodman, Introduction to Fourier Optics (Gaussian
 * and uniform-disk PSFs); the disk ESF ½ + (u√(1−u²) + asin u)/π, u = x/R (DOMAIN.md).
 */

/** Complementary error function, Numerical Recipes `erfcc` (fractional error < 1.2e-7). */
export function erfc(x: number): number {
  const z = Math.abs(x)
  const t = 1 / (1 + 0.5 * z)
  const r =
    t *
    Math.exp(
      -z * z -
        1.26551223 +
        t *
          (1.00002368 +
            t *
              (0.37409196 +
                t *
                  (0.09678418 +
                    t *
                      (-0.18628806 +
                        t *
                          (0.27886807 +
                            t *
                              (-1.13520398 +
                                t * (1.48851587 + t * (-0.82215223 + t * 0.17087277)))))))),
    )
  return x >= 0 ? r : 2 - r
}

const INV_SQRT2 = Math.SQRT1_2
const INV_SQRT2PI = 1 / Math.sqrt(2 * Math.PI)

/** ∫ ESF: Gaussian E1(x) = x Φ(x/σ) + σ φ(x/σ). */
function gaussianEsfIntegral(x: number, sigma: number): number {
  const z = x / sigma
  return x * 0.5 * erfc(-z * INV_SQRT2) + sigma * INV_SQRT2PI * Math.exp(-0.5 * z * z)
}

/** ∫ ESF: disk E1(x) = R G(x/R), G(u) = u/2 + (u asin u + √(1−u²) − (1−u²)^{3/2}/3)/π, 0 below −1, u above 1. */
function diskEsfIntegral(x: number, radius: number): number {
  const u = x / radius
  if (u <= -1) return 0
  if (u >= 1) return x
  const s = Math.sqrt(1 - u * u)
  return radius * (u / 2 + (u * Math.asin(u) + s - (s * s * s) / 3) / Math.PI)
}

/** The edge spread function of the bare kernel (no pixel), 0 → 1. */
export function kernelEsf(model: PsfModel, sizePx: number, x: number): number {
  if (model === 'gaussian') return 0.5 * erfc((-x / sizePx) * INV_SQRT2)
  const u = x / sizePx
  if (u <= -1) return 0
  if (u >= 1) return 1
  return 0.5 + (u * Math.sqrt(1 - u * u) + Math.asin(u)) / Math.PI
}

/**
 * Quadrature of the aperture seen by one ESF bin along the normal: a box of width cos θ
 * (integrated exactly through E1), convolved with a box of width sin θ (2-point Gauss–Legendre)
 * and the bin box of width `binPx` (2-point Gauss–Legendre).
 */
export interface ApertureQuadrature {
  wide: number
  offsets: Float64Array
  weights: Float64Array
}

export function apertureQuadrature(angleRad: number, binPx: number): ApertureQuadrature {
  const wide = Math.max(Math.abs(Math.cos(angleRad)), Math.abs(Math.sin(angleRad)))
  const narrow = Math.min(Math.abs(Math.cos(angleRad)), Math.abs(Math.sin(angleRad)))
  const g = 1 / (2 * Math.sqrt(3))
  const a = [-g * narrow, g * narrow]
  const b = [-g * binPx, g * binPx]
  const offsets = new Float64Array(4)
  const weights = new Float64Array(4).fill(0.25)
  for (let i = 0; i < 2; i++) for (let j = 0; j < 2; j++) offsets[i * 2 + j] = a[i] + b[j]
  return { wide, offsets, weights }
}

/** Model ESF (0 → 1) at normal distance `u` px, including pixel aperture and bin. */
export function modelEsf(
  model: PsfModel,
  sizePx: number,
  u: number,
  q: ApertureQuadrature,
): number {
  const half = q.wide / 2
  let sum = 0
  for (let j = 0; j < q.offsets.length; j++) {
    const x = u - q.offsets[j]
    const diff =
      model === 'gaussian'
        ? gaussianEsfIntegral(x + half, sizePx) - gaussianEsfIntegral(x - half, sizePx)
        : diskEsfIntegral(x + half, sizePx) - diskEsfIntegral(x - half, sizePx)
    sum += q.weights[j] * diff
  }
  return sum / q.wide
}
