import { describe, expect, it } from 'vitest'
import {
  expectedMtf50,
  pixelEsf,
  rise1090,
  type Kernel,
} from '../../../../tests/fixtures/edges/analytic'
import { greyRaw, renderEdgeCodes, renderEdgeLinear } from '../../../../tests/fixtures/edges/render'
import { toGreyImage } from '../../image/luminance'
import type { GreyImage } from '../../types'
import { measureEdge } from '../measureEdge'

const full = (img: GreyImage) => ({ x: 0, y: 0, w: img.width, h: img.height })
const linearImage = (kernel: Kernel, angleDeg: number, extra = {}): GreyImage => {
  const e = renderEdgeLinear({ kernel, angleDeg, ...extra })
  return { width: e.width, height: e.height, data: Float32Array.from(e.data) }
}

describe('edge profile measures', () => {
  it.each<[Kernel, number]>([
    [{ type: 'gaussian', sigmaPx: 1 }, 5],
    [{ type: 'gaussian', sigmaPx: 2.5 }, 8],
    [{ type: 'disk', radiusPx: 2 }, 4],
    [{ type: 'disk', radiusPx: 3.5 }, 10],
  ])(
    '10–90 rise within 2 percent of the pixel-integrated analytic ESF: %j at %i°',
    (kernel, angleDeg) => {
      // Expected: kernel ESF (Gaussian Φ(x/σ); disk ½ + (u√(1−u²) + asin u)/π, DOMAIN.md) averaged
      // over the 1-px pixel projected on the normal, 10 % and 90 % points by bisection.
      const img = linearImage(kernel, angleDeg)
      const m = measureEdge(img, full(img))
      const expected = rise1090((x) => pixelEsf(kernel, x, angleDeg), 40)
      expect(Math.abs(m.rise1090Px - expected) / expected).toBeLessThan(0.02)
    },
  )

  it('measures the noise of the flat areas and the SNR of a noisy edge (SNR 60 → within 15 %)', () => {
    const e = renderEdgeCodes({
      kernel: { type: 'gaussian', sigmaPx: 1 },
      angleDeg: 5,
      snr: 60,
      seed: 11,
    })
    const m = measureEdge(toGreyImage(greyRaw(e.width, e.height, e.codes)), {
      x: 0,
      y: 0,
      w: 120,
      h: 120,
    })
    expect(m.snr ?? 0).toBeGreaterThan(60 * 0.85)
    expect(m.snr ?? 0).toBeLessThan(60 * 1.15)
    expect(m.noise).toBeCloseTo(0.6 / 60, 2)
    expect(m.contrast).toBeCloseTo(0.6, 2)
  })

  it('reports no noise (SNR null) and no overshoot on a noise-free edge', () => {
    const img = linearImage({ type: 'gaussian', sigmaPx: 1 }, 5)
    const m = measureEdge(img, full(img))
    expect(m.noise).toBeLessThan(1e-4)
    expect(m.overshoot).toBeLessThan(0.001)
    expect(m.undershoot).toBeLessThan(0.001)
  })

  it('gives the MTF curve from 0 to 1 c/p in 0.01 steps, starting at 1', () => {
    const img = linearImage({ type: 'disk', radiusPx: 1.5 }, 6)
    const m = measureEdge(img, full(img))
    expect(m.mtf).toHaveLength(101)
    expect(m.mtf[0]).toEqual([0, 1])
    expect(m.mtf[100][0]).toBe(1)
    m.mtf.forEach(([f], i) => expect(f).toBeCloseTo(i / 100, 10))
  })

  it('keeps a whole number of phase cycles of rows', () => {
    // 1/tan 5° = 11.43 rows per cycle: 120 rows hold 10 cycles = 114 rows (DOMAIN.md step 6).
    const img = linearImage({ type: 'gaussian', sigmaPx: 1 }, 5)
    expect(measureEdge(img, full(img)).rowsUsed).toBe(114)
  })

  it('finds the orientation by itself and agrees with the stated one', () => {
    const img = linearImage({ type: 'gaussian', sigmaPx: 1 }, 7, { orientation: 'horizontal' })
    const auto = measureEdge(img, full(img))
    const stated = measureEdge(img, full(img), { orientation: 'horizontal' })
    expect(auto.orientation).toBe('horizontal')
    expect(auto.mtf50).toBe(stated.mtf50)
  })

  it('follows a curved edge with a 2nd-order polynomial fit', () => {
    // Edge x = 60 + (r − 60)·tan 5° + 0.0015 (r − 60)²: a 5.4 px bow over 120 rows.
    const kernel: Kernel = { type: 'gaussian', sigmaPx: 1 }
    const tan = Math.tan((5 * Math.PI) / 180)
    const data = new Float32Array(120 * 120)
    for (let r = 0; r < 120; r++) {
      const slope = tan + 2 * 0.0015 * (r - 59.5)
      const theta = Math.atan(slope)
      const xe = 59.5 + (r - 59.5) * tan + 0.0015 * (r - 59.5) ** 2
      for (let c = 0; c < 120; c++) {
        data[r * 120 + c] =
          0.2 + 0.6 * pixelEsf(kernel, (c - xe) * Math.cos(theta), (theta * 180) / Math.PI)
      }
    }
    const img = { width: 120, height: 120, data }
    const expected = expectedMtf50(kernel, 5)
    const straight = measureEdge(img, full(img))
    const curved = measureEdge(img, full(img), { edgeFitDegree: 2 })
    expect(Math.abs((curved.mtf50 ?? 0) - expected) / expected).toBeLessThan(0.02)
    expect((straight.mtf50 ?? 0) / expected).toBeLessThan(0.9)
  })
})

describe('bad input', () => {
  const img = linearImage({ type: 'gaussian', sigmaPx: 1 }, 5)

  it('rejects regions outside the image or too small, naming the sizes', () => {
    expect(() => measureEdge(img, { x: 100, y: 0, w: 40, h: 40 })).toThrow(
      /does not lie inside the 120 × 120 image/,
    )
    expect(() =>
      measureEdge(img, { x: 0, y: 0, w: 12, h: 60 }, { orientation: 'vertical' }),
    ).toThrow(/at least 16 px across/)
  })

  it('rejects a flat region without an edge', () => {
    const flat = { width: 64, height: 64, data: new Float32Array(64 * 64).fill(0.5) }
    expect(() => measureEdge(flat, full(flat))).toThrow(RangeError)
  })

  it('rejects non-image input and bad options with a TypeError or RangeError', () => {
    const bad = { width: 10, height: 10, data: new Array(100).fill(0) } as unknown as GreyImage
    expect(() => measureEdge(bad, { x: 0, y: 0, w: 10, h: 10 })).toThrow(TypeError)
    expect(() => measureEdge(img, full(img), { edgeFitDegree: 7 })).toThrow(
      /degree must be an integer from 1 to 5/,
    )
  })
})
