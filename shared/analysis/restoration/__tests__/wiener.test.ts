import { describe, expect, it } from 'vitest'
import { loadReference } from '../../../../tests/fixtures/reference/load'
import { wienerDeconvolve1d } from '../wiener1d'
import { wienerDeconvolve } from '../wiener2d'

interface Ref {
  wiener1d: {
    label: string
    signal: number[]
    kernel: number[]
    nsr: number
    blurred: number[]
    estimate: number[]
  }[]
}
const ref = loadReference<Ref>('restoration.json')

// DOMAIN.md "Boundary rules and deconvolution" oracle [calc] (Gonzalez & Woods, Wiener filter):
// circular N = 8, k = [0.2, 0.6, 0.2], x = [0, 0, 1, 1, 1, 0, 0, 0].
const x = [0, 0, 1, 1, 1, 0, 0, 0]
const k = [0.2, 0.6, 0.2]
const blurred = x.map((_, i) => 0.2 * x[(i + 7) % 8] + 0.6 * x[i] + 0.2 * x[(i + 1) % 8])

/**
 * Independent closed form: H(m) = 0.6 + 0.4·cos(2πm/8) is real, so the Wiener estimate is
 * x̂[n] = (1/8)·Σ_m X(m)·H(m)²/(H(m)² + K)·e^(2πi·mn/8), X(m) = Σ_j x[j]·e^(−2πi·mj/8).
 */
function closedForm(n: number, K: number): number {
  let acc = 0
  for (let m = 0; m < 8; m++) {
    const H = 0.6 + 0.4 * Math.cos((2 * Math.PI * m) / 8)
    let re = 0
    let im = 0
    for (let j = 0; j < 8; j++) {
      re += x[j] * Math.cos((-2 * Math.PI * m * j) / 8)
      im += x[j] * Math.sin((-2 * Math.PI * m * j) / 8)
    }
    const g = (H * H) / (H * H + K)
    const a = (2 * Math.PI * m * n) / 8
    acc += g * (re * Math.cos(a) - im * Math.sin(a))
  }
  return acc / 8
}

describe('wienerDeconvolve1d', () => {
  it('recovers x exactly with K = 0 (DOMAIN.md oracle; the circulant is invertible, cond 5)', () => {
    const { estimate } = wienerDeconvolve1d(blurred, k, { nsr: 0 })
    estimate.forEach((v, i) => expect(v).toBeCloseTo(x[i], 12))
  })

  it('gives 1.0162 at the centre with K = 0.01 (DOMAIN.md oracle, recomputed by the closed form)', () => {
    const { estimate, nsr } = wienerDeconvolve1d(blurred, k, { nsr: 0.01 })
    expect(nsr).toBe(0.01)
    expect(estimate[3]).toBeCloseTo(1.0162, 4) // DOMAIN.md value
    for (let n = 0; n < 8; n++) expect(estimate[n]).toBeCloseTo(closedForm(n, 0.01), 12)
  })

  for (const c of ref.wiener1d) {
    it(`matches a numpy.fft Wiener filter: ${c.label}`, () => {
      const { estimate } = wienerDeconvolve1d(c.blurred, c.kernel, { nsr: c.nsr })
      // Source: restoration.json (real(ifft(conj(H)·fft(y)/(|H|² + K))) in numpy).
      c.estimate.forEach((v, i) => expect(estimate[i]).toBeCloseTo(v, 11))
    })
  }

  it('derives K from a given noise σ as σ² / (var(y) − σ²)', () => {
    const mean = blurred.reduce((a, v) => a + v, 0) / 8
    const varY = blurred.reduce((a, v) => a + (v - mean) ** 2, 0) / 8
    const { nsr } = wienerDeconvolve1d(blurred, k, { noiseSigma: 0.1 })
    expect(nsr).toBeCloseTo(0.01 / (varY - 0.01), 12)
  })

  it('floors an estimated K at minNsr on a smooth, noise-free signal', () => {
    // A slow sine has second differences ≈ 0, so the estimated noise σ is ≈ 0.
    const smooth = Array.from({ length: 256 }, (_, i) => 10 + 5 * Math.sin((2 * Math.PI * i) / 256))
    expect(wienerDeconvolve1d(smooth, k).nsr).toBe(1e-4)
    expect(wienerDeconvolve1d(smooth, k, { minNsr: 0.02 }).nsr).toBe(0.02)
  })

  it('rejects a negative K and a kernel longer than the signal', () => {
    expect(() => wienerDeconvolve1d(blurred, k, { nsr: -1 })).toThrow(
      new RangeError('The noise-to-signal ratio must be a finite number ≥ 0 (got -1).'),
    )
    expect(() => wienerDeconvolve1d([1, 2], k)).toThrow(
      new RangeError('The kernel (3 taps) is longer than the signal (2).'),
    )
  })
})

describe('wienerDeconvolve (2-D)', () => {
  it('reproduces the 1-D oracle on a periodic 8 × 1 image with padding none', () => {
    const image = { width: 8, height: 1, data: Float64Array.from(blurred) }
    const out = wienerDeconvolve(
      image,
      { width: 3, height: 1, data: k },
      { nsr: 0.01, padding: 'none' },
    )
    expect(out.image.data[3]).toBeCloseTo(1.0162, 4) // DOMAIN.md
    expect(out.label).toBe('illustrative — not evidential')
    expect(out.parameters.nsr).toBe(0.01)
  })

  it('rejects an unknown padding and a negative PSF', () => {
    const image = { width: 4, height: 4, data: new Float32Array(16) }
    const psf = { width: 1, height: 1, data: [1] }
    expect(() => wienerDeconvolve(image, psf, { padding: 'mirror' as 'none' })).toThrow(
      new TypeError(`Unknown padding "mirror": use 'taper' or 'none'.`),
    )
    expect(() => wienerDeconvolve(image, { width: 3, height: 1, data: [1, -1, 1] })).toThrow(
      new RangeError('The PSF must hold finite non-negative values (index 1 is -1).'),
    )
  })
})
