// Touch, mouse and keyboard on the region editor: pinch or wheel to zoom, drag to pan, tap a
// region to turn it off or on, drag a corner to adjust it, draw a new one, or draw a scale line.
// Pointer positions are box pixels (relative to the editor's top-left corner).
import { computed, ref, shallowRef, watch, type Ref } from 'vue'
import type { Roi } from '@shared/analysis'
import {
  clampView,
  fitView,
  hitTest,
  MIN_REGION_PX,
  moveCorner,
  rectFromPoints,
  toImage,
  zoomAt,
  type Corner,
  type Point,
  type Size,
  type View,
} from './regionEditor/geometry'

export type EditorMode = 'adjust' | 'draw' | 'scale'

export interface EditorPointer {
  pointerId: number
  x: number
  y: number
}

export interface ScaleLine {
  from: Point
  to: Point
}

export interface RegionEditorEvents {
  toggle(id: string): void
  adjust(id: string, roi: Roi): void
  draw(roi: Roi): void
  scale(line: ScaleLine): void
}

/** Movement below this many box px is a tap, not a drag. */
export const TAP_SLOP_PX = 8

type Gesture =
  | { kind: 'pan'; start: EditorPointer; view: View; hitId: string | null; moved: boolean }
  | { kind: 'corner'; id: string; corner: Corner; roi: Roi }
  | { kind: 'draw'; from: Point }
  | { kind: 'scale'; from: Point }
  | { kind: 'pinch'; distance: number; mid: Point; view: View }

export function useRegionEditor(
  frame: Ref<Size | null>,
  regions: Ref<readonly { id: string; roi: Roi }[]>,
  events: RegionEditorEvents,
) {
  const box = ref<Size>({ width: 1, height: 1 })
  const view = ref<View>({ scale: 1, tx: 0, ty: 0 })
  const mode = ref<EditorMode>('adjust')
  /** The rectangle or line being drawn, or the region being adjusted, in frame px. */
  const draft = shallowRef<{ id: string | null; roi: Roi } | null>(null)
  const draftLine = shallowRef<ScaleLine | null>(null)
  const pointers = new Map<number, EditorPointer>()
  let gesture: Gesture | null = null

  const zoom = computed(() =>
    frame.value ? view.value.scale / fitView(frame.value, box.value).scale : 1,
  )

  function setView(v: View): void {
    view.value = frame.value ? clampView(v, frame.value, box.value) : v
  }
  function resetView(): void {
    if (frame.value) view.value = fitView(frame.value, box.value)
  }
  watch(frame, resetView)

  function resize(size: Size): void {
    const first = box.value.width <= 1
    box.value = { width: Math.max(1, size.width), height: Math.max(1, size.height) }
    if (first) resetView()
    else setView(view.value)
  }
  function zoomBy(factor: number, at?: Point): void {
    const c = at ?? { x: box.value.width / 2, y: box.value.height / 2 }
    setView(zoomAt(view.value, factor, c.x, c.y))
  }
  function panBy(dx: number, dy: number): void {
    setView({ ...view.value, tx: view.value.tx + dx, ty: view.value.ty + dy })
  }

  function pinchOf(): { distance: number; mid: Point } {
    const [a, b] = [...pointers.values()]
    return {
      distance: Math.max(1, Math.hypot(a.x - b.x, a.y - b.y)),
      mid: { x: (a.x + b.x) / 2, y: (a.y + b.y) / 2 },
    }
  }

  function pointerDown(p: EditorPointer): void {
    pointers.set(p.pointerId, p)
    if (!frame.value) return
    if (pointers.size === 2) {
      draft.value = null
      draftLine.value = null
      gesture = { kind: 'pinch', ...pinchOf(), view: view.value }
      return
    }
    if (pointers.size > 2) return
    const at = toImage(view.value, p)
    if (mode.value === 'draw') {
      gesture = { kind: 'draw', from: at }
      draft.value = { id: null, roi: rectFromPoints(at, at, frame.value) }
      return
    }
    if (mode.value === 'scale') {
      gesture = { kind: 'scale', from: at }
      draftLine.value = { from: at, to: at }
      return
    }
    const hit = hitTest(regions.value, view.value, p)
    if (hit?.corner) {
      const region = regions.value.find((r) => r.id === hit.id)
      if (region) {
        gesture = { kind: 'corner', id: hit.id, corner: hit.corner, roi: region.roi }
        draft.value = { id: hit.id, roi: region.roi }
        return
      }
    }
    gesture = { kind: 'pan', start: p, view: view.value, hitId: hit?.id ?? null, moved: false }
  }

  function pointerMove(p: EditorPointer): void {
    if (!pointers.has(p.pointerId)) return
    pointers.set(p.pointerId, p)
    const f = frame.value
    if (!f || !gesture) return
    const at = toImage(view.value, p)
    switch (gesture.kind) {
      case 'pinch': {
        const now = pinchOf()
        const zoomed = zoomAt(
          gesture.view,
          now.distance / gesture.distance,
          gesture.mid.x,
          gesture.mid.y,
        )
        setView({
          ...zoomed,
          tx: zoomed.tx + now.mid.x - gesture.mid.x,
          ty: zoomed.ty + now.mid.y - gesture.mid.y,
        })
        break
      }
      case 'pan': {
        const dx = p.x - gesture.start.x
        const dy = p.y - gesture.start.y
        if (!gesture.moved && Math.hypot(dx, dy) < TAP_SLOP_PX) return
        gesture.moved = true
        setView({ ...gesture.view, tx: gesture.view.tx + dx, ty: gesture.view.ty + dy })
        break
      }
      case 'corner':
        draft.value = { id: gesture.id, roi: moveCorner(gesture.roi, gesture.corner, at, f) }
        break
      case 'draw':
        draft.value = { id: null, roi: rectFromPoints(gesture.from, at, f) }
        break
      case 'scale':
        draftLine.value = { from: gesture.from, to: at }
        break
    }
  }

  function pointerUp(p: EditorPointer): void {
    pointers.delete(p.pointerId)
    const g = gesture
    if (g?.kind === 'pinch') {
      if (pointers.size === 0) gesture = null
      return
    }
    gesture = null
    if (!g) return
    if (g.kind === 'pan' && !g.moved && g.hitId) events.toggle(g.hitId)
    if (g.kind === 'corner' && draft.value) {
      const roi = draft.value.roi
      if (JSON.stringify(roi) !== JSON.stringify(g.roi)) events.adjust(g.id, roi)
    }
    if (g.kind === 'draw' && draft.value) {
      const roi = draft.value.roi
      if (roi.w >= MIN_REGION_PX && roi.h >= MIN_REGION_PX) events.draw(roi)
      mode.value = 'adjust'
    }
    if (g.kind === 'scale' && draftLine.value) {
      const line = draftLine.value
      if (Math.hypot(line.to.x - line.from.x, line.to.y - line.from.y) >= 2) events.scale(line)
      draftLine.value = null
      mode.value = 'adjust'
    }
    draft.value = null
  }

  function pointerCancel(p: EditorPointer): void {
    pointers.delete(p.pointerId)
    gesture = null
    draft.value = null
    draftLine.value = null
  }

  /** Mouse wheel or trackpad: zoom about the pointer. */
  function wheel(deltaY: number, at: Point): void {
    zoomBy(Math.exp(-deltaY * 0.0015), at)
  }

  return {
    box,
    view,
    zoom,
    mode,
    draft,
    draftLine,
    resize,
    resetView,
    zoomBy,
    panBy,
    pointerDown,
    pointerMove,
    pointerUp,
    pointerCancel,
    wheel,
  }
}
