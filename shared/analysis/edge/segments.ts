import type { EdgeMap } from './edgeMap'

/** A straight run of edge pixels of one kind, in edge-map pixels. */
export interface Segment {
  kind: 1 | 2
  count: number
  cx: number
  cy: number
  /** Unit direction along the segment (dy > 0 for vertical, dx > 0 for horizontal). */
  dirX: number
  dirY: number
  /** Length estimated from the spread along the direction: √(12 λ₁). */
  length: number
  /** RMS distance of the pixels from the fitted line. */
  straightness: number
  /** Mean gradient projected on the normal (sign gives the polarity). */
  meanGradient: number
}

/**
 * Connected components of the edge map, one kind at a time, summarised by their principal
 * axis. Flood fill with one preallocated stack; components shorter than `minCount` are not
 * summarised (but their size is recorded in `runSize`).
 */
export interface SegmentSet {
  segments: Segment[]
  /** Size of the run each edge pixel belongs to (0 off edges): isolated noise pixels are small. */
  runSize: Int32Array
}

export function findSegments(map: EdgeMap, minCount: number): SegmentSet {
  const { width: w, height: h, kind, gx, gy } = map
  const seen = new Uint8Array(w * h)
  const stack = new Int32Array(w * h)
  const members = new Int32Array(w * h)
  const runSize = new Int32Array(w * h)
  const out: Segment[] = []
  for (let start = 0; start < w * h; start++) {
    const k = kind[start]
    if (k === 0 || seen[start]) continue
    let top = 0
    stack[top++] = start
    seen[start] = 1
    let n = 0
    let sx = 0
    let sy = 0
    let sxx = 0
    let syy = 0
    let sxy = 0
    let sg = 0
    while (top > 0) {
      const i = stack[--top]
      members[n] = i
      const x = i % w
      const y = (i - x) / w
      n++
      sx += x
      sy += y
      sxx += x * x
      syy += y * y
      sxy += x * y
      sg += k === 1 ? gx[i] : gy[i]
      // Neighbours: 8-connected, plus two steps across the edge between adjacent rows (or
      // columns), so a blurred, noisy edge whose maxima jitter by a pixel stays in one run.
      const reachX = k === 1 ? 2 : 1
      const reachY = k === 1 ? 1 : 2
      for (let dy = -reachY; dy <= reachY; dy++) {
        const yy = y + dy
        if (yy < 0 || yy >= h) continue
        for (let dx = -reachX; dx <= reachX; dx++) {
          const xx = x + dx
          if (xx < 0 || xx >= w) continue
          const j = yy * w + xx
          if (kind[j] === k && !seen[j]) {
            seen[j] = 1
            stack[top++] = j
          }
        }
      }
    }
    for (let m = 0; m < n; m++) runSize[members[m]] = n
    if (n < minCount) continue
    const cx = sx / n
    const cy = sy / n
    const vxx = sxx / n - cx * cx
    const vyy = syy / n - cy * cy
    const vxy = sxy / n - cx * cy
    const tr = vxx + vyy
    const disc = Math.sqrt(Math.max(0, ((vxx - vyy) * (vxx - vyy)) / 4 + vxy * vxy))
    const l1 = tr / 2 + disc
    const l2 = Math.max(0, tr / 2 - disc)
    let dirX = vxy
    let dirY = l1 - vxx
    if (Math.abs(dirX) + Math.abs(dirY) < 1e-12) {
      dirX = vxx >= vyy ? 1 : 0
      dirY = vxx >= vyy ? 0 : 1
    }
    const norm = Math.hypot(dirX, dirY)
    dirX /= norm
    dirY /= norm
    if ((k === 1 && dirY < 0) || (k === 2 && dirX < 0)) {
      dirX = -dirX
      dirY = -dirY
    }
    out.push({
      kind: k as 1 | 2,
      count: n,
      cx,
      cy,
      dirX,
      dirY,
      length: Math.sqrt(12 * l1),
      straightness: Math.sqrt(l2),
      meanGradient: sg / n,
    })
  }
  return { segments: out, runSize }
}
