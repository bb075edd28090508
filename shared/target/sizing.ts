import { pixelDensityFromFov, pixelDensityFromLens } from '../analysis/optics'
import { squareSideForWidthMm } from './layout'
import { customSheet, CUSTOM_WIDTH_MAX_MM, sheetsOf, type PaperFamily, type Sheet } from './sheets'

/**
 * Each square edge should span at least this many pixels in the frame [ours]: with the half-side
 * clearance that leaves ≥ 60 px of flat grey each side of an edge, room for the engine's ≥ 64 px
 * region and ≥ 4 phase cycles of rows at 5° (≈ 46 rows, DOMAIN.md).
 */
export const MIN_EDGE_PX = 120

export interface TargetSizingInput {
  /** Camera-to-target distance, metres. */
  distanceM: number
  /** Frame width, pixels. */
  sensorWidthPx: number
  /** Lens route: focal length (mm) and pixel pitch (µm)… */
  focalLengthMm?: number
  pixelPitchUm?: number
  /** …or field-of-view route: horizontal field of view, degrees. */
  horizontalFovDeg?: number
  minEdgePx?: number
  family?: PaperFamily
}

export interface SheetOption {
  sheet: Sheet
  squareSideMm: number
  /** Length of one square edge in the frame, pixels. */
  edgePx: number
  /** Share of the frame width one square covers (0.1–0.2 is comfortable). */
  squareFrameFraction: number
  /** Share of the frame width the whole sheet covers (> 1: wider than the view). */
  sheetFrameFraction: number
  meetsEdge: boolean
}

export interface TargetSizing {
  pixelDensityPxPerM: number
  frameWidthM: number
  minEdgePx: number
  /** Smallest square side that spans minEdgePx, millimetres. */
  requiredSquareMm: number
  /** Sheet width whose squares have exactly that side, millimetres. */
  requiredSheetWidthMm: number
  options: SheetOption[]
  /** Smallest standard sheet that works, or null when the camera is too far for all of them. */
  recommended: SheetOption | null
  /** When no standard sheet works: the farthest distance the largest one works at… */
  maxDistanceForLargestM: number | null
  /** …and a custom print that would work here (null if wider than Sharpfield prints). */
  customOption: SheetOption | null
}

function densityOf(input: TargetSizingInput): number {
  const { distanceM, focalLengthMm, pixelPitchUm, horizontalFovDeg, sensorWidthPx } = input
  if (focalLengthMm !== undefined && pixelPitchUm !== undefined) {
    return pixelDensityFromLens({ focalLengthMm, pixelPitchUm, distanceM })
  }
  if (horizontalFovDeg !== undefined) {
    return pixelDensityFromFov({ widthPx: sensorWidthPx, horizontalFovDeg, distanceM })
  }
  throw new TypeError(
    'Give either the focal length and pixel pitch, or the horizontal field of view.',
  )
}

/**
 * Chooses the printed size for a camera: the smallest standard sheet whose squares span at least
 * `minEdgePx` at the given distance (square side ≥ px needed / PD × 1000 mm).
 */
export function sizeTarget(input: TargetSizingInput): TargetSizing {
  if (input === null || typeof input !== 'object')
    throw new TypeError('sizeTarget needs an object of named values.')
  const widthPx = input.sensorWidthPx
  if (!Number.isFinite(widthPx) || widthPx < 64)
    throw new RangeError('The frame width must be at least 64 pixels.')
  const minEdgePx = input.minEdgePx ?? MIN_EDGE_PX
  if (!Number.isFinite(minEdgePx) || minEdgePx <= 0)
    throw new RangeError('The pixels needed per edge must be a positive number.')
  const pd = densityOf(input)
  const frameWidthM = widthPx / pd
  const option = (sheet: Sheet): SheetOption => {
    const squareSideMm = squareSideForWidthMm(sheet.widthMm)
    const edgePx = (squareSideMm / 1000) * pd
    return {
      sheet,
      squareSideMm,
      edgePx,
      squareFrameFraction: edgePx / widthPx,
      sheetFrameFraction: (sheet.widthMm / 1000) * (pd / widthPx),
      meetsEdge: edgePx >= minEdgePx,
    }
  }
  const requiredSquareMm = (minEdgePx / pd) * 1000
  const requiredSheetWidthMm = requiredSquareMm / squareSideForWidthMm(1)
  const options = sheetsOf(input.family ?? 'iso').map(option)
  const recommended = options.find((o) => o.meetsEdge) ?? null
  let maxDistanceForLargestM: number | null = null
  let customOption: SheetOption | null = null
  if (!recommended) {
    const largest = options[options.length - 1]
    // PD falls as 1/d on both routes, so the edge length in pixels does too.
    maxDistanceForLargestM = (input.distanceM * largest.edgePx) / minEdgePx
    const width = Math.ceil(requiredSheetWidthMm / 10) * 10
    if (width <= CUSTOM_WIDTH_MAX_MM) customOption = option(customSheet(width))
  }
  return {
    pixelDensityPxPerM: pd,
    frameWidthM,
    minEdgePx,
    requiredSquareMm,
    requiredSheetWidthMm,
    options,
    recommended,
    maxDistanceForLargestM,
    customOption,
  }
}
