// Pixel density at the target plane: from a feature of known printed size measured in the
// frame (preferred: it is what the camera actually sees), or from the lens and distance.
import { pixelDensityFromLens, pixelDensityFromTarget } from '@shared/analysis'
import { squareSideForWidthMm } from '@shared/target'
import type { Camera } from '@shared/schemas/cameras'
import type { CameraModel } from '@shared/schemas/catalog'
import type { PixelDensityRecord } from '@/db/checks'

/** A length measured in the frame against its printed size. */
export interface ScaleMeasure {
  lengthPx: number
  printedMm: number
}

export function lineLengthPx(line: {
  from: { x: number; y: number }
  to: { x: number; y: number }
}) {
  return Math.hypot(line.to.x - line.from.x, line.to.y - line.from.y)
}

export function densityFromScale(scale: ScaleMeasure | null): PixelDensityRecord | null {
  if (!scale || !(scale.lengthPx > 0) || !(scale.printedMm > 0)) return null
  return {
    pxPerM: pixelDensityFromTarget({ measuredPx: scale.lengthPx, printedSizeMm: scale.printedMm }),
    source: 'target',
    detail: `${scale.lengthPx.toFixed(0)} px measured over ${+scale.printedMm.toFixed(1)} mm on the target`,
  }
}

export function densityFromLens(
  camera: Pick<Camera, 'focalLengthMm' | 'targetDistanceM'>,
  model: Pick<CameraModel, 'pixelPitchUm'> | null,
): PixelDensityRecord | null {
  const { focalLengthMm: f, targetDistanceM: d } = camera
  if (f === null || d === null || !model || !(model.pixelPitchUm > 0) || !(f > 0) || !(d > 0)) {
    return null
  }
  return {
    pxPerM: pixelDensityFromLens({
      focalLengthMm: f,
      pixelPitchUm: model.pixelPitchUm,
      distanceM: d,
    }),
    source: 'lens',
    detail: `${+f.toFixed(1)} mm lens, ${+model.pixelPitchUm.toFixed(2)} µm pixels, target at ${+d.toFixed(1)} m`,
  }
}

/** Side of the target's squares for a printed sheet width (the target layout's rule), mm. */
export function squareSideMm(sheetWidthMm: number): number | null {
  try {
    return squareSideForWidthMm(sheetWidthMm)
  } catch {
    return null
  }
}
