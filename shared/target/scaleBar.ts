import type { RectMm, TargetText } from './geometry'

export interface ScaleBar {
  /** Outline of the whole bar; its length is `lengthMm` exactly. */
  outline: RectMm
  lengthMm: number
  segmentMm: number
  /** Filled (dark) segments; the others are left white. */
  filled: RectMm[]
  labels: TargetText[]
}

const NICE_LENGTHS_MM = [50, 100, 150, 200, 250, 300, 400, 500, 750, 1000, 1500, 2000, 2500, 3000]

function segmentFor(lengthMm: number): number {
  if (lengthMm <= 200) return 10
  if (lengthMm <= 1000) return 50
  return 100
}

/**
 * A bar of alternating 10, 50 or 100 mm segments at the bottom of the footer column, as long as
 * the largest round length that fits in 85 % of the column; labels under it.
 */
export function scaleBarLayout(column: RectMm, u: number): ScaleBar {
  const fit = NICE_LENGTHS_MM.filter((l) => l <= 0.85 * column.w)
  if (fit.length === 0) throw new RangeError('The sheet is too small for a 50 mm scale bar.')
  const lengthMm = fit[fit.length - 1]
  const segmentMm = segmentFor(lengthMm)
  const labelSize = 3 * u
  const barHeight = 3.5 * u
  const y = column.y + column.h - labelSize - 1.2 * u - barHeight
  const outline: RectMm = { x: column.x, y, w: lengthMm, h: barHeight }
  const filled: RectMm[] = []
  for (let i = 0; i * segmentMm < lengthMm; i += 2) {
    filled.push({ x: column.x + i * segmentMm, y, w: segmentMm, h: barHeight })
  }
  const labelY = y + barHeight + 1.2 * u + labelSize * 0.72
  const label = (text: string, x: number, align: TargetText['align']): TargetText => ({
    text,
    x,
    y: labelY,
    sizeMm: labelSize,
    weight: 'regular',
    align,
  })
  const labels = [
    label('0', column.x, 'start'),
    label(`${lengthMm} mm`, column.x + lengthMm, 'end'),
  ]
  if ((lengthMm / 2) % segmentMm === 0)
    labels.push(label(String(lengthMm / 2), column.x + lengthMm / 2, 'middle'))
  return { outline, lengthMm, segmentMm, filled, labels }
}
