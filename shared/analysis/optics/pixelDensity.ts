import { assertInput, positive } from './validate'

export interface LensDensityInput {
  focalLengthMm: number
  pixelPitchUm: number
  distanceM: number
}

/**
 * Pixels per metre at distance d from lens data: PD = F / (pitch·d) (DOMAIN.md: 4 mm, 2.9 µm,
 * 10 m → 137.93 px/m). Uses the far-field magnification F/d; the thin-lens F/(d − F) is larger by
 * F/(d − F) relative (0.04 % for 4 mm at 10 m).
 */
export function pixelDensityFromLens(input: LensDensityInput): number {
  assertInput(input, 'pixelDensityFromLens')
  const F = positive('focalLengthMm', input.focalLengthMm) / 1000
  const p = positive('pixelPitchUm', input.pixelPitchUm) / 1e6
  const d = positive('distanceM', input.distanceM)
  return F / (p * d)
}

export interface FovDensityInput {
  /** Image width in pixels. */
  widthPx: number
  /** Horizontal field of view, degrees (0 < HFOV < 180). */
  horizontalFovDeg: number
  distanceM: number
}

/**
 * Pixels per metre from the field of view: PD = width / (2·d·tan(HFOV/2)) (DOMAIN.md: 1920 px,
 * 90°, 10 m → 96.0 px/m). Valid on the optical axis of a rectilinear lens.
 */
export function pixelDensityFromFov(input: FovDensityInput): number {
  assertInput(input, 'pixelDensityFromFov')
  const w = positive('widthPx', input.widthPx)
  const fov = positive('horizontalFovDeg', input.horizontalFovDeg)
  if (fov >= 180) throw new RangeError(`horizontalFovDeg must be below 180° (got ${fov}).`)
  const d = positive('distanceM', input.distanceM)
  return w / (2 * d * Math.tan((fov * Math.PI) / 360))
}

export interface TargetDensityInput {
  /** Length of a target feature measured in the frame, pixels (e.g. the scale bar). */
  measuredPx: number
  /** The same feature's printed length, millimetres. */
  printedSizeMm: number
}

/**
 * Pixels per metre at the target plane from a feature of known printed size:
 * PD = measured px / printed length (m). Holds for the target plane; tilt of the target
 * toward the camera shortens the measured length and lowers the result.
 */
export function pixelDensityFromTarget(input: TargetDensityInput): number {
  assertInput(input, 'pixelDensityFromTarget')
  const px = positive('measuredPx', input.measuredPx)
  const mm = positive('printedSizeMm', input.printedSizeMm)
  return px / (mm / 1000)
}
