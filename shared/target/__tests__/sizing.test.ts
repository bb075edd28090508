import { describe, expect, it } from 'vitest'
import { MIN_EDGE_PX, sizeTarget } from '../sizing'

// Square side of the printed design as a fraction of the sheet width [calc, our layout]:
// 0.88 W / (2 (cos 5° + sin 5°) + 1.5) ≈ 0.24 W.
const t = (5 * Math.PI) / 180
const sideOf = (widthMm: number) => (0.88 * widthMm) / (2 * (Math.cos(t) + Math.sin(t)) + 1.5)
// Pixel density from lens data, PD = F / (pitch · d) (DOMAIN.md) [calc].
const pdLens = (fMm: number, pitchUm: number, dM: number) => fMm / 1000 / ((pitchUm / 1e6) * dM)

describe('target sizing', () => {
  it('finds no standard sheet for a 4 mm lens at 10 m and says how close to come', () => {
    const s = sizeTarget({
      distanceM: 10,
      sensorWidthPx: 1920,
      focalLengthMm: 4,
      pixelPitchUm: 2.9,
    })
    expect(s.pixelDensityPxPerM).toBeCloseTo(137.93, 2) // DOMAIN.md [calc]
    expect(s.requiredSquareMm).toBeCloseTo((120 / pdLens(4, 2.9, 10)) * 1000, 6) // 870.0 mm
    expect(s.requiredSquareMm).toBeCloseTo(870.0, 1)
    expect(s.recommended).toBeNull()
    const a0 = s.options.find((o) => o.sheet.name === 'A0')!
    expect(a0.edgePx).toBeCloseTo((sideOf(841) / 1000) * pdLens(4, 2.9, 10), 9) // 27.8 px
    expect(a0.meetsEdge).toBe(false)
    // Edge px ∝ 1/d: A0 works out to 10 m × 27.84 / 120 = 2.32 m [calc].
    expect(s.maxDistanceForLargestM).toBeCloseTo((10 * a0.edgePx) / 120, 9)
    expect(s.maxDistanceForLargestM).toBeCloseTo(2.32, 2)
    // A custom print would need 870.0 / 0.24 = 3625 mm width → 3630 mm, rounded up to 10 mm.
    expect(s.customOption?.sheet.widthMm).toBe(3630)
    expect(s.customOption?.meetsEdge).toBe(true)
  })

  it('recommends the smallest ISO sheet whose squares span 120 px (12 mm at 5 m → A0, A1 just short)', () => {
    const s = sizeTarget({
      distanceM: 5,
      sensorWidthPx: 2688,
      focalLengthMm: 12,
      pixelPitchUm: 2.9,
    })
    const pd = pdLens(12, 2.9, 5) // 827.59 px/m [calc]
    expect(s.pixelDensityPxPerM).toBeCloseTo(pd, 9)
    const a1 = s.options.find((o) => o.sheet.name === 'A1')!
    expect(a1.edgePx).toBeCloseTo((sideOf(594) / 1000) * pd, 9) // 117.98 px < 120
    expect(a1.meetsEdge).toBe(false)
    expect(s.recommended?.sheet.name).toBe('A0')
    expect(s.recommended?.squareFrameFraction).toBeCloseTo(s.recommended!.edgePx / 2688, 12)
    expect(s.maxDistanceForLargestM).toBeNull()
  })

  it('works from the field of view: 1920 px, 90°, at 1 m → 960 px/m → A1', () => {
    // PD = 1920 / (2 · 1 · tan 45°) = 960 px/m (DOMAIN.md formula; 96.0 at 10 m) [calc].
    const s = sizeTarget({ distanceM: 1, sensorWidthPx: 1920, horizontalFovDeg: 90 })
    expect(s.pixelDensityPxPerM).toBeCloseTo(960, 9)
    expect(s.requiredSquareMm).toBeCloseTo(125, 9)
    expect(s.recommended?.sheet.name).toBe('A1') // A2 side 100.8 mm < 125 mm ≤ A1 side 142.6 mm
    expect(s.frameWidthM).toBeCloseTo(2, 9)
  })

  it('gives A4 for a close inspection camera and reports its share of the frame', () => {
    const s = sizeTarget({
      distanceM: 0.8,
      sensorWidthPx: 2448,
      focalLengthMm: 16,
      pixelPitchUm: 3.45,
    })
    expect(s.recommended?.sheet.name).toBe('A4')
    const edge = (sideOf(210) / 1000) * pdLens(16, 3.45, 0.8) // 292.2 px [calc]
    expect(s.recommended?.edgePx).toBeCloseTo(edge, 9)
    expect(s.recommended?.squareFrameFraction).toBeCloseTo(edge / 2448, 12) // ≈ 0.12
    expect(s.recommended?.sheetFrameFraction).toBeCloseTo((0.21 * pdLens(16, 3.45, 0.8)) / 2448, 12)
  })

  it('uses US sizes when asked and honours a different edge need', () => {
    const s = sizeTarget({
      distanceM: 0.8,
      sensorWidthPx: 2448,
      focalLengthMm: 16,
      pixelPitchUm: 3.45,
      family: 'us',
    })
    expect(s.options.map((o) => o.sheet.name)).toEqual(['Letter', 'Tabloid'])
    expect(s.recommended?.sheet.name).toBe('Letter')
    const strict = sizeTarget({
      distanceM: 0.8,
      sensorWidthPx: 2448,
      focalLengthMm: 16,
      pixelPitchUm: 3.45,
      minEdgePx: 300,
    })
    expect(strict.recommended?.sheet.name).toBe('A3')
    expect(MIN_EDGE_PX).toBe(120)
  })

  it('explains bad input', () => {
    expect(() => sizeTarget({ distanceM: 5, sensorWidthPx: 1920 })).toThrow(
      /focal length and pixel pitch, or the horizontal field of view/,
    )
    expect(() => sizeTarget({ distanceM: -1, sensorWidthPx: 1920, horizontalFovDeg: 90 })).toThrow(
      RangeError,
    )
    expect(() => sizeTarget({ distanceM: 5, sensorWidthPx: 10, horizontalFovDeg: 90 })).toThrow(
      /at least 64 pixels/,
    )
    expect(() =>
      sizeTarget({ distanceM: 5, sensorWidthPx: 1920, horizontalFovDeg: 90, minEdgePx: 0 }),
    ).toThrow(RangeError)
  })
})
