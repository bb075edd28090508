import { describe, expect, it } from 'vitest'
import { effectivePixelDensity } from '../effectiveDensity'
import { IEC_62676_4_2014, IEC_62676_4_2025_DRAFT, iecLevelFor, iecLevelsFor } from '../iecLevels'
import { pixelDensityFromFov, pixelDensityFromLens, pixelDensityFromTarget } from '../pixelDensity'

describe('pixel density (DOMAIN.md [calc])', () => {
  it('is 137.93 px/m for a 4 mm lens, 2.9 µm pixels, at 10 m', () => {
    // 0.004 / (2.9e-6 · 10)
    expect(
      pixelDensityFromLens({ focalLengthMm: 4, pixelPitchUm: 2.9, distanceM: 10 }),
    ).toBeCloseTo(137.93, 2)
  })

  it('is 96.0 px/m for 1920 px across a 90° field of view at 10 m', () => {
    // 1920 / (2·10·tan 45°)
    expect(pixelDensityFromFov({ widthPx: 1920, horizontalFovDeg: 90, distanceM: 10 })).toBeCloseTo(
      96,
      10,
    )
  })

  it('is measured pixels over printed metres for a target', () => {
    // A 200 mm scale bar spanning 50 px: 50 / 0.2 = 250 px/m.
    expect(pixelDensityFromTarget({ measuredPx: 50, printedSizeMm: 200 })).toBeCloseTo(250, 12)
  })

  it('rejects a field of view of 180° or more and missing values', () => {
    expect(() =>
      pixelDensityFromFov({ widthPx: 1920, horizontalFovDeg: 180, distanceM: 10 }),
    ).toThrow(new RangeError('horizontalFovDeg must be below 180° (got 180).'))
    expect(() => pixelDensityFromLens({ focalLengthMm: 4, pixelPitchUm: 2.9 } as never)).toThrow(
      new RangeError('distanceM must be a positive finite number (got undefined).'),
    )
  })
})

describe('IEC 62676-4 levels', () => {
  it('holds the 2014/2015 values 12.5, 25, 62.5, 125, 250, 1000 px/m [std]', () => {
    expect(IEC_62676_4_2014.map((l) => [l.id, l.minPxPerM])).toEqual([
      ['monitor', 12.5],
      ['detect', 25],
      ['observe', 62.5],
      ['recognise', 125],
      ['identify', 250],
      ['inspect', 1000],
    ])
  })

  it('holds the 2025 draft values 20, 40, 80, 125, 250, 500, 1500 px/m, marked unverified [std, draft]', () => {
    expect(IEC_62676_4_2025_DRAFT.map((l) => l.minPxPerM)).toEqual([
      20, 40, 80, 125, 250, 500, 1500,
    ])
    for (const l of IEC_62676_4_2025_DRAFT) expect(l.source).toContain('level names unverified')
  })

  it('maps a density to the highest level met in each scheme', () => {
    // 137.93 px/m (DOMAIN.md lens example): recognise (≥ 125) in 2014; 4th draft level (≥ 125).
    expect(iecLevelsFor(137.93)).toMatchObject({
      iec2014: { id: 'recognise' },
      draft2025: { id: 'draft-level-4' },
    })
    // 96 px/m: observe (≥ 62.5) in 2014, 3rd draft level (≥ 80).
    expect(iecLevelFor(96)?.id).toBe('observe')
    expect(iecLevelFor(96, '2025-draft')?.minPxPerM).toBe(80)
    // Boundaries count as met; below the lowest level there is none.
    expect(iecLevelFor(250)?.id).toBe('identify')
    expect(iecLevelFor(12)).toBeNull()
    expect(iecLevelFor(15, '2025-draft')).toBeNull()
  })

  it('rejects an unknown scheme', () => {
    expect(() => iecLevelFor(100, '2017' as '2014')).toThrow(
      new TypeError(`Unknown IEC 62676-4 scheme "2017": use '2014' or '2025-draft'.`),
    )
  })
})

describe('effective pixel density [ours]', () => {
  it('scales the density by MTF50 / reference, never above the nominal', () => {
    const soft = effectivePixelDensity({ pxPerM: 250, mtf50CyPx: 0.15 })
    expect(soft).toMatchObject({
      factor: 0.5,
      effectivePxPerM: 125,
      referenceMtf50CyPx: 0.3,
      isEstimate: true,
    })
    const sharp = effectivePixelDensity({ pxPerM: 250, mtf50CyPx: 0.4, referenceMtf50CyPx: 0.35 })
    expect(sharp.effectivePxPerM).toBe(250)
  })
})
