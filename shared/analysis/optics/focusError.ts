import { assertInput, positive } from './validate'

export interface FocusErrorInput {
  /** Defocus disk radius measured from the edge, pixels. */
  radiusPx: number
  pixelPitchUm: number
  focalLengthMm: number
  fNumber: number
  /** Distance of the target the radius was measured on, metres. */
  targetDistanceM: number
}

export interface FocusCandidate {
  /** Where the lens would be focused, metres. */
  focusDistanceM: number
  /** Dioptric error |1/d − 1/s|, 1/m (dioptres). */
  dioptricError: number
}

export interface FocusError {
  /** Blur-circle diameter 2·R·pitch, µm. */
  blurCircleUm: number
  /** The lens is focused nearer than the target (s < d). */
  nearer: FocusCandidate
  /**
   * The lens is focused beyond the target (s > d); null when even infinity focus blurs less than
   * measured, so only a sensor (back-focus) error or other blur explains the radius.
   */
  farther: FocusCandidate | null
}

/**
 * The focus distances implied by a defocus disk of radius R on a target at distance d. From
 * c = (F²/N)·|d − s| / (d·(s − F)) with c = 2R·pitch and A = F²/N:
 * s < d: s = d(A + cF)/(A + c·d); s > d: s = d(A − cF)/(A − c·d) (when A > c·d).
 * One distance cannot tell which side is right (DOMAIN.md): both are returned; a second target at
 * another distance resolves it. Treats all measured blur as defocus, so it is an upper bound.
 */
export function focusErrorFromDiskRadius(input: FocusErrorInput): FocusError {
  assertInput(input, 'focusErrorFromDiskRadius')
  const R = positive('radiusPx', input.radiusPx)
  const pitchMm = positive('pixelPitchUm', input.pixelPitchUm) / 1000
  const F = positive('focalLengthMm', input.focalLengthMm)
  const N = positive('fNumber', input.fNumber)
  const d = positive('targetDistanceM', input.targetDistanceM) * 1000
  if (d <= F) {
    throw new RangeError(
      `The target distance (${d} mm) must be longer than the focal length (${F} mm).`,
    )
  }
  const c = 2 * R * pitchMm
  const A = (F * F) / N
  const candidate = (sMm: number): FocusCandidate => ({
    focusDistanceM: sMm / 1000,
    dioptricError: Math.abs(1000 / d - 1000 / sMm),
  })
  const nearer = candidate((d * (A + c * F)) / (A + c * d))
  const farther = A > c * d ? candidate((d * (A - c * F)) / (A - c * d)) : null
  return { blurCircleUm: c * 1000, nearer, farther }
}
