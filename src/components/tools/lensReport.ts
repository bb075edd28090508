import {
  backFocusToleranceUm,
  blurCircleDiameterUm,
  depthOfField,
  iecLevelsFor,
  pixelDensityFromLens,
  type IecLevel,
} from '@shared/analysis/optics'

export interface LensInputs {
  focalLengthMm: number
  fNumber: number
  pixelPitchUm: number
  sensorWidthPx: number
  /** Where the lens is focused, metres. */
  focusDistanceM: number
  /** Where the subject (or the target) is, metres. */
  objectDistanceM: number
  /** Largest blur-circle diameter still called sharp. */
  acceptableBlur: { value: number; unit: 'px' | 'um' }
}

export interface LensReport {
  blurUm: number
  blurPx: number
  acceptableBlurUm: number
  acceptableBlurPx: number
  /** The object lies in the zone of acceptable focus. */
  objectSharp: boolean
  hyperfocalM: number
  nearM: number
  /** Infinity when focused at or beyond the hyperfocal distance. */
  farM: number
  depthM: number
  pixelDensityPxPerM: number
  /** Width of the scene covered at the object distance, metres. */
  frameWidthM: number
  iec2014: IecLevel | null
  iec2025Draft: IecLevel | null
  /** How far (±) the sensor may sit from the image plane for the acceptable blur, µm. */
  backFocusToleranceUm: number
}

/** Everything the lens calculator shows, from the optics engine. Throws RangeError on impossible input. */
export function computeLensReport(input: LensInputs): LensReport {
  const { focalLengthMm, fNumber, pixelPitchUm, sensorWidthPx, focusDistanceM, objectDistanceM } =
    input
  if (objectDistanceM * 1000 <= focalLengthMm) {
    throw new RangeError('The object must be farther from the lens than the focal length.')
  }
  const acceptableBlurUm =
    input.acceptableBlur.unit === 'px'
      ? input.acceptableBlur.value * pixelPitchUm
      : input.acceptableBlur.value
  const blurUm = blurCircleDiameterUm({ focalLengthMm, fNumber, focusDistanceM, objectDistanceM })
  const dof = depthOfField({
    focalLengthMm,
    fNumber,
    circleOfConfusionUm: acceptableBlurUm,
    focusDistanceM,
  })
  const pixelDensityPxPerM = pixelDensityFromLens({
    focalLengthMm,
    pixelPitchUm,
    distanceM: objectDistanceM,
  })
  const levels = iecLevelsFor(pixelDensityPxPerM)
  return {
    blurUm,
    blurPx: blurUm / pixelPitchUm,
    acceptableBlurUm,
    acceptableBlurPx: acceptableBlurUm / pixelPitchUm,
    objectSharp: blurUm <= acceptableBlurUm,
    hyperfocalM: dof.hyperfocalM,
    nearM: dof.nearM,
    farM: dof.farM,
    depthM: dof.depthM,
    pixelDensityPxPerM,
    frameWidthM: sensorWidthPx / pixelDensityPxPerM,
    iec2014: levels.iec2014,
    iec2025Draft: levels.draft2025,
    backFocusToleranceUm: backFocusToleranceUm({
      maxBlurUm: acceptableBlurUm,
      fNumber,
      focalLengthMm,
      focusDistanceM,
    }),
  }
}
