import { describe, expect, it, vi } from 'vitest'
import { effectScope, ref } from 'vue'
import type { Roi } from '@shared/analysis'
import { clampView, fitView, hitTest, moveCorner, zoomAt } from '../regionEditor/geometry'
import { useRegionEditor } from '../useRegionEditor'

// The region editor's gestures on a 1000 × 500 frame shown in a 500 × 250 box (scale 0.5):
// box point (x, y) is frame point (2x, 2y) until the view moves.

function setup(rois: Roi[] = [{ x: 100, y: 100, w: 200, h: 100 }]) {
  const events = { toggle: vi.fn(), adjust: vi.fn(), draw: vi.fn(), scale: vi.fn() }
  const regions = ref(rois.map((roi, i) => ({ id: `r${i + 1}`, roi })))
  const frame = ref({ width: 1000, height: 500 })
  const scope = effectScope()
  const editor = scope.run(() => useRegionEditor(frame, regions, events))!
  editor.resize({ width: 500, height: 250 })
  const drag = (from: [number, number], to: [number, number], id = 1) => {
    editor.pointerDown({ pointerId: id, x: from[0], y: from[1] })
    editor.pointerMove({ pointerId: id, x: (from[0] + to[0]) / 2, y: (from[1] + to[1]) / 2 })
    editor.pointerMove({ pointerId: id, x: to[0], y: to[1] })
    editor.pointerUp({ pointerId: id, x: to[0], y: to[1] })
  }
  return { editor, events, drag, scope }
}

describe('region editor geometry', () => {
  it('fits the frame in the box, centred, and keeps a zoom point still', () => {
    expect(fitView({ width: 1000, height: 500 }, { width: 500, height: 500 })).toEqual({
      scale: 0.5,
      tx: 0,
      ty: 125,
    })
    const v = zoomAt({ scale: 0.5, tx: 0, ty: 0 }, 3, 200, 100)
    expect(v.scale).toBe(1.5)
    expect([(200 - v.tx) / v.scale, (100 - v.ty) / v.scale]).toEqual([400, 200])
  })

  it('never lets the frame leave the box, nor zoom out past the whole frame', () => {
    const box = { width: 500, height: 250 }
    const frame = { width: 1000, height: 500 }
    expect(clampView({ scale: 1, tx: 300, ty: -900 }, frame, box)).toEqual({
      scale: 1,
      tx: 0,
      ty: -250,
    })
    expect(clampView({ scale: 0.1, tx: 0, ty: 0 }, frame, box).scale).toBe(0.5)
  })

  it('moves one corner and keeps the opposite one, with sides of at least 16 px', () => {
    const roi = { x: 100, y: 100, w: 200, h: 100 }
    const frame = { width: 1000, height: 500 }
    expect(moveCorner(roi, 'se', { x: 340.4, y: 219.6 }, frame)).toEqual({
      x: 100,
      y: 100,
      w: 240,
      h: 120,
    })
    expect(moveCorner(roi, 'nw', { x: 500, y: 500 }, frame)).toEqual({
      x: 284,
      y: 184,
      w: 16,
      h: 16,
    })
    expect(moveCorner(roi, 'ne', { x: 2000, y: -50 }, frame)).toEqual({
      x: 100,
      y: 0,
      w: 900,
      h: 200,
    })
  })

  it('hits a handle only when the region is big enough on screen to show it', () => {
    const regions = [{ id: 'a', roi: { x: 100, y: 100, w: 200, h: 100 } }]
    expect(hitTest(regions, { scale: 0.5, tx: 0, ty: 0 }, { x: 148, y: 103 })).toEqual({
      id: 'a',
      corner: 'se',
    })
    expect(hitTest(regions, { scale: 0.2, tx: 0, ty: 0 }, { x: 60, y: 40 })).toEqual({
      id: 'a',
      corner: null,
    })
    expect(hitTest(regions, { scale: 0.5, tx: 0, ty: 0 }, { x: 400, y: 200 })).toBeNull()
  })
})

describe('region editor gestures', () => {
  it('turns a region off or on with a tap, not with a drag', () => {
    const { editor, events, drag } = setup()
    editor.pointerDown({ pointerId: 1, x: 100, y: 75 })
    editor.pointerUp({ pointerId: 1, x: 103, y: 76 })
    expect(events.toggle).toHaveBeenCalledWith('r1')
    const before = editor.view.value.tx
    editor.zoomBy(2)
    drag([100, 75], [140, 75])
    expect(events.toggle).toHaveBeenCalledTimes(1)
    expect(editor.view.value.tx).not.toBe(before)
  })

  it('adjusts a region by dragging its corner and reports the new rectangle', () => {
    const { editor, events, drag } = setup()
    drag([150, 100], [170, 110])
    expect(events.adjust).toHaveBeenCalledWith('r1', { x: 100, y: 100, w: 240, h: 120 })
    expect(editor.draft.value).toBeNull()
  })

  it('draws a new region in draw mode, then goes back to adjusting; a tiny one is dropped', () => {
    const { editor, events, drag } = setup([])
    editor.mode.value = 'draw'
    drag([10, 10], [60, 40])
    expect(events.draw).toHaveBeenCalledWith({ x: 20, y: 20, w: 100, h: 60 })
    expect(editor.mode.value).toBe('adjust')
    editor.mode.value = 'draw'
    drag([10, 10], [15, 12])
    expect(events.draw).toHaveBeenCalledTimes(1)
  })

  it('draws a scale line in frame pixels', () => {
    const { editor, events, drag } = setup([])
    editor.mode.value = 'scale'
    drag([100, 50], [250, 50])
    expect(events.scale).toHaveBeenCalledWith({ from: { x: 200, y: 100 }, to: { x: 500, y: 100 } })
  })

  it('pinches to zoom about the fingers and zooms with the wheel about the pointer', () => {
    const { editor } = setup([])
    editor.pointerDown({ pointerId: 1, x: 200, y: 100 })
    editor.pointerDown({ pointerId: 2, x: 300, y: 100 })
    editor.pointerMove({ pointerId: 2, x: 400, y: 100 })
    expect(editor.view.value.scale).toBeCloseTo(1, 6)
    editor.pointerUp({ pointerId: 1, x: 200, y: 100 })
    editor.pointerUp({ pointerId: 2, x: 400, y: 100 })
    expect(editor.zoom.value).toBeCloseTo(2, 6)

    const { editor: e2 } = setup([])
    e2.wheel(-400, { x: 120, y: 80 })
    const v = e2.view.value
    expect(v.scale).toBeGreaterThan(0.5)
    expect((120 - v.tx) / v.scale).toBeCloseTo(240, 6)
    expect((80 - v.ty) / v.scale).toBeCloseTo(160, 6)
  })
})
