import { describe, expect, it } from 'vitest'
import { lensHints } from '../lensHints'
import { computeLensReport, type LensInputs } from '../lensReport'

const base: LensInputs = {
  focalLengthMm: 8,
  fNumber: 1.4,
  pixelPitchUm: 2.9,
  sensorWidthPx: 1920,
  focusDistanceM: 10,
  objectDistanceM: 5,
  acceptableBlur: { value: 2, unit: 'px' },
}

describe('lens calculator report', () => {
  it('gives the blur circle of the DOMAIN.md worked example in µm and pixels', () => {
    const r = computeLensReport(base)
    // F = 8 mm, N = 1.4, s = 10 m, d = 5 m → c = 4.5751 µm, 1.58 px at 2.9 µm (DOMAIN.md) [calc].
    expect(r.blurUm).toBeCloseTo(4.5751, 4)
    expect(r.blurPx).toBeCloseTo(1.58, 2)
    expect(r.acceptableBlurUm).toBeCloseTo(5.8, 12) // 2 px × 2.9 µm
    expect(r.objectSharp).toBe(true)
  })

  it('gives the handbook depth of field: 50 mm, f/8, c = 0.03 mm, focused at 5 m', () => {
    const r = computeLensReport({
      ...base,
      focalLengthMm: 50,
      fNumber: 8,
      focusDistanceM: 5,
      objectDistanceM: 5,
      acceptableBlur: { value: 30, unit: 'um' },
    })
    // H = 10 466.7 mm, near 3389.4 mm, far 9527.4 mm (DOMAIN.md handbook case) [paper].
    expect(r.hyperfocalM).toBeCloseTo(10.4667, 4)
    expect(r.nearM).toBeCloseTo(3.3894, 4)
    expect(r.farM).toBeCloseTo(9.5274, 4)
    expect(r.depthM).toBeCloseTo(9.5274 - 3.3894, 3)
  })

  it('puts the near limit exactly where the blur reaches the acceptable size', () => {
    const at5 = { ...base, focusDistanceM: 5 } // below the hyperfocal 7.89 m, so the far limit is finite
    const r = computeLensReport(at5)
    expect(r.farM).toBeLessThan(Infinity)
    const atNear = computeLensReport({ ...at5, objectDistanceM: r.nearM })
    const atFar = computeLensReport({ ...at5, objectDistanceM: r.farM })
    // Thin lens: the same c formula bounds the zone [calc].
    expect(atNear.blurUm).toBeCloseTo(r.acceptableBlurUm, 9)
    expect(atFar.blurUm).toBeCloseTo(r.acceptableBlurUm, 9)
    const beyond = computeLensReport({ ...at5, objectDistanceM: r.farM * 1.05 })
    expect(beyond.objectSharp).toBe(false)
  })

  it('gives pixel density and the IEC 62676-4 levels of both schemes', () => {
    const r = computeLensReport({ ...base, focalLengthMm: 4, objectDistanceM: 10 })
    // PD = 4 mm / (2.9 µm · 10 m) = 137.93 px/m (DOMAIN.md) [calc].
    expect(r.pixelDensityPxPerM).toBeCloseTo(137.93, 2)
    expect(r.frameWidthM).toBeCloseTo(1920 / 137.931, 3)
    // 2014: recognise ≥ 125, identify ≥ 250 [std]; 2025 draft level 4 = 125 px/m [std, draft].
    expect(r.iec2014?.id).toBe('recognise')
    expect(r.iec2025Draft?.minPxPerM).toBe(125)
  })

  it('gives the back-focus tolerance δ = c·N/(1 − F/s) for the acceptable blur', () => {
    const r = computeLensReport(base)
    // c ≤ 5.8 µm at f/1.4 → ±8.1 µm at infinity (DOMAIN.md); at s = 10 m with F = 8 mm × 1/(1 − 0.0008).
    expect(r.backFocusToleranceUm).toBeCloseTo((5.8 * 1.4) / (1 - 8 / 10000), 9)
    expect(r.backFocusToleranceUm).toBeCloseTo(8.1, 1)
  })

  it('refuses an object nearer than the focal length', () => {
    expect(() => computeLensReport({ ...base, objectDistanceM: 0.005 })).toThrow(RangeError)
  })
})

describe('refocus hints', () => {
  it('say when the object is outside the sharp zone, with the numbers', () => {
    const inputs = { ...base, objectDistanceM: 2 }
    const hints = lensHints(inputs, computeLensReport(inputs))
    const soft = hints.find((h) => h.id === 'object-soft')
    expect(soft?.tone).toBe('warn')
    expect(soft?.text).toMatch(/outside the sharp zone/)
    expect(hints.some((h) => h.id === 'object-sharp')).toBe(false)
  })

  it('always carry the iris, varifocal, back-focus and infrared advice', () => {
    const hints = lensHints(base, computeLensReport(base))
    expect(hints.map((h) => h.id)).toEqual(
      expect.arrayContaining(['iris-open', 'varifocal', 'back-focus', 'infrared']),
    )
    // 5.8 µm × 1.4 / (1 − 8 mm / 10 m) = 8.1265 µm, shown to 3 figures [calc].
    expect(hints.find((h) => h.id === 'back-focus')?.text).toContain('±8.13 µm')
  })

  it('mention the hyperfocal distance when the far limit is infinite', () => {
    const inputs = {
      ...base,
      focalLengthMm: 2.8,
      fNumber: 2,
      focusDistanceM: 5,
      objectDistanceM: 20,
    }
    const r = computeLensReport(inputs)
    expect(r.farM).toBe(Infinity)
    expect(lensHints(inputs, r).some((h) => h.id === 'hyperfocal')).toBe(true)
  })
})
