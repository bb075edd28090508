import { BINS_PER_PX, type Esf } from './esf'

/** Smallest derivative response divided out (ISO 12233 practice caps the correction). */
const DERIVATIVE_CAP = 0.1

/** Response of the [−½, 0, +½] derivative on ¼-px samples: sin(πf/2)/(πf/2), f in c/p. */
export function derivativeResponse(fCyPx: number): number {
  if (fCyPx === 0) return 1
  const x = (Math.PI * fCyPx) / 2
  return Math.sin(x) / x
}

/** Response of the ¼-px bin (a box average): sinc(f/4) = sin(πf/4)/(πf/4). */
export function binResponse(fCyPx: number): number {
  if (fCyPx === 0) return 1
  const y = (Math.PI * fCyPx) / 4
  return Math.sin(y) / y
}

/**
 * The SFR of one edge as a function of frequency along the edge normal (ISO 12233 steps 8–11).
 *
 * LSF = [−½, 0, +½] derivative of the ESF, Hamming window 0.54 − 0.46·cos(2πk/(N−1)) centred on
 * the LSF peak (N = the LSF length, or `windowPx` × 4 samples when shorter), then a direct DFT evaluated at any frequency (so MTF50 etc. are found on the
 * continuous transform, not between coarse bins). Horizontal frequency f_h = f_n·cos θ.
 *
 * Corrections, both at f_h and both divided out:
 * - the derivative's response D(f) = sin(πf/2)/(πf/2), capped at D ≥ 0.1 (DOMAIN.md step 10);
 * - the ¼-px bin: with whole phase cycles the pixels of a bin spread evenly over its width,
 *   so the bin mean is the ESF averaged over a ¼-px box, whose MTF is sinc(f/4) (0.9745 at
 *   0.5 c/p, −1 % at the MTF50 of a σ = 0.5 px edge). ISO 12233 leaves it in; we correct it so
 *   a synthetic edge reads its analytic MTF. The difference from the standard is at most 1 % at
 *   MTF50 and 2.6 % at Nyquist.
 */
export interface Sfr {
  /** SFR at `fCyPx` cycles/pixel along the edge normal; 1 at 0. */
  at(fCyPx: number): number
  /** Index of the LSF peak (window centre) in the ESF bins. */
  peakIndex: number
}

export function makeSfr(esf: Esf, sign: 1 | -1, cosTheta: number, windowPx?: number): Sfr {
  const values = esf.values
  const n = values.length
  const wl = new Float64Array(n)
  for (let k = 1; k < n - 1; k++) wl[k] = (sign * (values[k + 1] - values[k - 1])) / 2
  wl[0] = wl[1]
  wl[n - 1] = wl[n - 2]

  let peakIndex = 1
  let best = -Infinity
  for (let k = 1; k < n - 1; k++) {
    const smooth = wl[k - 1] + 2 * wl[k] + wl[k + 1]
    if (smooth > best) {
      best = smooth
      peakIndex = k
    }
  }
  const half = windowPx ? Math.min((n - 1) / 2, (windowPx * BINS_PER_PX) / 2) : (n - 1) / 2
  const lo = Math.max(0, Math.ceil(peakIndex - half))
  const hi = Math.min(n - 1, Math.floor(peakIndex + half))
  for (let k = 0; k < n; k++) {
    wl[k] =
      k < lo || k > hi ? 0 : wl[k] * (0.54 + 0.46 * Math.cos((Math.PI * (k - peakIndex)) / half))
  }
  let dc = 0
  for (let k = lo; k <= hi; k++) dc += wl[k]
  if (!(Math.abs(dc) > 0))
    throw new RangeError('No usable edge in the region: the line spread function is empty.')

  const at = (fCyPx: number): number => {
    if (fCyPx === 0) return 1
    const fh = fCyPx * cosTheta
    const step = (2 * Math.PI * fh) / BINS_PER_PX
    const cs = Math.cos(step)
    const sn = Math.sin(step)
    let c = Math.cos(step * (lo - peakIndex))
    let s = Math.sin(step * (lo - peakIndex))
    let re = 0
    let im = 0
    for (let k = lo; k <= hi; k++) {
      const v = wl[k]
      re += v * c
      im += v * s
      const c2 = c * cs - s * sn
      s = s * cs + c * sn
      c = c2
    }
    const derivative = Math.max(DERIVATIVE_CAP, derivativeResponse(fh))
    return Math.hypot(re, im) / Math.abs(dc) / derivative / binResponse(fh)
  }
  return { at, peakIndex }
}
