import { describe, expect, it } from 'vitest'
import { expectedMtf50 } from '../../../../tests/fixtures/edges/analytic'
import { renderEdgeLinear, seededNormal } from '../../../../tests/fixtures/edges/render'
import type { GreyImage } from '../../types'
import { measureEdge, MIN_STEP_TO_NOISE } from '../measureEdge'

const full = (img: GreyImage) => ({ x: 0, y: 0, w: img.width, h: img.height })

/** A square of linear grey 0.5 with Gaussian noise of standard deviation `sigma` added. */
function flat(sizePx: number, sigma: number, seed: number): GreyImage {
  const noise = seededNormal(seed)
  const data = new Float32Array(sizePx * sizePx)
  for (let i = 0; i < data.length; i++) data[i] = 0.5 + sigma * noise()
  return { width: sizePx, height: sizePx, data }
}

describe('a region without a real edge', () => {
  it.each([
    [40, 0],
    [64, 0],
    [40, 0.0025],
    [64, 0.0025],
    [40, 0.01],
    [64, 0.01],
    [96, 0.0025],
  ])('throws "No usable edge" for a flat square of %i px with noise σ = %f', (sizePx, sigma) => {
    for (const seed of [1, 2, 3]) {
      expect(() => measureEdge(flat(sizePx, sigma, seed), full(flat(sizePx, 0, 0)))).toThrow(
        /^No usable edge in the region/,
      )
    }
  })

  it('names the step and the noise, the noise close to the σ = 0.01 that was added', () => {
    let message = ''
    try {
      measureEdge(flat(40, 0.01, 3), full(flat(40, 0, 0)))
    } catch (error) {
      message = (error as Error).message
    }
    const m = /the step \((.+)\) is less than (\d+) × the noise \((.+)\)\.$/.exec(message)
    expect(m).not.toBeNull()
    expect(Number(m?.[2])).toBe(MIN_STEP_TO_NOISE)
    expect(Number(m?.[1])).toBeLessThan(MIN_STEP_TO_NOISE * Number(m?.[3]))
    expect(Math.abs(Number(m?.[3]) - 0.01) / 0.01).toBeLessThan(0.1)
  })
})

describe('a genuine low-contrast edge', () => {
  it('measures a clean 10 % contrast edge at SNR 60: MTF50 within 3 % of the analytic value', () => {
    // Michelson (0.55 − 0.45)/(0.55 + 0.45) = 10 %; noise σ = 0.1/60 in linear light.
    const e = renderEdgeLinear({
      kernel: { type: 'gaussian', sigmaPx: 1 },
      angleDeg: 5,
      darkLinear: 0.45,
      brightLinear: 0.55,
    })
    const noise = seededNormal(7)
    const img = {
      width: e.width,
      height: e.height,
      data: Float32Array.from(e.data, (v) => v + (0.1 / 60) * noise()),
    }
    const m = measureEdge(img, full(img))
    // Expected: Gaussian OTF × 1-px pixel aperture along the normal at 5° (tests/fixtures analytic).
    const expected = expectedMtf50({ type: 'gaussian', sigmaPx: 1 }, 5)
    expect(Math.abs((m.mtf50 ?? 0) - expected) / expected).toBeLessThan(0.03)
    expect(m.contrast).toBeCloseTo(0.1, 2)
    expect(m.warnings).toContain('low-contrast')
  })
})
