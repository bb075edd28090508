import type { FontWeight } from './fontMetrics'

/** A point on the sheet in millimetres; origin top-left, x to the right, y down. */
export interface PointMm {
  x: number
  y: number
}

/** An axis-aligned rectangle on the sheet in millimetres (top-left corner, width, height). */
export interface RectMm {
  x: number
  y: number
  w: number
  h: number
}

/** Colour as 8-bit sRGB code values. */
export interface Srgb8 {
  r: number
  g: number
  b: number
}

export function rectsOverlap(a: RectMm, b: RectMm): boolean {
  return a.x < b.x + b.w && b.x < a.x + a.w && a.y < b.y + b.h && b.y < a.y + a.h
}

/** Smallest rectangle holding every point. */
export function boundingRect(points: readonly PointMm[]): RectMm {
  if (points.length === 0) throw new RangeError('A bounding rectangle needs at least one point.')
  let minX = Infinity
  let minY = Infinity
  let maxX = -Infinity
  let maxY = -Infinity
  for (const p of points) {
    minX = Math.min(minX, p.x)
    minY = Math.min(minY, p.y)
    maxX = Math.max(maxX, p.x)
    maxY = Math.max(maxY, p.y)
  }
  return { x: minX, y: minY, w: maxX - minX, h: maxY - minY }
}

/** A line of text on the sheet. */
export interface TargetText {
  text: string
  /** Anchor point; y is the text baseline. */
  x: number
  y: number
  sizeMm: number
  weight: FontWeight
  align: 'start' | 'middle' | 'end'
}
