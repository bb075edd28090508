import { describe, expect, it } from 'vitest'
import { loadReference } from '../../../../tests/fixtures/reference/load'
import { BORDER_RULES, type BorderRule } from '../../convolve/border'
import { correlate2d } from '../../convolve/convolve2d'
import { brenner } from '../brenner'
import { focusMeasures } from '../focusMeasures'
import { laplacianVariance } from '../laplacianVariance'
import { normalisedVariance } from '../normalisedVariance'
import { tenengrad } from '../tenengrad'

/** DOMAIN.md's 8 × 8 step: columns 0–3 = 0, columns 4–7 = 100. */
function step(): { width: number; height: number; data: Uint8Array } {
  const data = new Uint8Array(64)
  for (let y = 0; y < 8; y++) for (let x = 4; x < 8; x++) data[y * 8 + x] = 100
  return { width: 8, height: 8, data }
}

interface FocusRef {
  images: Record<string, { width: number; height: number; data: number[] }>
  cases: {
    label: string
    roi: { x: number; y: number; width: number; height: number } | null
    byBorder: Record<BorderRule, { source: string; laplacianVariance: number; tenengrad: number }>
    brenner: number
    normalisedVariance: number
  }[]
}
const ref = loadReference<FocusRef>('focus.json')

describe('focus measures on the 8 × 8 step (DOMAIN.md oracles [calc])', () => {
  it('variance of the Laplacian is 2500 with replicate or mirror borders, 5000 with wrap, 5625 with zero', () => {
    // 16 pixels at ±100 beside the step, 48 at 0: variance 16·100²/64 = 2500; wrap adds the
    // step between columns 7 and 0 (5000); zero padding adds the image's own outline (5625).
    expect(laplacianVariance(step(), { border: 'replicate' })).toBeCloseTo(2500, 9)
    expect(laplacianVariance(step(), { border: 'reflect101' })).toBeCloseTo(2500, 9)
    expect(laplacianVariance(step(), { border: 'symmetric' })).toBeCloseTo(2500, 9)
    expect(laplacianVariance(step(), { border: 'wrap' })).toBeCloseTo(5000, 9)
    expect(laplacianVariance(step(), { border: 'zero' })).toBeCloseTo(5625, 9)
  })

  it('uses the replicate border by default', () => {
    expect(laplacianVariance(step())).toBeCloseTo(2500, 9)
  })

  it('Tenengrad is 2 560 000 with replicate borders', () => {
    // 16 pixels beside the step with Gx = (1 + 2 + 1)·100 = 400: 16·400² = 2 560 000.
    expect(tenengrad(step())).toBeCloseTo(2_560_000, 6)
    expect(tenengrad(step(), { reduce: 'mean' })).toBeCloseTo(2_560_000 / 64, 6)
  })

  it('Brenner is 160 000', () => {
    // Two pairs per row straddle the step: 8·2·100² = 160 000.
    expect(brenner(step())).toBe(160_000)
    expect(brenner(step(), { reduce: 'mean' })).toBeCloseTo(160_000 / 48, 9)
  })

  it('normalised variance is 50', () => {
    // μ = 50, σ² = 2500 → 2500 / 50 = 50.
    expect(normalisedVariance(step())).toBeCloseTo(50, 12)
  })

  it('gives the same numbers for 8-bit and float input', () => {
    const u8 = step()
    const f32 = { ...u8, data: Float32Array.from(u8.data) }
    expect(focusMeasures(f32)).toEqual(focusMeasures(u8))
  })
})

describe('focus measures against OpenCV and scipy (tests/fixtures/reference/focus.json)', () => {
  for (const c of ref.cases) {
    const imageName = c.label.replace(' (roi, isolated)', '')
    const src = ref.images[imageName]
    const image = { width: src.width, height: src.height, data: Uint8Array.from(src.data) }
    const roi = c.roi ?? undefined
    for (const border of BORDER_RULES) {
      it(`${c.label}, ${border}: Laplacian variance and Tenengrad match ${border === 'wrap' ? 'scipy' : 'OpenCV'}`, () => {
        const expected = c.byBorder[border] // Source: expected.source, via make_reference.py.
        expect(laplacianVariance(image, { roi, border }) / expected.laplacianVariance).toBeCloseTo(
          1,
          11,
        )
        expect(tenengrad(image, { roi, border }) / expected.tenengrad).toBeCloseTo(1, 11)
      })
    }
    it(`${c.label}: Brenner and normalised variance match numpy`, () => {
      expect(brenner(image, { roi })).toBe(c.brenner) // integer sums are exact
      expect(normalisedVariance(image, { roi }) / c.normalisedVariance).toBeCloseTo(1, 11)
    })
  }
})

