import { assertInput, positive } from './validate'

export interface BlurCircleInput {
  focalLengthMm: number
  fNumber: number
  /** Distance the lens is focused at, metres (> focal length). */
  focusDistanceM: number
  /** Distance of the object, metres. */
  objectDistanceM: number
}

/**
 * Diameter of the blur circle on the sensor, µm, for an object at d when the lens is focused at s
 * (thin lens): c = (F²/N)·|d − s| / (d·(s − F)). DOMAIN.md example: F = 8 mm, N = 1.4, s = 10 m,
 * d = 5 m → 4.5751 µm. The blur depends on the dioptric error |1/d − 1/s|.
 */
export function blurCircleDiameterUm(input: BlurCircleInput): number {
  assertInput(input, 'blurCircleDiameterUm')
  const F = positive('focalLengthMm', input.focalLengthMm)
  const N = positive('fNumber', input.fNumber)
  const s = positive('focusDistanceM', input.focusDistanceM) * 1000
  const d = positive('objectDistanceM', input.objectDistanceM) * 1000
  if (s <= F) {
    throw new RangeError(
      `The focus distance (${s} mm) must be longer than the focal length (${F} mm).`,
    )
  }
  return ((F * F) / N) * (Math.abs(d - s) / (d * (s - F))) * 1000
}
