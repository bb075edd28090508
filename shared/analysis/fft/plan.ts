import FFT from 'fft.js'

/**
 * An in-place complex DFT of one length: X[k] = Σ x[j]·e^(−2πi·jk/n) (forward, unscaled);
 * inverse uses e^(+2πi·jk/n) and divides by n (numpy's convention).
 * Powers of two use fft.js (radix-4); other lengths use Bluestein's chirp-z algorithm
 * (Bluestein 1970) on a power-of-two fft.js transform, so every length is exact, not padded.
 */
export interface FftPlan {
  readonly size: number
  run(re: Float64Array, im: Float64Array, inverse: boolean): void
}

const cache = new Map<number, FftPlan>()

/** The (cached) plan for length n ≥ 1. */
export function fftPlan(n: number): FftPlan {
  if (!Number.isInteger(n) || n < 1) {
    throw new RangeError(`The transform length must be a positive integer (got ${n}).`)
  }
  let plan = cache.get(n)
  if (!plan) {
    plan = n === 1 ? identityPlan : isPowerOfTwo(n) ? radixPlan(n) : bluesteinPlan(n)
    if (cache.size > 64) cache.clear()
    cache.set(n, plan)
  }
  return plan
}

export function isPowerOfTwo(n: number): boolean {
  return Number.isInteger(n) && n >= 1 && (n & (n - 1)) === 0
}

/** Smallest power of two ≥ n. */
export function nextPowerOfTwo(n: number): number {
  let p = 1
  while (p < n) p *= 2
  return p
}

const identityPlan: FftPlan = { size: 1, run() {} }

function radixPlan(n: number): FftPlan {
  const fft = new FFT(n)
  const input = new Float64Array(2 * n)
  const output = new Float64Array(2 * n)
  return {
    size: n,
    run(re, im, inverse) {
      for (let k = 0; k < n; k++) {
        input[2 * k] = re[k]
        input[2 * k + 1] = im[k]
      }
      if (inverse) fft.inverseTransform(output, input)
      else fft.transform(output, input)
      for (let k = 0; k < n; k++) {
        re[k] = output[2 * k]
        im[k] = output[2 * k + 1]
      }
    },
  }
}

function bluesteinPlan(n: number): FftPlan {
  const m = nextPowerOfTwo(2 * n - 1)
  const inner = radixPlan(m)
  // Chirp w[k] = e^(−iπk²/n); k² is taken mod 2n so the angle stays exact for large k.
  const wRe = new Float64Array(n)
  const wIm = new Float64Array(n)
  for (let k = 0; k < n; k++) {
    const angle = (Math.PI * ((k * k) % (2 * n))) / n
    wRe[k] = Math.cos(angle)
    wIm[k] = -Math.sin(angle)
  }
  // B = FFT of b, b[k] = conj(w[k]) for |k| < n (wrapped), computed once.
  const bRe = new Float64Array(m)
  const bIm = new Float64Array(m)
  for (let k = 0; k < n; k++) {
    bRe[k] = wRe[k]
    bIm[k] = -wIm[k]
    if (k > 0) {
      bRe[m - k] = wRe[k]
      bIm[m - k] = -wIm[k]
    }
  }
  inner.run(bRe, bIm, false)
  const aRe = new Float64Array(m)
  const aIm = new Float64Array(m)
  return {
    size: n,
    run(re, im, inverse) {
      // Inverse through the forward transform: ifft(x) = conj(fft(conj(x))) / n.
      const sign = inverse ? -1 : 1
      aRe.fill(0)
      aIm.fill(0)
      for (let k = 0; k < n; k++) {
        const xr = re[k]
        const xi = sign * im[k]
        aRe[k] = xr * wRe[k] - xi * wIm[k]
        aIm[k] = xr * wIm[k] + xi * wRe[k]
      }
      inner.run(aRe, aIm, false)
      for (let k = 0; k < m; k++) {
        const r = aRe[k] * bRe[k] - aIm[k] * bIm[k]
        aIm[k] = aRe[k] * bIm[k] + aIm[k] * bRe[k]
        aRe[k] = r
      }
      inner.run(aRe, aIm, true)
      const scale = inverse ? 1 / n : 1
      for (let k = 0; k < n; k++) {
        const r = aRe[k] * wRe[k] - aIm[k] * wIm[k]
        const i = aRe[k] * wIm[k] + aIm[k] * wRe[k]
        re[k] = r * scale
        im[k] = sign * i * scale
      }
    },
  }
}
