import type { Signal } from '../convolve/types'
import { assertKernel1D, assertSignal } from '../convolve/validate'
import { fft1d, ifft1d } from '../fft/fft1d'
import { estimateNoiseSigma1d, noiseToSignalRatio, variance } from './noise'

export interface Wiener1DOptions {
  /** Noise-to-signal power ratio K. Default: from `noiseSigma` (or its estimate) and the signal's variance. */
  nsr?: number
  /** Noise σ of the signal; default estimated from its second differences. Ignored when `nsr` is given. */
  noiseSigma?: number
  /** Lower bound on the estimated K (not on an explicit `nsr`). Default 1e-4 [ours]. */
  minNsr?: number
}

export interface Wiener1DResult {
  estimate: Float64Array
  /** The K that was used. */
  nsr: number
}

/**
 * Wiener deconvolution of a periodic 1-D signal (circular convolution, the kernel centred on
 * sample 0): X̂ = H*·Y / (|H|² + K) (Gonzalez & Woods, Digital Image Processing). K = 0 is the
 * inverse filter; frequencies where |H|² + K = 0 are set to zero.
 */
export function wienerDeconvolve1d(
  signal: Signal,
  kernel: Signal,
  options: Wiener1DOptions = {},
): Wiener1DResult {
  assertSignal(signal)
  assertKernel1D(kernel)
  const n = signal.length
  if (kernel.length > n) {
    throw new RangeError(`The kernel (${kernel.length} taps) is longer than the signal (${n}).`)
  }
  const nsr = chooseNsr(
    options,
    () => variance(signal),
    () => estimateNoiseSigma1d(signal),
  )
  const c = (kernel.length - 1) >> 1
  const k = new Float64Array(n)
  for (let j = 0; j < kernel.length; j++) k[(j - c + n) % n] += kernel[j]
  const H = fft1d(k)
  const Y = fft1d(signal)
  const re = new Float64Array(n)
  const im = new Float64Array(n)
  for (let f = 0; f < n; f++) {
    const hr = H.re[f]
    const hi = H.im[f]
    const denom = hr * hr + hi * hi + nsr
    if (denom === 0) continue
    // conj(H)·Y = (hr − i·hi)(yr + i·yi)
    re[f] = (hr * Y.re[f] + hi * Y.im[f]) / denom
    im[f] = (hr * Y.im[f] - hi * Y.re[f]) / denom
  }
  return { estimate: ifft1d(re, im).re, nsr }
}

/** Shared rule for K: explicit `nsr`, else σn² / (var − σn²) floored at `minNsr`. */
export function chooseNsr(
  options: { nsr?: number; noiseSigma?: number; minNsr?: number },
  observedVariance: () => number,
  estimateSigma: () => number,
): number {
  if (options.nsr !== undefined) {
    if (!Number.isFinite(options.nsr) || options.nsr < 0) {
      throw new RangeError(
        `The noise-to-signal ratio must be a finite number ≥ 0 (got ${options.nsr}).`,
      )
    }
    return options.nsr
  }
  const minNsr = options.minNsr ?? 1e-4
  if (!Number.isFinite(minNsr) || minNsr < 0) {
    throw new RangeError(
      `The minimum noise-to-signal ratio must be a finite number ≥ 0 (got ${minNsr}).`,
    )
  }
  const sigma = options.noiseSigma ?? estimateSigma()
  if (!Number.isFinite(sigma) || sigma < 0) {
    throw new RangeError(`The noise σ must be a finite number ≥ 0 (got ${sigma}).`)
  }
  return noiseToSignalRatio(observedVariance(), sigma, minNsr)
}
