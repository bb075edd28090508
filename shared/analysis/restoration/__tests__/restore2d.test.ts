import { describe, expect, it } from 'vitest'
import { convolveSeparable } from '../../convolve/separable'
import { estimateNoiseSigma } from '../noise'
import { richardsonLucy } from '../richardsonLucy2d'
import { wienerDeconvolve } from '../wiener2d'

// A 7 × 7 Gaussian PSF, σ = 1.2 px (sampled exp(−x²/2σ²), scaled to sum 1).
const g = [-3, -2, -1, 0, 1, 2, 3].map((v) => Math.exp(-(v * v) / (2 * 1.2 * 1.2)))
const gSum = g.reduce((a, v) => a + v, 0)
const g1 = g.map((v) => v / gSum)
const psf = { width: 7, height: 7, data: g1.flatMap((a) => g1.map((b) => a * b)) }

/**
 * A 64 × 64 scene cut from a larger world: a bright band on the left edge (the world continues
 * past the frame, so the camera blurred it with real neighbours — the replicate rule here),
 * a bright square and a thin line. A circular deconvolution would fold the bright left band onto
 * the dark right edge.
 */
function scene() {
  const w = 64
  const data = new Float64Array(w * w).fill(20)
  for (let y = 0; y < w; y++) {
    for (let x = 0; x < w; x++) {
      if (x < 8) data[y * w + x] = 200
      if (x >= 24 && x < 40 && y >= 20 && y < 36) data[y * w + x] = 150
      if (x === 50) data[y * w + x] = 120
    }
  }
  return { width: w, height: w, data }
}

function rmse(a: ArrayLike<number>, b: ArrayLike<number>, cols?: [number, number]): number {
  let acc = 0
  let n = 0
  for (let i = 0; i < a.length; i++) {
    const x = i % 64
    if (cols && (x < cols[0] || x >= cols[1])) continue
    acc += (a[i] - b[i]) ** 2
    n++
  }
  return Math.sqrt(acc / n)
}

describe('2-D restoration', () => {
  const truth = scene()
  const blurred = convolveSeparable(truth, g1, g1, {
    border: 'replicate',
    output: new Float64Array(64 * 64),
  })

  it('Wiener with tapered padding sharpens without a wrap-around ghost at the far edge', () => {
    const padded = wienerDeconvolve(blurred, psf, { nsr: 1e-3 })
    const circular = wienerDeconvolve(blurred, psf, { nsr: 1e-3, padding: 'none' })
    const before = rmse(blurred.data, truth.data)
    expect(rmse(padded.image.data, truth.data)).toBeLessThan(0.6 * before)
    // Right-most 4 columns (truth = 20): the circular filter drags in the bright left band.
    const ghostPadded = rmse(padded.image.data, truth.data, [60, 64])
    const ghostCircular = rmse(circular.image.data, truth.data, [60, 64])
    expect(ghostPadded).toBeLessThan(1) // measured 0.08 grey levels
    expect(ghostCircular).toBeGreaterThan(20) // measured ≈ 250: the left band folds over
    expect(padded.parameters.gridWidth).toBe(128) // 64 + 2·16 → next power of two
  })

  it('Richardson–Lucy sharpens, stays non-negative and keeps the total brightness', () => {
    const out = richardsonLucy(blurred, psf, { iterations: 40, tolerance: 0 })
    expect(out.parameters.iterationsRun).toBe(40)
    expect(rmse(out.image.data, truth.data)).toBeLessThan(0.8 * rmse(blurred.data, truth.data))
    expect(Math.min(...out.image.data)).toBeGreaterThanOrEqual(0)
    const sumIn = Array.from(blurred.data).reduce((a, v) => a + v, 0)
    const sumOut = out.image.data.reduce((a, v) => a + v, 0)
    // The sum is kept on the padded grid; the crop keeps it to within a fraction of a percent.
    expect(Math.abs(sumOut / sumIn - 1)).toBeLessThan(0.005)
    expect(out.label).toBe('illustrative — not evidential')
  })

  it('Richardson–Lucy rejects negative pixels', () => {
    const image = { width: 3, height: 3, data: Float32Array.from([1, 1, 1, 1, -2, 1, 1, 1, 1]) }
    expect(() => richardsonLucy(image, psf)).toThrow(
      new RangeError(
        'Richardson–Lucy needs a non-negative image (index 4 is -2); use linear intensities.',
      ),
    )
  })
})

describe('estimateNoiseSigma (Immerkær, CVIU 1996)', () => {
  it('recovers the σ of added Gaussian noise on a smooth image to within 5 %', () => {
    let seed = 12345
    const uniform = () => {
      seed = (seed * 1103515245 + 12345) % 2147483648
      return (seed + 0.5) / 2147483648
    }
    const w = 200
    const data = new Float64Array(w * w)
    for (let i = 0; i < data.length; i++) {
      const x = i % w
      const y = Math.floor(i / w)
      // Box–Muller normal deviate, σ = 5, on a gentle ramp.
      const n = Math.sqrt(-2 * Math.log(uniform())) * Math.cos(2 * Math.PI * uniform())
      data[i] = 50 + 0.3 * x + 0.2 * y + 5 * n
    }
    expect(estimateNoiseSigma({ width: w, height: w, data })).toBeCloseTo(5, 0)
    expect(Math.abs(estimateNoiseSigma({ width: w, height: w, data }) / 5 - 1)).toBeLessThan(0.05)
  })

  it('is zero on a noise-free ramp (the estimator ignores linear structure)', () => {
    const data = Float64Array.from({ length: 100 }, (_, i) => 3 * (i % 10) + 2 * Math.floor(i / 10))
    expect(estimateNoiseSigma({ width: 10, height: 10, data })).toBe(0)
  })
})
