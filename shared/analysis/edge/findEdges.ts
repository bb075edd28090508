import { clipThresholds } from '../image/clipping'
import { assertGreyImage } from '../image/validate'
import type { EdgeOrientation, EncodingInfo, GreyImage, Roi } from '../types'
import { downsampleBox } from './downsample'
import { edgeMap } from './edgeMap'
import { segmentRoi, type RoiLimits } from './segmentRoi'
import { edgeScratch } from './scratch'
import { findSegments } from './segments'
import { verifyRoi } from './verifyRoi'

export interface FoundEdge {
  roi: Roi
  orientation: EdgeOrientation
  angleDeg: number
  /** Michelson contrast of the edge. */
  contrast: number
  /** Ranking score: contrast × √rows, less for narrow regions. */
  score: number
}

export interface FindEdgesOptions {
  /** Usable angles off the axis, degrees. @default 2 and 20 */
  minAngleDeg?: number
  maxAngleDeg?: number
  /** Least Michelson contrast. @default 0.15 (the target is about 0.6) */
  minContrast?: number
  /** Least size across the edge, px. @default 40 */
  minAcrossPx?: number
  /** Least length along the edge, px (also ≥ 4 phase cycles). @default 32 */
  minAlongPx?: number
  /** Largest region: half-width across and length along, px. @default 80 and 256 */
  maxHalfAcrossPx?: number
  maxAlongPx?: number
  /** At most this many edges, best first. @default 24 */
  maxEdges?: number
  /** Downsampling factor for the search; default: frame's long side / 1000, rounded. */
  downsample?: number
  /** Least relative gradient |∇I|/I of an edge pixel in the downsampled frame. @default 0.06 */
  minRelativeGradient?: number
  encodingInfo?: EncodingInfo
}

/**
 * Finds usable slanted edges in a whole frame and returns their regions, best first.
 *
 * 1. Box-downsample the frame (long side ≈ 1000 px) in one fused pass.
 * 2. Sobel gradients and non-maximum suppression; keep pixels whose gradient lies within 25° of
 *    an axis and whose relative gradient is large enough.
 * 3. 8-connected runs of near-vertical and near-horizontal edge pixels; principal axis → angle,
 *    length, straightness. Keep straight runs 2–20° off the axis (axis-aligned panels and image
 *    borders fall out here).
 * 4. A region on the middle of each run, as wide as the nearest other edge allows.
 * 5. Full-resolution check of each region (verifyRoi), then overlapping regions are merged
 *    keeping the better one.
 */
export function findEdges(image: GreyImage, options: FindEdgesOptions = {}): FoundEdge[] {
  assertGreyImage(image)
  const minAngleDeg = options.minAngleDeg ?? 2
  const maxAngleDeg = options.maxAngleDeg ?? 20
  const factor =
    options.downsample ?? Math.max(1, Math.round(Math.max(image.width, image.height) / 1000))
  const limits: RoiLimits = {
    minAngleDeg,
    maxAngleDeg,
    minAcrossPx: options.minAcrossPx ?? 40,
    maxHalfAcrossPx: options.maxHalfAcrossPx ?? 80,
    maxAlongPx: options.maxAlongPx ?? 256,
    minAlongPx: options.minAlongPx ?? 32,
  }
  if (image.width < 3 * factor + 8 || image.height < 3 * factor + 8) return []
  const scratch = edgeScratch(Math.floor(image.width / factor) * Math.floor(image.height / factor))
  const small = downsampleBox(image, factor, scratch.small)
  const map = edgeMap(small, options.minRelativeGradient ?? 0.06, scratch)
  const minCount = Math.max(6, Math.floor(limits.minAlongPx / factor / 0.7))
  const { segments, runSize } = findSegments(map, minCount, scratch)
  const verifyLimits = {
    minAngleDeg,
    maxAngleDeg,
    minContrast: options.minContrast ?? 0.15,
    clip: clipThresholds(options.encodingInfo),
  }
  const found: FoundEdge[] = []
  for (const seg of segments) {
    if (seg.straightness > 1) continue
    const proposal = segmentRoi(seg, map, runSize, factor, image.width, image.height, limits)
    if (!proposal) continue
    const verified = verifyRoi(image, proposal.roi, proposal.orientation, verifyLimits)
    if (verified) found.push(verified)
  }
  found.sort((a, b) => b.score - a.score)
  const kept: FoundEdge[] = []
  for (const edge of found) {
    if (kept.some((k) => sameEdge(k, edge))) continue
    kept.push({
      roi: edge.roi,
      orientation: edge.orientation,
      angleDeg: edge.angleDeg,
      contrast: edge.contrast,
      score: edge.score,
    })
    if (kept.length >= (options.maxEdges ?? 24)) break
  }
  return kept
}

/**
 * Two regions show the same edge when they have one orientation and one's centre lies in the
 * other, or they overlap by more than half (a run broken in two). Regions of parallel edges
 * may overlap a little in the gap between them.
 */
function sameEdge(a: FoundEdge, b: FoundEdge): boolean {
  if (a.orientation !== b.orientation) return overlap(a.roi, b.roi) > 0.5
  return contains(a.roi, b.roi) || contains(b.roi, a.roi) || overlap(a.roi, b.roi) > 0.5
}

function contains(outer: Roi, inner: Roi): boolean {
  const cx = inner.x + inner.w / 2
  const cy = inner.y + inner.h / 2
  return cx >= outer.x && cx <= outer.x + outer.w && cy >= outer.y && cy <= outer.y + outer.h
}

/** Intersection area over the smaller region's area. */
function overlap(a: Roi, b: Roi): number {
  const w = Math.min(a.x + a.w, b.x + b.w) - Math.max(a.x, b.x)
  const h = Math.min(a.y + a.h, b.y + b.h) - Math.max(a.y, b.y)
  if (w <= 0 || h <= 0) return 0
  return (w * h) / Math.min(a.w * a.h, b.w * b.h)
}
