import { assertInput, positive } from './validate'

export interface HyperfocalInput {
  focalLengthMm: number
  fNumber: number
  /** Acceptable blur-circle diameter on the sensor, µm (e.g. 2 pixel pitches). */
  circleOfConfusionUm: number
}

export interface DepthOfFieldInput extends HyperfocalInput {
  focusDistanceM: number
}

export interface DepthOfField {
  hyperfocalM: number
  /** Nearest distance in acceptable focus, metres. */
  nearM: number
  /** Farthest distance in acceptable focus, metres; Infinity when focused at or beyond the hyperfocal distance. */
  farM: number
  /** farM − nearM (Infinity when farM is). */
  depthM: number
}

/**
 * Hyperfocal distance H = F²/(N·c) + F, metres. Handbook case (DOMAIN.md): 50 mm, f/8,
 * c = 0.03 mm → 10 466.7 mm.
 */
export function hyperfocalDistanceM(input: HyperfocalInput): number {
  assertInput(input, 'hyperfocalDistanceM')
  const F = positive('focalLengthMm', input.focalLengthMm)
  const N = positive('fNumber', input.fNumber)
  const c = positive('circleOfConfusionUm', input.circleOfConfusionUm) / 1000
  return ((F * F) / (N * c) + F) / 1000
}

/**
 * Near and far limits of acceptable focus (thin lens): near = s(H − F)/(H + s − 2F),
 * far = s(H − F)/(H − s), ∞ when s ≥ H. DOMAIN.md: 50 mm f/8 c = 0.03 mm at 5 m →
 * near 3389.4 mm, far 9527.4 mm.
 */
export function depthOfField(input: DepthOfFieldInput): DepthOfField {
  const H = hyperfocalDistanceM(input) * 1000
  const F = input.focalLengthMm
  const s = positive('focusDistanceM', input.focusDistanceM) * 1000
  if (s <= F) {
    throw new RangeError(
      `The focus distance (${s} mm) must be longer than the focal length (${F} mm).`,
    )
  }
  const near = (s * (H - F)) / (H + s - 2 * F)
  const far = s >= H ? Infinity : (s * (H - F)) / (H - s)
  return {
    hyperfocalM: H / 1000,
    nearM: near / 1000,
    farM: far / 1000,
    depthM: (far - near) / 1000,
  }
}
