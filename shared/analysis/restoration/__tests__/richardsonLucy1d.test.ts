import { describe, expect, it } from 'vitest'
import { richardsonLucy1d } from '../richardsonLucy1d'

// DOMAIN.md oracle signal (Richardson, JOSA 1972; Lucy, AJ 1974): circular N = 8,
// k = [0.2, 0.6, 0.2], x = [0, 0, 1, 1, 1, 0, 0, 0].
const x = [0, 0, 1, 1, 1, 0, 0, 0]
const k = [0.2, 0.6, 0.2]
const y = x.map((_, i) => 0.2 * x[(i + 7) % 8] + 0.6 * x[i] + 0.2 * x[(i + 1) % 8])
const error = (e: ArrayLike<number>) => Math.sqrt(x.reduce((a, v, i) => a + (e[i] - v) ** 2, 0) / 8)

describe('richardsonLucy1d', () => {
  it('keeps the sum of the signal and stays non-negative at every iteration count', () => {
    // Σ x_(k+1) = Σ_m (y/Kx)_m·(Kx)_m = Σ y for a kernel of sum 1 (circular).
    for (const iterations of [1, 5, 50]) {
      const { estimate } = richardsonLucy1d(y, k, { iterations, tolerance: 0 })
      expect(estimate.reduce((a, v) => a + v, 0)).toBeCloseTo(3, 12)
      for (const v of estimate) expect(v).toBeGreaterThanOrEqual(0)
    }
  })

  it('converges toward x on the noise-free case', () => {
    const e10 = error(richardsonLucy1d(y, k, { iterations: 10, tolerance: 0 }).estimate)
    const e100 = error(richardsonLucy1d(y, k, { iterations: 100, tolerance: 0 }).estimate)
    const e2000 = error(richardsonLucy1d(y, k, { iterations: 2000, tolerance: 0 }).estimate)
    expect(e100).toBeLessThan(e10)
    expect(e2000).toBeLessThan(e100)
    expect(e2000).toBeLessThan(0.02)
  })

  it('stops early once an iteration changes the estimate by less than the tolerance', () => {
    const r = richardsonLucy1d(y, k, { iterations: 10000, tolerance: 1e-3 })
    expect(r.stoppedEarly).toBe(true)
    expect(r.iterations).toBeLessThan(10000)
    const full = richardsonLucy1d(y, k, { iterations: 5, tolerance: 0 })
    expect(full).toMatchObject({ iterations: 5, stoppedEarly: false })
  })

  it('scales the kernel to sum 1, so a scaled kernel gives the same result', () => {
    const a = richardsonLucy1d(y, k, { iterations: 20 }).estimate
    const b = richardsonLucy1d(y, [2, 6, 2], { iterations: 20 }).estimate
    a.forEach((v, i) => expect(b[i]).toBeCloseTo(v, 12))
  })

  it('rejects negative samples, zero kernels and bad iteration counts', () => {
    expect(() => richardsonLucy1d([1, -1, 1], k)).toThrow(
      new RangeError(
        'Richardson–Lucy needs a non-negative signal (index 1 is -1); use linear intensities.',
      ),
    )
    expect(() => richardsonLucy1d(y, [0, 0, 0])).toThrow(
      new RangeError('The kernel must have a positive sum.'),
    )
    expect(() => richardsonLucy1d(y, k, { iterations: 0 })).toThrow(
      new RangeError('The iteration count must be a positive whole number (got 0).'),
    )
  })
})
