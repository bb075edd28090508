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
}

export interface SegmentSet {
  segments: Segment[]
  /** Size of the run each edge pixel belongs to (0 off edges, capped at 65 535). */
  runSize: Uint16Array
}

/** Caller-owned buffers of at least width × height samples. */
export interface SegmentBuffers {
  queue: Int32Array
  runSize: Uint16Array
}

/**
 * Connected runs of the edge map, one kind at a time, summarised by their principal axis.
 * Neighbours: 8-connected, plus two steps across the edge between adjacent rows (or columns),
 * so a blurred, noisy edge whose maxima jitter by a pixel stays in one run. Breadth-first fill
 * whose queue is also the member list; runs shorter than `minCount` are not summarised (their
 * size is still recorded in `runSize`, which tells noise from a neighbouring edge).
 */
export function findSegments(map: EdgeMap, minCount: number, buffers?: SegmentBuffers): SegmentSet {
  const { width: w, height: h, kind } = map
  const n = w * h
  const queue = buffers && buffers.queue.length >= n ? buffers.queue : new Int32Array(n)
  const runSize =
    buffers && buffers.runSize.length >= n ? buffers.runSize.subarray(0, n) : new Uint16Array(n)
  runSize.fill(0)
  const out: Segment[] = []
  for (let start = 0; start < n; start++) {
    const k = kind[start]
    if (k === 0 || runSize[start] !== 0) continue
    const reachX = k === 1 ? 2 : 1
    const reachY = k === 1 ? 1 : 2
    let head = 0
    let tail = 0
    queue[tail++] = start
    runSize[start] = 1
    let sx = 0
    let sy = 0
    let sxx = 0
    let syy = 0
    let sxy = 0
    while (head < tail) {
      const i = queue[head++]
      const x = i % w
      const y = (i - x) / w
      sx += x
      sy += y
      sxx += x * x
      syy += y * y
      sxy += x * y
      const y0 = Math.max(0, y - reachY)
      const y1 = Math.min(h - 1, y + reachY)
      const x0 = Math.max(0, x - reachX)
      const x1 = Math.min(w - 1, x + reachX)
      for (let yy = y0; yy <= y1; yy++) {
        for (let j = yy * w + x0; j <= yy * w + x1; j++) {
          if (kind[j] === k && runSize[j] === 0) {
            runSize[j] = 1
            queue[tail++] = j
          }
        }
      }
    }
    const count = tail
    const size = Math.min(65535, count)
    for (let m = 0; m < count; m++) runSize[queue[m]] = size
    if (count < minCount) continue
    out.push(summarise(k as 1 | 2, count, sx, sy, sxx, syy, sxy))
  }
  return { segments: out, runSize }
}

function summarise(
  kind: 1 | 2,
  n: number,
  sx: number,
  sy: number,
  sxx: number,
  syy: number,
  sxy: number,
): Segment {
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
  if ((kind === 1 && dirY < 0) || (kind === 2 && dirX < 0)) {
    dirX = -dirX
    dirY = -dirY
  }
  return {
    kind,
    count: n,
    cx,
    cy,
    dirX,
    dirY,
    length: Math.sqrt(12 * l1),
    straightness: Math.sqrt(l2),
  }
}
