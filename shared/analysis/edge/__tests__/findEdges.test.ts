import { describe, expect, it } from 'vitest'
import {
  renderTargetFrame,
  type TargetFrame,
  type TargetFrameSpec,
} from '../../../../tests/fixtures/edges/frame'
import { toGreyImage } from '../../image/luminance'
import type { GreyImage } from '../../types'
import { findEdges, type FoundEdge } from '../findEdges'

function frame(spec: TargetFrameSpec): { f: TargetFrame; img: GreyImage } {
  const f = renderTargetFrame(spec)
  return {
    f,
    img: toGreyImage({ width: f.width, height: f.height, data: f.codes, channels: 1, bitDepth: 8 }),
  }
}

/** The side (of `sides`) whose midpoint lies inside the region, with the same orientation. */
function sideOf(edge: FoundEdge, sides: TargetFrame['targetEdges']) {
  const { x, y, w, h } = edge.roi
  return sides.find(
    (t) =>
      t.orientation === edge.orientation && t.x >= x && t.x <= x + w && t.y >= y && t.y <= y + h,
  )
}

/** Every region lies on a square side (or, when the sheet is turned, a sheet side): one each. */
function expectTargetSides(found: FoundEdge[], f: TargetFrame, atLeast: number, sheetToo = false) {
  const allowed = sheetToo ? [...f.targetEdges, ...f.sheetEdges] : f.targetEdges
  for (const e of found)
    expect({ roi: e.roi, side: sideOf(e, allowed) !== undefined }).toEqual({
      roi: e.roi,
      side: true,
    })
  const sides = new Set(found.map((e) => sideOf(e, allowed)))
  expect(sides.size).toBe(found.length) // one region per side
  expect(found.filter((e) => sideOf(e, f.targetEdges)).length).toBeGreaterThanOrEqual(atLeast)
}

describe('finding slanted edges in a whole frame', () => {
  it('finds the sides of the target squares (5°) and nothing among axis-aligned panels, borders, a 30° square and a thin line', () => {
    const { f, img } = frame({ width: 1920, height: 1080, sigmaPx: 1.2, snr: 100, seed: 3 })
    const found = findEdges(img)
    expectTargetSides(found, f, 15)
    for (const e of found) {
      expect(Math.abs(Math.abs(e.angleDeg) - 5)).toBeLessThan(0.2)
      expect(e.contrast).toBeGreaterThan(0.5) // 0.2 vs 0.8 linear: Michelson 0.6
    }
  })

  it('ranks the regions best first and gives each enough room across the edge', () => {
    const { img } = frame({ width: 1920, height: 1080, sigmaPx: 1.5, seed: 4 })
    const found = findEdges(img)
    for (let i = 1; i < found.length; i++)
      expect(found[i].score).toBeLessThanOrEqual(found[i - 1].score)
    for (const e of found)
      expect(e.orientation === 'vertical' ? e.roi.w : e.roi.h).toBeGreaterThanOrEqual(64)
  })

  it('finds nothing in a frame with the distractors only', () => {
    const { img } = frame({ width: 1920, height: 1080, target: false, snr: 100, seed: 5 })
    expect(findEdges(img)).toEqual([])
  })

  it('finds the target in a dark, noisy exposure with the sheet turned by 3° (its own sides become slanted edges)', () => {
    const { f, img } = frame({
      width: 1600,
      height: 1200,
      sigmaPx: 2,
      exposure: 0.15,
      snr: 40,
      sheetRotationDeg: 3,
      seed: 6,
    })
    const found = findEdges(img)
    expectTargetSides(found, f, 14, true)
    for (const e of found) {
      const angle = sideOf(e, f.targetEdges) ? 8 : 3
      expect(Math.abs(Math.abs(e.angleDeg) - angle)).toBeLessThan(0.3)
    }
  })

  it('finds the target in a 24-megapixel frame', () => {
    const { f, img } = frame({
      width: 6000,
      height: 4000,
      sigmaPx: 3,
      centre: [0.4, 0.55],
      sheetFraction: 0.3,
    })
    expectTargetSides(findEdges(img), f, 15)
  }, 60_000)

  it('stays within the limits it is given and refuses a non-image', () => {
    const { img } = frame({ width: 1280, height: 720, sigmaPx: 1 })
    expect(findEdges(img, { maxEdges: 3 })).toHaveLength(3)
    expect(findEdges(img, { minAngleDeg: 6 })).toEqual([])
    expect(() =>
      findEdges({ width: 2, height: 2, data: [0, 0, 0, 0] } as unknown as GreyImage),
    ).toThrow(TypeError)
  })
})
