import type { EdgeOrientation, Roi } from '../types'
import type { EdgeMap } from './edgeMap'
import type { Segment } from './segments'

/** Runs of fewer edge pixels than this are noise, not a neighbouring edge. */
const MIN_NEIGHBOUR_RUN = 4

export interface RoiLimits {
  minAngleDeg: number
  maxAngleDeg: number
  /** Least region size across the edge, full-resolution px. */
  minAcrossPx: number
  /** Largest half-width across the edge, px. */
  maxHalfAcrossPx: number
  /** Largest length along the edge, px. */
  maxAlongPx: number
  /** Least rows: max(minAlongPx, 4 / tan θ) (four phase cycles). */
  minAlongPx: number
}

export interface RoiProposal {
  roi: Roi
  orientation: EdgeOrientation
  angleDeg: number
}

/**
 * Turns a segment of the downsampled edge map into a full-resolution region: the middle 70 % of
 * the segment along the edge (away from corners), and across it as far as the nearest other edge
 * pixel on either side allows (minus a margin and the edge's own drift over the rows).
 * Returns null when the angle or the room around the edge is not enough.
 */
export function segmentRoi(
  seg: Segment,
  map: EdgeMap,
  runSize: Uint16Array,
  factor: number,
  frameWidth: number,
  frameHeight: number,
  limits: RoiLimits,
): RoiProposal | null {
  const vertical = seg.kind === 1
  // Along/across coordinates: vertical edges run along y, horizontal ones along x.
  const along = vertical ? seg.dirY : seg.dirX
  const acrossDir = vertical ? seg.dirX : seg.dirY
  const tan = acrossDir / along
  const angleDeg = (Math.atan(tan) * 180) / Math.PI
  const absAngle = Math.abs(angleDeg)
  if (absAngle < limits.minAngleDeg || absAngle > limits.maxAngleDeg) return null

  const alongCentre = vertical ? seg.cy : seg.cx
  const acrossCentre = vertical ? seg.cx : seg.cy
  const alongDs = Math.min(0.7 * seg.length, limits.maxAlongPx / factor)
  const minRows = Math.max(limits.minAlongPx, 4 / Math.abs(tan))
  if (alongDs * factor < minRows) return null

  const { width: w, height: h, kind } = map
  const alongMax = vertical ? h : w
  const acrossMax = vertical ? w : h
  const scanLimit = Math.ceil(limits.maxHalfAcrossPx / factor) + 4
  let free = scanLimit
  const a0 = Math.max(0, Math.round(alongCentre - alongDs / 2))
  const a1 = Math.min(alongMax - 1, Math.round(alongCentre + alongDs / 2))
  for (let a = a0; a <= a1; a++) {
    const e = Math.round(acrossCentre + (a - alongCentre) * tan)
    for (const dir of [-1, 1]) {
      for (let d = 2; d <= free; d++) {
        const c = e + dir * d
        if (c < 0 || c >= acrossMax) {
          free = Math.min(free, d)
          break
        }
        const j = vertical ? a * w + c : c * w + a
        if (kind[j] !== 0 && runSize[j] >= MIN_NEIGHBOUR_RUN) {
          free = Math.min(free, d)
          break
        }
      }
    }
  }
  const drift = alongDs * Math.abs(tan)
  const halfDs = free - 3 - drift / 2
  const half = Math.min(limits.maxHalfAcrossPx, halfDs * factor)
  if (2 * half < limits.minAcrossPx) return null

  // Full-resolution geometry (a downsampled pixel i covers i·f … i·f + f − 1).
  const toFull = (v: number) => v * factor + (factor - 1) / 2
  const alongF = alongDs * factor
  const aStart = Math.round(toFull(alongCentre) - alongF / 2)
  const aLen = Math.round(alongF)
  const cMid = toFull(acrossCentre)
  const cStart = Math.round(cMid - (Math.abs(tan) * alongF) / 2 - half)
  const cLen = Math.round(2 * half + Math.abs(tan) * alongF)
  const roi = vertical
    ? clampRoi({ x: cStart, y: aStart, w: cLen, h: aLen }, frameWidth, frameHeight)
    : clampRoi({ x: aStart, y: cStart, w: aLen, h: cLen }, frameWidth, frameHeight)
  if (!roi) return null
  const across = vertical ? roi.w : roi.h
  const rows = vertical ? roi.h : roi.w
  if (across < limits.minAcrossPx || rows < minRows) return null
  return { roi, orientation: vertical ? 'vertical' : 'horizontal', angleDeg }
}

function clampRoi(roi: Roi, width: number, height: number): Roi | null {
  const x = Math.max(0, roi.x)
  const y = Math.max(0, roi.y)
  const w = Math.min(width, roi.x + roi.w) - x
  const h = Math.min(height, roi.y + roi.h) - y
  return w > 0 && h > 0 ? { x, y, w, h } : null
}
