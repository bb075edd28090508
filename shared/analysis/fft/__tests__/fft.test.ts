import { describe, expect, it } from 'vitest'
import { loadReference } from '../../../../tests/fixtures/reference/load'
import { fft1d, ifft1d } from '../fft1d'
import { fft2d, ifft2dReal } from '../fft2d'
import { magnitude, powerSpectrum } from '../magnitude'
import { fftFrequencyCyPx, fftShift2d } from '../shift'

interface Ref {
  complex1d: { n: number; re: number[]; im: number[]; fftRe: number[]; fftIm: number[] }[]
  real2d: { width: number; height: number; data: number[]; fftRe: number[]; fftIm: number[] }
}
const ref = loadReference<Ref>('fft.json')

/** The DFT by its definition, O(n²): X[k] = Σ x[j]·e^(−2πi·jk/n). */
function naiveDft(re: number[], im: number[]) {
  const n = re.length
  const outRe: number[] = []
  const outIm: number[] = []
  for (let k = 0; k < n; k++) {
    let sr = 0
    let si = 0
    for (let j = 0; j < n; j++) {
      const a = (-2 * Math.PI * j * k) / n
      sr += re[j] * Math.cos(a) - im[j] * Math.sin(a)
      si += re[j] * Math.sin(a) + im[j] * Math.cos(a)
    }
    outRe.push(sr)
    outIm.push(si)
  }
  return { re: outRe, im: outIm }
}

function seeded(n: number, seed: number): number[] {
  let s = seed
  return Array.from({ length: n }, () => {
    s = (s * 1103515245 + 12345) % 2147483648
    return s / 2147483648 - 0.5
  })
}

describe('fft1d', () => {
  for (const n of [1, 2, 3, 4, 5, 8, 12, 17, 64, 100, 127]) {
    it(`equals the DFT definition and satisfies Parseval for length ${n}`, () => {
      const re = seeded(n, n)
      const im = seeded(n, n + 1000)
      const ours = fft1d(re, im)
      const naive = naiveDft(re, im)
      for (let k = 0; k < n; k++) {
        expect(ours.re[k]).toBeCloseTo(naive.re[k], 10)
        expect(ours.im[k]).toBeCloseTo(naive.im[k], 10)
      }
      // Parseval: Σ|x|² = (1/n)·Σ|X|².
      const energy = re.reduce((a, v, i) => a + v * v + im[i] * im[i], 0)
      const spectral = powerSpectrum(ours).reduce((a, v) => a + v, 0) / n
      expect(spectral).toBeCloseTo(energy, 10)
      // Round trip.
      const back = ifft1d(ours.re, ours.im)
      back.re.forEach((v, i) => expect(v).toBeCloseTo(re[i], 12))
      back.im.forEach((v, i) => expect(v).toBeCloseTo(im[i], 12))
    })
  }

  for (const c of ref.complex1d) {
    it(`matches numpy.fft.fft for length ${c.n}`, () => {
      const ours = fft1d(c.re, c.im)
      // Source: tests/fixtures/reference/fft.json (numpy.fft.fft).
      c.fftRe.forEach((v, k) => expect(ours.re[k]).toBeCloseTo(v, 11))
      c.fftIm.forEach((v, k) => expect(ours.im[k]).toBeCloseTo(v, 11))
    })
  }

  it('leaves its input unchanged and treats a missing imaginary part as zero', () => {
    const re = [1, 2, 3]
    const out = fft1d(re)
    expect(re).toEqual([1, 2, 3])
    expect(out.re[0]).toBeCloseTo(6, 14) // DC = Σx
  })

  it('rejects empty, mismatched and non-finite input', () => {
    expect(() => fft1d([])).toThrow(new RangeError('The signal must not be empty.'))
    expect(() => fft1d([1, 2], [1])).toThrow(
      new RangeError('The imaginary part has 1 samples but the real part has 2.'),
    )
    expect(() => fft1d([1, Infinity])).toThrow(
      new RangeError('The signal holds a value that is not a finite number at index 1.'),
    )
  })
})

describe('fft2d', () => {
  it('matches numpy.fft.fft2 on a 6 × 5 real image (non-power-of-two sizes)', () => {
    const r = ref.real2d
    const s = fft2d({ width: r.width, height: r.height, data: Float64Array.from(r.data) })
    // Source: fft.json (numpy.fft.fft2).
    r.fftRe.forEach((v, k) => expect(s.re[k]).toBeCloseTo(v, 11))
    r.fftIm.forEach((v, k) => expect(s.im[k]).toBeCloseTo(v, 11))
  })

  it('inverts back to the image and satisfies 2-D Parseval', () => {
    const data = Float32Array.from(seeded(24 * 10, 7))
    const image = { width: 24, height: 10, data }
    const s = fft2d(image)
    const back = ifft2dReal(s)
    back.data.forEach((v, i) => expect(v).toBeCloseTo(data[i], 6))
    const energy = data.reduce((a, v) => a + v * v, 0)
    const spectral = powerSpectrum(s).reduce((a, v) => a + v, 0) / (24 * 10)
    expect(spectral).toBeCloseTo(energy, 6)
  })

  it('zero-pads to powers of two when asked', () => {
    const image = { width: 5, height: 3, data: new Float32Array(15).fill(1) }
    const s = fft2d(image, { padToPowerOfTwo: true })
    expect([s.width, s.height]).toEqual([8, 4])
    expect(magnitude(s)[0]).toBeCloseTo(15, 12) // DC = sum of the 15 ones
  })
})

describe('spectrum helpers', () => {
  it('centres the zero frequency like numpy.fft.fftshift', () => {
    // numpy.fft.fftshift(arange(5)) = [3, 4, 0, 1, 2]; of arange(4) = [2, 3, 0, 1].
    expect(Array.from(fftShift2d([0, 1, 2, 3, 4], 5, 1))).toEqual([3, 4, 0, 1, 2])
    expect(Array.from(fftShift2d([0, 1, 2, 3], 1, 4))).toEqual([2, 3, 0, 1])
  })

  it('gives signed bin frequencies like numpy.fft.fftfreq', () => {
    // numpy.fft.fftfreq(4) = [0, 0.25, −0.5, −0.25]; fftfreq(5) = [0, 0.2, 0.4, −0.4, −0.2].
    expect([0, 1, 2, 3].map((k) => fftFrequencyCyPx(k, 4))).toEqual([0, 0.25, -0.5, -0.25])
    expect([0, 1, 2, 3, 4].map((k) => fftFrequencyCyPx(k, 5))).toEqual([0, 0.2, 0.4, -0.4, -0.2])
  })
})
