import { beforeAll, describe, expect, it } from 'vitest'
import { expectedMtf50, expectedSfr, firstBelow } from '../../../../tests/fixtures/edges/analytic'
import {
  CONDITIONS,
  edgeCases,
  kernelSize,
  renderCases,
  ROI_PX,
  type Condition,
  type EdgeCase,
} from '../../../../tests/fixtures/edges/cases'
import { toGreyImage } from '../../image/luminance'
import type { EdgeMeasurement } from '../../types'
import { measureEdge } from '../measureEdge'

// Expected values: kernel OTF (Goodman, Introduction to Fourier Optics: Gaussian exp(−2π²σ²f²),
// disk 2J1(2πRf)/(2πRf)) × square-pixel aperture projected on the edge normal
// sinc(f cos θ)·sinc(f sin θ) (DOMAIN.md), solved for the crossing by bisection in analytic.ts.
// Bars: DESIGN.md / issue 3 quality bar (1 % median, 3 % worst; kernel within 10 %).

interface Result {
  c: EdgeCase
  m: EdgeMeasurement
  mtf50Err: number
}

const results: Result[] = []

beforeAll(() => {
  const cases = edgeCases()
  const frames = renderCases(cases)
  cases.forEach((c, i) => {
    const m = measureEdge(toGreyImage(frames[i]), { x: 0, y: 0, w: ROI_PX, h: ROI_PX })
    const expected = expectedMtf50(c.kernel, c.angleDeg)
    results.push({ c, m, mtf50Err: ((m.mtf50 ?? NaN) - expected) / expected })
  })
}, 120_000)

const median = (v: number[]) => {
  const a = [...v].sort((x, y) => x - y)
  const mid = a.length >> 1
  return a.length % 2 ? a[mid] : (a[mid - 1] + a[mid]) / 2
}
const of = (condition: Condition) => results.filter((r) => r.c.condition === condition)

describe('e-SFR of synthetic slanted edges (σ 0.5–3 px, R 1–4 px, 3–12°, both orientations and polarities, 120 × 120 px)', () => {
  it.each(CONDITIONS)(
    '%s edges: MTF50 within 1 percent median and 3 percent worst of the analytic value',
    (condition) => {
      const errs = of(condition).map((r) => Math.abs(r.mtf50Err))
      expect(errs).toHaveLength(144)
      expect(median(errs)).toBeLessThan(0.01)
      expect(Math.max(...errs)).toBeLessThan(0.03)
    },
  )

  // Noise-free 8-bit data leave a floor of ≈ 0.015 in the SFR where the true MTF is ≈ 0
  // (σ 3 px at Nyquist): quantisation, not blur.
  it('clean edges: the whole MTF curve to Nyquist within 0.02 of the analytic curve', () => {
    for (const { c, m } of of('clean')) {
      for (const [f, v] of m.mtf) {
        if (f > 0.5) break
        expect(Math.abs(v - expectedSfr(c.kernel, f, c.angleDeg))).toBeLessThan(0.02)
      }
    }
  })

  it('clean edges: MTF at Nyquist within 0.02 and MTF10 within 2 % of the analytic values', () => {
    for (const { c, m } of of('clean')) {
      expect(Math.abs(m.mtfNyquist - expectedSfr(c.kernel, 0.5, c.angleDeg))).toBeLessThan(0.02)
      const mtf10 = firstBelow((f) => expectedSfr(c.kernel, f, c.angleDeg), 0.1)
      if (mtf10 < 1) expect(Math.abs((m.mtf10 ?? NaN) - mtf10) / mtf10).toBeLessThan(0.02)
    }
  })

  it('reports the edge angle within 0.02° (0.1° with noise or JPEG), the orientation and the polarity', () => {
    for (const { c, m } of results) {
      expect(Math.abs(Math.abs(m.angleDeg) - c.angleDeg)).toBeLessThan(
        c.condition === 'clean' ? 0.02 : 0.1,
      )
      expect(m.orientation).toBe(c.orientation)
      expect(m.polarity).toBe(c.polarity)
    }
  })

  it('fits the kernel size within 10 % on every edge', () => {
    for (const { c, m } of results) {
      const fit = c.kernel.type === 'gaussian' ? m.psf.gaussian : m.psf.disk
      expect(Math.abs(fit.sizePx - kernelSize(c.kernel)) / kernelSize(c.kernel)).toBeLessThan(0.1)
    }
  })

  it('picks the right model for clean edges with σ ≥ 1.3 px or R ≥ 2 px', () => {
    const wide = of('clean').filter(
      (r) => kernelSize(r.c.kernel) >= (r.c.kernel.type === 'gaussian' ? 1.3 : 2),
    )
    expect(wide.length).toBe(96) // σ 1.5, 2, 3 and R 2, 3, 4 × 16 edges
    for (const { c, m } of wide) {
      expect(m.psf.model).toBe(c.kernel.type)
      if (c.kernel.type === 'gaussian') expect(m.psf.sigmaPx).toBeCloseTo(c.kernel.sigmaPx, 1)
      else expect(m.psf.radiusPx).toBeCloseTo(c.kernel.radiusPx, 1)
    }
  })

  it('raises no warning on these well-made edges', () => {
    for (const { c, m } of results) {
      // σ 3 px needs 10 × its rise (≈ 78 px) across: 120 px is enough.
      expect({ case: c, warnings: m.warnings }).toEqual({ case: c, warnings: [] })
    }
  })
})