describe('fast interior loop and border frame', () => {
  // The fused loops must give what a plain correlation gives (our correlate2d, itself checked
  // against scipy and OpenCV) on every shape, including 1-pixel-wide and 2-pixel-tall images.
  const shapes = [
    [1, 1],
    [1, 7],
    [7, 1],
    [2, 2],
    [5, 3],
    [9, 6],
  ]
  const lapKernel = { width: 3, height: 3, data: [0, 1, 0, 1, -4, 1, 0, 1, 0] }
  const sobelX = { width: 3, height: 3, data: [-1, 0, 1, -2, 0, 2, -1, 0, 1] }
  const sobelY = { width: 3, height: 3, data: [-1, -2, -1, 0, 0, 0, 1, 2, 1] }
  for (const [w, h] of shapes) {
    it(`agrees with a plain 3 × 3 correlation on a ${w} × ${h} image for every border`, () => {
      const data = Float64Array.from({ length: w * h }, (_, i) => ((i * 37) % 11) + 0.5 * i)
      const image = { width: w, height: h, data }
      for (const border of BORDER_RULES) {
        const out = new Float64Array(w * h)
        correlate2d(image, lapKernel, { border, output: out })
        const mean = out.reduce((a, v) => a + v, 0) / out.length
        const variance = out.reduce((a, v) => a + (v - mean) ** 2, 0) / out.length
        expect(laplacianVariance(image, { border })).toBeCloseTo(variance, 8)
        const gx = new Float64Array(w * h)
        const gy = new Float64Array(w * h)
        correlate2d(image, sobelX, { border, output: gx })
        correlate2d(image, sobelY, { border, output: gy })
        const ten = gx.reduce((a, v, i) => a + v * v + gy[i] * gy[i], 0)
        expect(tenengrad(image, { border })).toBeCloseTo(ten, 8)
      }
    })
  }
})

describe('regions and bad input', () => {
  it('measures a region as its own image and accepts the short w/h form', () => {
    const big = { width: 20, height: 12, data: new Uint8Array(240) }
    // Paste the step at (5, 2); a bright pixel just outside the region must not matter.
    const s = step()
    for (let y = 0; y < 8; y++)
      for (let x = 0; x < 8; x++) big.data[(y + 2) * 20 + x + 5] = s.data[y * 8 + x]
    big.data[1 * 20 + 6] = 255
    expect(laplacianVariance(big, { roi: { x: 5, y: 2, width: 8, height: 8 } })).toBeCloseTo(
      2500,
      9,
    )
    expect(tenengrad(big, { roi: { x: 5, y: 2, w: 8, h: 8 } })).toBeCloseTo(2_560_000, 6)
  })

  it('rejects regions outside the image, unknown options and black regions with clear messages', () => {
    expect(() => laplacianVariance(step(), { roi: { x: 4, y: 0, width: 8, height: 8 } })).toThrow(
      new RangeError('The region 8 × 8 at (4, 0) does not fit inside the 8 × 8 image.'),
    )
    expect(() => tenengrad(step(), { roi: { x: 0, y: 0, width: 0, height: 8 } })).toThrow(
      new RangeError(
        'The region must have integer x, y and a positive integer width and height (got 0, 0, 0 × 8).',
      ),
    )
    expect(() => tenengrad(step(), { reduce: 'max' as 'sum' })).toThrow(
      new TypeError(`Unknown reduce option "max": use 'sum' or 'mean'.`),
    )
    expect(() => brenner({ width: 2, height: 2, data: new Uint8Array(4) })).toThrow(
      new RangeError('The Brenner measure needs a region at least 3 pixels wide (got 2).'),
    )
    expect(() => normalisedVariance({ width: 2, height: 2, data: new Uint8Array(4) })).toThrow(
      new RangeError(
        'Normalised variance needs a region with a positive mean (got 0); is the image black?',
      ),
    )
    expect(
      focusMeasures({ width: 3, height: 3, data: new Uint8Array(9) }).normalisedVariance,
    ).toBeNull()
  })
})
