import { describe, expect, it } from 'vitest'
import { renderEdgeLinear } from '../../../../tests/fixtures/edges/render'
import { measureEdge } from '../../mtf/measureEdge'
import type { GreyImage } from '../../types'
import { psfKernel2d } from '../kernel2d'
import { motionBlurHint } from '../motion'

const moments = (k: { width: number; data: Float32Array }) => {
  const half = (k.width - 1) / 2
  let sum = 0
  let sxx = 0
  let max = 0
  k.data.forEach((v, i) => {
    const x = (i % k.width) - half
    sum += v
    sxx += v * x * x
    max = Math.max(max, v)
  })
  return { sum, varX: sxx / sum, max }
}

describe('2-D kernel for display', () => {
  it('samples a Gaussian over whole pixels: sums to 1, variance σ² + 1/12 per axis', () => {
    // Pixel integration adds the variance of a 1-px box, 1/12.
    const k = psfKernel2d('gaussian', 1.5)
    expect([k.width, k.height, k.data.length]).toEqual([15, 15, 225])
    const m = moments(k)
    expect(m.sum).toBeCloseTo(1, 5)
    expect(m.varX).toBeCloseTo(1.5 ** 2 + 1 / 12, 1)
    expect(k.data[7 * 15 + 7]).toBe(m.max)
    expect(k.data[3 * 15 + 5]).toBeCloseTo(k.data[5 * 15 + 3], 7)
  })

  it('draws a disk as a flat-topped kernel within R + ½√2 of the centre', () => {
    const k = psfKernel2d('disk', 3, 11)
    expect(moments(k).sum).toBeCloseTo(1, 5)
    k.data.forEach((v, i) => {
      const r = Math.hypot((i % 11) - 5, Math.floor(i / 11) - 5)
      if (r > 3 + Math.SQRT1_2) expect(v).toBe(0)
    })
    expect(k.data[5 * 11 + 5]).toBeCloseTo(k.data[5 * 11 + 6], 7)
  })

  it('refuses even sizes and non-positive kernel sizes', () => {
    expect(() => psfKernel2d('gaussian', 1, 14)).toThrow(/odd integer/)
    expect(() => psfKernel2d('disk', 0)).toThrow(/positive number/)
  })
})

describe('motion-blur hint', () => {
  const edge = (sigmaPx: number, orientation: 'vertical' | 'horizontal') => {
    const e = renderEdgeLinear({ kernel: { type: 'gaussian', sigmaPx }, angleDeg: 5, orientation })
    const img: GreyImage = { width: 120, height: 120, data: Float32Array.from(e.data) }
    return measureEdge(img, { x: 0, y: 0, w: 120, h: 120 })
  }

  it('suspects horizontal motion when vertical edges are much softer than horizontal ones', () => {
    // Blur along x widens the profile across vertical edges only (DOMAIN.md: motion is directional).
    const hint = motionBlurHint([
      edge(2.5, 'vertical'),
      edge(1, 'horizontal'),
      edge(1.05, 'horizontal'),
    ])
    expect(hint.suspected).toBe(true)
    expect(hint.direction).toBe('horizontal')
    expect(hint.ratio ?? 1).toBeLessThan(0.6)
  })

  it('sees no motion when both orientations agree, and no answer with one orientation only', () => {
    const v = edge(1.5, 'vertical')
    const h = edge(1.5, 'horizontal')
    expect(motionBlurHint([v, h])).toMatchObject({ suspected: false, direction: null })
    expect(motionBlurHint([v, h]).ratio ?? 0).toBeGreaterThan(0.97)
    expect(motionBlurHint([v])).toMatchObject({ suspected: false, ratio: null })
  })
})
