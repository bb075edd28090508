// Geometry of the region editor. The view maps frame pixels to box pixels:
// screen = image × scale + t. Regions are whole-pixel rectangles inside the frame.
import type { Roi } from '@shared/analysis'

export interface View {
  scale: number
  tx: number
  ty: number
}

export interface Size {
  width: number
  height: number
}

export interface Point {
  x: number
  y: number
}

export type Corner = 'nw' | 'ne' | 'sw' | 'se'
export const CORNERS: readonly Corner[] = ['nw', 'ne', 'sw', 'se']

/** Smallest region side the editor makes, px (the engine needs 16 across and 8 along). */
export const MIN_REGION_PX = 16
/** Corner handles show (and can be dragged) once the region's shorter side is this long on screen. */
export const HANDLE_MIN_SIDE_PX = 40

export function handlesShown(roi: Roi, view: View): boolean {
  return Math.min(roi.w, roi.h) * view.scale >= HANDLE_MIN_SIDE_PX
}

/** Most screen pixels per frame pixel. */
export const MAX_ZOOM_PX = 12

/** The whole frame centred in the box. */
export function fitView(frame: Size, box: Size): View {
  const scale = Math.min(box.width / frame.width, box.height / frame.height)
  return {
    scale,
    tx: (box.width - frame.width * scale) / 2,
    ty: (box.height - frame.height * scale) / 2,
  }
}

/** Keeps the frame in view: centred on an axis where it is smaller than the box. */
export function clampView(view: View, frame: Size, box: Size): View {
  const min = fitView(frame, box).scale
  const scale = Math.min(Math.max(view.scale, min), Math.max(min, MAX_ZOOM_PX))
  const axis = (t: number, frameLen: number, boxLen: number) => {
    const len = frameLen * scale
    if (len <= boxLen) return (boxLen - len) / 2
    return Math.min(0, Math.max(boxLen - len, t))
  }
  return {
    scale,
    tx: axis(view.tx, frame.width, box.width),
    ty: axis(view.ty, frame.height, box.height),
  }
}

/** Zooms by `factor` keeping the box point (cx, cy) over the same frame point. */
export function zoomAt(view: View, factor: number, cx: number, cy: number): View {
  const scale = view.scale * factor
  return {
    scale,
    tx: cx - ((cx - view.tx) * scale) / view.scale,
    ty: cy - ((cy - view.ty) * scale) / view.scale,
  }
}

export function toImage(view: View, p: Point): Point {
  return { x: (p.x - view.tx) / view.scale, y: (p.y - view.ty) / view.scale }
}

export function toScreen(view: View, p: Point): Point {
  return { x: p.x * view.scale + view.tx, y: p.y * view.scale + view.ty }
}

export function cornerPoint(roi: Roi, corner: Corner): Point {
  return {
    x: corner === 'nw' || corner === 'sw' ? roi.x : roi.x + roi.w,
    y: corner === 'nw' || corner === 'ne' ? roi.y : roi.y + roi.h,
  }
}

const clamp = (v: number, lo: number, hi: number) => Math.min(hi, Math.max(lo, v))

/** The rectangle spanned by two frame points, rounded to whole pixels and cut to the frame. */
export function rectFromPoints(a: Point, b: Point, frame: Size): Roi {
  const x0 = Math.round(clamp(Math.min(a.x, b.x), 0, frame.width))
  const y0 = Math.round(clamp(Math.min(a.y, b.y), 0, frame.height))
  const x1 = Math.round(clamp(Math.max(a.x, b.x), 0, frame.width))
  const y1 = Math.round(clamp(Math.max(a.y, b.y), 0, frame.height))
  return { x: x0, y: y0, w: x1 - x0, h: y1 - y0 }
}

/** The region with one corner moved to `p`; the opposite corner stays; sides ≥ MIN_REGION_PX. */
export function moveCorner(roi: Roi, corner: Corner, p: Point, frame: Size): Roi {
  const west = corner === 'nw' || corner === 'sw'
  const north = corner === 'nw' || corner === 'ne'
  const fixedX = west ? roi.x + roi.w : roi.x
  const fixedY = north ? roi.y + roi.h : roi.y
  const x = west
    ? clamp(Math.round(p.x), 0, fixedX - MIN_REGION_PX)
    : clamp(Math.round(p.x), fixedX + MIN_REGION_PX, frame.width)
  const y = north
    ? clamp(Math.round(p.y), 0, fixedY - MIN_REGION_PX)
    : clamp(Math.round(p.y), fixedY + MIN_REGION_PX, frame.height)
  return {
    x: Math.min(x, fixedX),
    y: Math.min(y, fixedY),
    w: Math.abs(fixedX - x),
    h: Math.abs(fixedY - y),
  }
}

export interface Hit {
  id: string
  corner: Corner | null
}

/**
 * What a box point touches: a corner handle (within `handlePx` screen px) of a region large
 * enough on screen to show its handles first, then the smallest region containing the point.
 */
export function hitTest(
  regions: readonly { id: string; roi: Roi }[],
  view: View,
  p: Point,
  handlePx = 22,
): Hit | null {
  let best: { hit: Hit; d: number } | null = null
  for (const r of regions) {
    if (!handlesShown(r.roi, view)) continue
    for (const corner of CORNERS) {
      const s = toScreen(view, cornerPoint(r.roi, corner))
      const d = Math.hypot(s.x - p.x, s.y - p.y)
      if (d <= handlePx && (!best || d < best.d)) best = { hit: { id: r.id, corner }, d }
    }
  }
  if (best) return best.hit
  const q = toImage(view, p)
  const inside = regions
    .filter(
      (r) =>
        q.x >= r.roi.x && q.x <= r.roi.x + r.roi.w && q.y >= r.roi.y && q.y <= r.roi.y + r.roi.h,
    )
    .sort((a, b) => a.roi.w * a.roi.h - b.roi.w * b.roi.h)
  return inside.length ? { id: inside[0].id, corner: null } : null
}
