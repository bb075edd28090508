import { describe, expect, it } from 'vitest'
import { sampleCamera } from '@/db/__tests__/sampleCatalog'
import { buildReport, engineTask, thresholdsOf } from '../logic/report'
import { context, measurement, model, region } from './samples'

// What the result screen shows, from invented regions on an "observe" camera (minimum MTF50
// 0.20 c/p, 10 % marginal band, 62.5 px/m, 4 mm lens, 2.9 µm pixels, target at 10 m).

const valid = (...mtf50s: number[]) => mtf50s.map((m) => region(measurement(m)))

describe('the check report', () => {
  it('maps server task ids to the engine and takes the camera’s own thresholds', () => {
    expect(engineTask('plate_reading')).toBe('plate-reading')
    expect(engineTask('observe')).toBe('observe')
    expect(engineTask('custom_dock')).toBeUndefined()
    const t = thresholdsOf(
      context({ camera: sampleCamera(1, { minMtf50CyPx: 0.23, requiredPxPerM: 80 }) }),
    )
    expect(t).toMatchObject({
      minMtf50CyPx: 0.23,
      minPixelDensityPxPerM: 80,
      marginalBand: 0.1,
      driftMarginalRatio: 0.8,
    })
  })

  it('passes, turns marginal within 10 % below the minimum, and fails further below', () => {
    expect(buildReport(valid(0.18, 0.2, 0.22), 'day', context(), null).verdict.verdict).toBe('pass')
    const marginal = buildReport(valid(0.19), 'day', context(), null)
    expect(marginal.verdict.verdict).toBe('marginal')
    expect(marginal.medianMtf50CyPx).toBe(0.19)
    const fail = buildReport(valid(0.15, 0.14, 0.16), 'day', context(), null)
    expect(fail.verdict.verdict).toBe('fail')
    expect(fail.verdict.reasons.find((r) => r.code === 'sharpness')?.message).toContain(
      'Sharpness 0.150 c/p (median MTF50 of 3 edges) is 25 % below the 0.200 c/p minimum for observe.',
    )
  })

  it('leaves out turned-off regions and rejected ones, and says so for the rejected', () => {
    const regions = [
      ...valid(0.21, 0.22),
      region(measurement(0.05), { enabled: false }),
      region(measurement(0.5, { warnings: ['clipping'] })),
      region(null),
    ]
    const r = buildReport(regions, 'day', context(), null)
    expect(r.validCount).toBe(2)
    expect(r.medianMtf50CyPx).toBeCloseTo(0.215, 9)
    expect(r.verdict.verdict).toBe('pass')
    const rejected = r.verdict.reasons.find((x) => x.code === 'edges-rejected')!
    expect(rejected.message).toMatch(
      /^2 of 4 edge regions were not used \(.*clipped.*no usable edge/i,
    )
  })

  it('is inconclusive when no region can be used', () => {
    const r = buildReport(
      [region(measurement(0.3, { warnings: ['roi-too-narrow'] }))],
      'day',
      context(),
      null,
    )
    expect(r.verdict.verdict).toBe('inconclusive')
    expect(r.representativeId).toBeNull()
  })

  it('works out pixel density from the lens (4 mm, 2.9 µm, 10 m → 137.93 px/m, DOMAIN.md) and its IEC level', () => {
    const r = buildReport(valid(0.25), 'day', context(), null)
    expect(r.density?.source).toBe('lens')
    expect(r.density?.pxPerM).toBeCloseTo(137.93, 2)
    // IEC 62676-4:2014: recognise 125 px/m, identify 250 px/m [std].
    expect(r.density?.iec2014?.label).toBe('Recognise')
    // Effective density [ours]: PD × min(1, 0.25 / 0.30).
    expect(r.density?.effective?.effectivePxPerM).toBeCloseTo((137.93 * 0.25) / 0.3, 1)
    expect(r.verdict.reasons.find((x) => x.code === 'pixel-density')?.severity).toBe('ok')
  })

  it('prefers a scale measured on the target, and fails a density below the task’s', () => {
    const r = buildReport(valid(0.25), 'day', context(), { lengthPx: 6, printedMm: 120 })
    expect(r.density).toMatchObject({ source: 'target', pxPerM: 50 })
    expect(r.verdict.verdict).toBe('fail')
    expect(r.density?.iec2014?.label).toBe('Detect')
  })

  it('has no density without a scale or lens data', () => {
    const r = buildReport(valid(0.25), 'day', context({ model: null }), null)
    expect(r.density).toBeNull()
    expect(r.verdict.reasons.some((x) => x.code === 'pixel-density')).toBe(false)
  })

  it('compares with the baseline and, at night, with the day', () => {
    const drift = buildReport(valid(0.21), 'day', context({ baselineMtf50CyPx: 0.3 }), null)
    expect(drift.baselineRatio).toBeCloseTo(0.7, 9)
    expect(drift.verdict.reasons.find((x) => x.code === 'drift')?.severity).toBe('marginal')
    const night = buildReport(valid(0.21), 'night', context({ otherModeMtf50CyPx: 0.3 }), null)
    expect(night.dayNight).toEqual({
      dayMtf50CyPx: 0.3,
      nightMtf50CyPx: 0.21,
      ratio: expect.closeTo(0.7, 9),
    })
    expect(night.verdict.reasons.some((x) => x.code === 'infrared-focus-shift')).toBe(true)
    const day = buildReport(valid(0.3), 'day', context({ otherModeMtf50CyPx: 0.21 }), null)
    expect(day.dayNight?.ratio).toBeCloseTo(0.7, 9)
  })

  it('gives both refocus distances for a defocus disk (DOMAIN.md: 8 mm f/1.4 focused at 10 m, target at 5 m)', () => {
    // Blur circle c = (F²/N)·|d − s| / (d·(s − F)) = 4.5751 µm [calc]; R = c / (2 · pitch).
    const F = 8
    const N = 1.4
    const cMm = (((F * F) / N) * Math.abs(5000 - 10000)) / (5000 * (10000 - F))
    expect(cMm * 1000).toBeCloseTo(4.5751, 4)
    const radiusPx = (cMm * 1000) / (2 * 2.9)
    const regions = [region(measurement(0.2, { psf: { model: 'disk', sizePx: radiusPx } }))]
    const ctx = context({
      camera: sampleCamera(1, { focalLengthMm: F, targetDistanceM: 5 }),
      model: model({ fNumber: N, pixelPitchUm: 2.9 }),
    })
    const r = buildReport(regions, 'day', ctx, null)
    expect(r.refocus?.focus.farther?.focusDistanceM).toBeCloseTo(10, 6)
    expect(r.refocus?.focus.nearer.focusDistanceM).toBeLessThan(5)
    expect(r.refocus?.focus.blurCircleUm).toBeCloseTo(4.5751, 4)
  })

  it('gives no refocus distance for a Gaussian kernel or without lens data, and says why', () => {
    const gauss = buildReport(valid(0.2), 'day', context(), null)
    expect(gauss.refocus).toBeNull()
    expect(gauss.refocusNote).toMatch(/fits a Gaussian better/)
    const disk = [region(measurement(0.2, { psf: { model: 'disk', sizePx: 2 } }))]
    const noModel = buildReport(disk, 'day', context({ model: null }), null)
    expect(noModel.refocusNote).toMatch(/not on the device/)
  })

  it('names haze when the MTF is low near zero although the edge is steep', () => {
    // A steep edge (rise for MTF50 0.3) whose curve is scaled to 0.7: veiling glare.
    const m = measurement(0.3)
    m.mtf = m.mtf.map(([f, v]) => [f, f === 0 ? 1 : 0.7 * v])
    const r = buildReport([region(m)], 'day', context(), null)
    expect(r.haze?.code).toBe('haze')
    expect(r.haze?.message).toMatch(/dirty or scratched dome/)
  })
})
