import { describe, expect, it } from 'vitest'
import { loadReference } from '../../../../tests/fixtures/reference/load'
import { psfKernel2d } from '../../psf/kernel2d'
import { besselJ1, diskOtf } from '../diskOtf'
import { lostFrequencies } from '../lostFrequencies'

interface Ref {
  diskOtfZerosTimesRadius: number[]
  besselJ1: { x: number[]; j1: number[] }
}
const ref = loadReference<Ref>('restoration.json')

describe('disk OTF', () => {
  it('J1 matches scipy.special.j1 to 1e-7', () => {
    ref.besselJ1.x.forEach((x, i) => expect(besselJ1(x)).toBeCloseTo(ref.besselJ1.j1[i], 7))
  })

  it('gives DOMAIN.md values for R = 1: OTF(0.25) = 0.721703, OTF(0.5) = 0.181192 [calc, Goodman]', () => {
    const H = diskOtf(1)
    expect(H(0)).toBe(1)
    expect(H(0.25)).toBeCloseTo(0.721703, 6)
    expect(H(0.5)).toBeCloseTo(0.181192, 6)
  })
})

describe('lostFrequencies', () => {
  for (const R of [1, 2, 3.5]) {
    it(`finds the zeros of a disk of radius ${R} px at 0.609835/R and 1.116557/R`, () => {
      const lost = lostFrequencies(diskOtf(R), { maxCyPx: 1.2 / R })
      // Source: scipy.special.jn_zeros(1, n) / 2π (restoration.json); DOMAIN.md 0.609835/R.
      const expected = ref.diskOtfZerosTimesRadius.slice(0, 2).map((z) => z / R)
      expect(lost.zerosCyPx).toHaveLength(2)
      lost.zerosCyPx.forEach((z, i) => expect(z).toBeCloseTo(expected[i], 7))
      expect(0.609835 / R).toBeCloseTo(expected[0], 6)
      // Each zero lies inside a band where |H| < √0.01 = 0.1.
      expect(lost.thresholdMagnitude).toBeCloseTo(0.1, 15)
      for (const z of lost.zerosCyPx) {
        expect(lost.bands.some((b) => b.fromCyPx < z && z < b.toCyPx)).toBe(true)
      }
      for (const b of lost.bands) {
        if (b.fromCyPx > 0) expect(Math.abs(diskOtf(R)(b.fromCyPx))).toBeCloseTo(0.1, 9)
      }
    })
  }

  it('reports the disk zeros 0.609835/R, 1.116557/R, 1.619…/R, 2.120…/R up to Nyquist for R = 5 px', () => {
    // Source: scipy.special.jn_zeros(1, n) / 2π (restoration.json); Goodman; DOMAIN.md 0.609835/R.
    const zeros = lostFrequencies(diskOtf(5)).zerosCyPx
    const expected = ref.diskOtfZerosTimesRadius.filter((z) => z / 5 <= 0.5).map((z) => z / 5)
    expect(expected).toHaveLength(4)
    expect(zeros).toHaveLength(4)
    zeros.forEach((z, i) => expect(z).toBeCloseTo(expected[i], 5))
  })

  it('reports no zeros for sampled Gaussian kernels, only the band past |H| = 0.1', () => {
    // A Gaussian's transfer function exp(−2π²σ²f²) [Goodman; DOMAIN.md] never vanishes; sampled
    // and cut at ±3σ or ±4σ it ripples around |H| ≈ 1e-3 … 1e-4 deep in the lost band, which
    // used to be reported as zeros (e.g. at 0.481 c/p for σ = 2 px on a 31-px kernel).
    const bandStart = (sigmaPx: number) =>
      Math.sqrt(Math.log(10) / (2 * Math.PI ** 2 * sigmaPx ** 2))
    for (const sigmaPx of [1.5, 2, 3]) {
      const half = Math.ceil(4 * sigmaPx)
      const taps = Array.from({ length: 2 * half + 1 }, (_, j) =>
        Math.exp(-((j - half) ** 2) / (2 * sigmaPx ** 2)),
      )
      const lost = lostFrequencies(taps)
      expect(lost.zerosCyPx).toEqual([])
      expect(lost.bands).toHaveLength(1)
      expect(lost.bands[0].fromCyPx).toBeCloseTo(bandStart(sigmaPx), 3)
    }
    for (const [sigmaPx, sidePx] of [
      [2, 31],
      [3, 31],
      [4, 25],
      [7, 43],
    ]) {
      for (const nsr of [0.01, 1e-3]) {
        const lost = lostFrequencies(psfKernel2d('gaussian', sigmaPx, sidePx), { nsr })
        expect(lost.zerosCyPx).toEqual([])
        expect(lost.bands).toHaveLength(1)
      }
    }
  })

  it('loses nothing to [0.2, 0.6, 0.2] at the default floor, since min |H| = 0.2 (DOMAIN.md cond 5)', () => {
    expect(lostFrequencies([0.2, 0.6, 0.2]).bands).toEqual([])
  })

  it('finds the band where 0.6 + 0.4·cos 2πf < 0.3 for [0.2, 0.6, 0.2]', () => {
    // Closed form: f > acos(−0.75)/2π = 0.384973 up to Nyquist.
    const lost = lostFrequencies([0.2, 0.6, 0.2], { threshold: 0.3 })
    expect(lost.bands).toHaveLength(1)
    expect(lost.bands[0].fromCyPx).toBeCloseTo(Math.acos(-0.75) / (2 * Math.PI), 9)
    expect(lost.bands[0].toCyPx).toBe(0.5)
    expect(lost.bands[0].minMagnitude).toBeCloseTo(0.2, 9)
  })

  it('reports the zero at Nyquist of [0.25, 0.5, 0.25], where H = cos²(πf) touches zero', () => {
    expect(lostFrequencies([0.25, 0.5, 0.25]).zerosCyPx.map((z) => +z.toFixed(6))).toEqual([0.5])
  })

  it('finds the zeros of a 5-px box at 0.2 and 0.4 c/p, also from a 2-D kernel', () => {
    // H = sin(5πf) / (5·sin πf): zeros at f = 1/5, 2/5.
    const box = [1, 1, 1, 1, 1]
    const zeros = lostFrequencies(box).zerosCyPx
    expect(zeros).toHaveLength(2)
    expect(zeros[0]).toBeCloseTo(0.2, 9)
    expect(zeros[1]).toBeCloseTo(0.4, 9)
    // A 5 × 3 horizontal motion kernel: the same zeros horizontally, none vertically.
    const motion = { width: 5, height: 3, data: [0, 0, 0, 0, 0, 1, 1, 1, 1, 1, 0, 0, 0, 0, 0] }
    expect(lostFrequencies(motion).zerosCyPx).toHaveLength(2)
    expect(lostFrequencies(motion, { direction: 'vertical' }).bands).toEqual([])
  })

  it('rejects bad options with clear messages', () => {
    expect(() => lostFrequencies([1], { maxCyPx: 0 })).toThrow(
      new RangeError('The highest frequency must be a positive number of cycles/pixel (got 0).'),
    )
    expect(() => lostFrequencies([1, -1, 0])).toThrow(
      new RangeError('The kernel must have finite values and a non-zero sum.'),
    )
    expect(() => diskOtf(0)).toThrow(
      new RangeError('The disk radius must be a positive number of pixels (got 0).'),
    )
  })
})
