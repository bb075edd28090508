import type { RectMm } from './geometry'

/** The part of a QR symbol the drawing needs (the `modules` of `QRCode.create(text)`). */
export interface QrMatrix {
  size: number
  get(row: number, col: number): number | boolean
}

/** Quiet zone around the symbol, in modules (ISO/IEC 18004 asks for 4). */
export const QR_QUIET_ZONE_MODULES = 4

/**
 * Dark modules as rectangles inside `box` (which includes the quiet zone), one rectangle per
 * horizontal run of dark modules so a vector drawing stays small and has no seams inside a run.
 */
export function qrModuleRects(matrix: QrMatrix, box: RectMm): RectMm[] {
  const n = matrix.size
  if (!Number.isInteger(n) || n < 21)
    throw new RangeError('A QR symbol has at least 21 × 21 modules.')
  const moduleMm = box.w / (n + 2 * QR_QUIET_ZONE_MODULES)
  const x0 = box.x + QR_QUIET_ZONE_MODULES * moduleMm
  const y0 = box.y + QR_QUIET_ZONE_MODULES * moduleMm
  const rects: RectMm[] = []
  for (let row = 0; row < n; row++) {
    let col = 0
    while (col < n) {
      if (!matrix.get(row, col)) {
        col++
        continue
      }
      const start = col
      while (col < n && matrix.get(row, col)) col++
      rects.push({
        x: x0 + start * moduleMm,
        y: y0 + row * moduleMm,
        w: (col - start) * moduleMm,
        h: moduleMm,
      })
    }
  }
  return rects
}
