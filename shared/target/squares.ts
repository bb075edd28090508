import type { PointMm, RectMm } from './geometry'

/** Tilt of every square: each gives two near-vertical and two near-horizontal slanted edges. */
export const SQUARE_ROTATION_DEG = 5
/**
 * Flat clearance around each square's bounding box, as a fraction of its side [ours]. When a
 * side spans the recommended ≥ 120 px, an edge region can reach half a side (≥ 60 px) into flat
 * grey on each side: room for the engine's ≥ 64 px wide region centred on the edge, or up to
 * 10 × a 12 px rise, without touching another edge.
 */
export const SQUARE_CLEARANCE_RATIO = 0.5

const THETA = (SQUARE_ROTATION_DEG * Math.PI) / 180
/** Bounding-box side of a square of side 1 tilted by the rotation: cos θ + sin θ. */
export const SQUARE_BOUND_RATIO = Math.cos(THETA) + Math.sin(THETA)

export interface TargetSquare {
  centre: PointMm
  sideMm: number
  rotationDeg: number
  /** Corners clockwise on the page, starting with the one nearest the top-left. */
  corners: [PointMm, PointMm, PointMm, PointMm]
  /** Axis-aligned box around the tilted square. */
  bounds: RectMm
}

/**
 * A square of the given side centred at `centre`, turned counter-clockwise on the page by the
 * rotation (y points down, so a page-CCW turn is x' = x cos θ + y sin θ, y' = −x sin θ + y cos θ).
 */
export function tiltedSquare(centre: PointMm, sideMm: number): TargetSquare {
  const h = sideMm / 2
  const c = Math.cos(THETA)
  const s = Math.sin(THETA)
  const local: [number, number][] = [
    [-h, -h],
    [h, -h],
    [h, h],
    [-h, h],
  ]
  const corners = local.map(([x, y]) => ({
    x: centre.x + x * c + y * s,
    y: centre.y - x * s + y * c,
  })) as TargetSquare['corners']
  const half = (sideMm * SQUARE_BOUND_RATIO) / 2
  return {
    centre,
    sideMm,
    rotationDeg: SQUARE_ROTATION_DEG,
    corners,
    bounds: { x: centre.x - half, y: centre.y - half, w: 2 * half, h: 2 * half },
  }
}

/**
 * Side of the squares in a 2 × 2 grid filling a square panel of the given width, with the
 * clearance between the squares and between the squares and the panel border.
 */
export function gridSquareSideMm(panelWidthMm: number): number {
  return panelWidthMm / (2 * SQUARE_BOUND_RATIO + 3 * SQUARE_CLEARANCE_RATIO)
}

/** The four squares of the grid inside a square panel. */
export function squareGrid(panel: RectMm): TargetSquare[] {
  const side = gridSquareSideMm(panel.w)
  const gap = side * SQUARE_CLEARANCE_RATIO
  const bound = side * SQUARE_BOUND_RATIO
  const first = gap + bound / 2
  const step = bound + gap
  const squares: TargetSquare[] = []
  for (const row of [0, 1]) {
    for (const col of [0, 1]) {
      squares.push(
        tiltedSquare({ x: panel.x + first + col * step, y: panel.y + first + row * step }, side),
      )
    }
  }
  return squares
}
