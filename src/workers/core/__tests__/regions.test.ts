import { describe, expect, it } from 'vitest'
import { renderTargetFrame } from '../../../../tests/fixtures/edges/frame'
import { greyFromRgba } from '../frame'
import { findRegions, measureRegions } from '../regions'

// The worker's adapter over the engine, on a synthetic camera frame of the printed target
// blurred by a Gaussian of known σ (tests/fixtures/edges/frame.ts, point-sampled, 8-bit sRGB).
// Oracles [calc, DOMAIN.md]: Gaussian MTF50·σ = 0.187391; 10–90 % rise = 2.563103·σ.

const SIGMA = 1.6
// Squares about 150 px a side: the edge search wants ≥ 120 px edges (shared/target/sizing.ts).
const frame = renderTargetFrame({ width: 1280, height: 800, sigmaPx: SIGMA, sheetFraction: 0.62 })
const rgba = new Uint8ClampedArray(frame.width * frame.height * 4)
frame.codes.forEach((c, i) => rgba.set([c, c, c, 255], 4 * i))
const grey = greyFromRgba(rgba, frame.width, frame.height)

describe('finding and measuring regions in the worker', () => {
  it('finds the sides of the target squares and measures each near the analytic MTF50', () => {
    const stages: string[] = []
    const found = findRegions(grey, (_, stage) => stages.push(stage))
    expect(found.length).toBeGreaterThanOrEqual(8)
    expect(stages).toContain('edges')
    const out = measureRegions(
      grey,
      found.map((f, i) => ({ id: `r${i}`, roi: f.roi, orientation: f.orientation })),
    )
    const expected = 0.187391 / SIGMA
    for (const o of out) {
      expect(o.ok).toBe(true)
      if (!o.ok) continue
      expect(Math.abs(o.measurement.mtf50! - expected) / expected).toBeLessThan(0.03)
      expect(Math.abs(Math.abs(o.measurement.angleDeg) - 5)).toBeLessThan(0.3)
    }
  })

  it('gives each edge a profile that rises from 0 to 1 with the rise of the blur', () => {
    const [f] = findRegions(grey)
    const [o] = measureRegions(grey, [{ id: 'a', roi: f.roi }])
    if (!o.ok) throw new Error(o.error)
    const { xPx, esf, lsf } = o.profile
    expect(esf[0]).toBeCloseTo(0, 1)
    expect(esf[esf.length - 1]).toBeCloseTo(1, 1)
    // The 10 % and 90 % crossings of the profile.
    const at = (level: number) => {
      const i = esf.findIndex((v) => v >= level)
      return xPx[i - 1] + ((level - esf[i - 1]) / (esf[i] - esf[i - 1])) * (xPx[i] - xPx[i - 1])
    }
    expect(at(0.9) - at(0.1)).toBeCloseTo(2.563103 * SIGMA, 0)
    // The line spread peaks (at 1) on the edge.
    const peak = lsf.indexOf(Math.max(...lsf))
    expect(lsf[peak]).toBe(1)
    expect(Math.abs(xPx[peak])).toBeLessThan(0.5)
  })

  it('lets one bad region fail with a message while the others are measured', () => {
    const [f] = findRegions(grey)
    const out = measureRegions(grey, [
      { id: 'good', roi: f.roi },
      { id: 'tiny', roi: { x: f.roi.x, y: f.roi.y, w: 10, h: 10 } },
      { id: 'flat', roi: { x: 5, y: 200, w: 64, h: 64 } },
      { id: 'outside', roi: { x: 1300, y: 10, w: 50, h: 50 } },
    ])
    expect(out.map((o) => [o.id, o.ok])).toEqual([
      ['good', true],
      ['tiny', false],
      ['flat', false],
      ['outside', false],
    ])
    const errors = out.flatMap((o) => (o.ok ? [] : [o.error]))
    expect(errors[0]).toMatch(/too small/)
    expect(errors[1]).toMatch(/No usable edge/)
    expect(errors[2]).toBe('The region lies outside the frame.')
  })

  it('cuts a region that reaches past the frame to the frame', () => {
    const [f] = findRegions(grey)
    const [o] = measureRegions(grey, [{ id: 'a', roi: { ...f.roi, w: f.roi.w + 5000 } }])
    expect(o.roi.x + o.roi.w).toBe(frame.width)
  })
})
