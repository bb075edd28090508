import { assertInput, nonNegative, positive } from './validate'

export interface SensorShiftInput {
  /** Axial displacement of the sensor from the image plane (back-focus error), µm. */
  sensorShiftUm: number
  fNumber: number
  /** Optional: with the focal length and focus distance the exact factor (1 − F/s) is applied. */
  focalLengthMm?: number
  /** Optional focus distance, metres; default infinity. */
  focusDistanceM?: number
}

/**
 * Blur-circle diameter, µm, caused by a sensor displaced δ from the image plane. The light cone
 * from an aperture F/N converging at the image distance v = F·s/(s − F) is δ·(F/N)/v wide δ away,
 * i.e. c = (δ/N)·(1 − F/s); at infinity focus exactly c = δ/N.
 * DOMAIN.md: δ = 20 µm at f/1.4 → 14.29 µm (DOMAIN.md prints 14.27).
 */
export function blurFromSensorShiftUm(input: SensorShiftInput): number {
  assertInput(input, 'blurFromSensorShiftUm')
  const delta = nonNegative('sensorShiftUm', input.sensorShiftUm)
  const N = positive('fNumber', input.fNumber)
  return (delta / N) * magnificationFactor(input.focalLengthMm, input.focusDistanceM)
}

export interface BackFocusToleranceInput {
  /** Largest acceptable blur-circle diameter, µm (e.g. two pixels). */
  maxBlurUm: number
  fNumber: number
  focalLengthMm?: number
  focusDistanceM?: number
}

/**
 * How far (±µm) the sensor may sit from the image plane before the blur circle exceeds maxBlurUm:
 * δ = c·N / (1 − F/s); at infinity c·N. DOMAIN.md: c ≤ 5.8 µm at f/1.4 → ±8.1 µm.
 */
export function backFocusToleranceUm(input: BackFocusToleranceInput): number {
  assertInput(input, 'backFocusToleranceUm')
  const c = positive('maxBlurUm', input.maxBlurUm)
  const N = positive('fNumber', input.fNumber)
  return (c * N) / magnificationFactor(input.focalLengthMm, input.focusDistanceM)
}

function magnificationFactor(focalLengthMm?: number, focusDistanceM?: number): number {
  if (focalLengthMm === undefined || focusDistanceM === undefined) return 1
  const F = positive('focalLengthMm', focalLengthMm)
  const s = positive('focusDistanceM', focusDistanceM) * 1000
  if (s <= F) {
    throw new RangeError(
      `The focus distance (${s} mm) must be longer than the focal length (${F} mm).`,
    )
  }
  return 1 - F / s
}
