import { convolve1d, correlate1d } from '../convolve/convolve1d'
import type { Signal } from '../convolve/types'
import { assertKernel1D, assertSignal } from '../convolve/validate'
import { normalisedKernel } from './kernels'

export interface RichardsonLucyOptions {
  /** Maximum number of iterations. Default 30 [ours]; noise grows with more, so stop early. */
  iterations?: number
  /**
   * Stop when an iteration changes the estimate by less than this fraction (Σ|Δx| / Σ|x|).
   * Default 1e-4 [ours]; 0 runs every iteration.
   */
  tolerance?: number
}

export interface RichardsonLucy1DResult {
  estimate: Float64Array
  /** Iterations actually run. */
  iterations: number
  /** True when the tolerance stopped the run before the iteration limit. */
  stoppedEarly: boolean
}

/**
 * Richardson–Lucy deconvolution (Richardson, JOSA 62, 1972; Lucy, AJ 79, 1974) of a periodic,
 * non-negative 1-D signal: x ← x · Kᵀ(y / Kx), with K the circular convolution by the kernel
 * (scaled to sum 1). Starts from a flat estimate at the signal's mean. Every iterate stays
 * non-negative and keeps the signal's sum.
 */
export function richardsonLucy1d(
  signal: Signal,
  kernel: Signal,
  options: RichardsonLucyOptions = {},
): RichardsonLucy1DResult {
  assertSignal(signal)
  assertKernel1D(kernel)
  assertNonNegative(signal, 'signal')
  const weights = normalisedKernel(kernel)
  const { iterations, tolerance } = checkIterationOptions(options)
  const n = signal.length
  let mean = 0
  for (let i = 0; i < n; i++) mean += signal[i]
  mean /= n
  let estimate = new Float64Array(n).fill(mean)
  const ratio = new Float64Array(n)
  const blurred = new Float64Array(n)
  const back = new Float64Array(n)
  let run = 0
  let stoppedEarly = false
  while (run < iterations && mean > 0) {
    convolve1d(estimate, weights, { border: 'wrap', output: blurred })
    for (let i = 0; i < n; i++) ratio[i] = blurred[i] > 0 ? signal[i] / blurred[i] : 0
    correlate1d(ratio, weights, { border: 'wrap', output: back })
    const next = new Float64Array(n)
    let change = 0
    let size = 0
    for (let i = 0; i < n; i++) {
      next[i] = estimate[i] * Math.max(back[i], 0)
      change += Math.abs(next[i] - estimate[i])
      size += Math.abs(estimate[i])
    }
    estimate = next
    run++
    if (change <= tolerance * size) {
      stoppedEarly = run < iterations
      break
    }
  }
  return { estimate, iterations: run, stoppedEarly }
}

export function assertNonNegative(values: ArrayLike<number>, what: string): void {
  for (let i = 0; i < values.length; i++) {
    if (values[i] < 0) {
      throw new RangeError(
        `Richardson–Lucy needs a non-negative ${what} (index ${i} is ${values[i]}); use linear intensities.`,
      )
    }
  }
}

export function checkIterationOptions(options: RichardsonLucyOptions): {
  iterations: number
  tolerance: number
} {
  const iterations = options.iterations ?? 30
  const tolerance = options.tolerance ?? 1e-4
  if (!Number.isInteger(iterations) || iterations < 1) {
    throw new RangeError(`The iteration count must be a positive whole number (got ${iterations}).`)
  }
  if (!Number.isFinite(tolerance) || tolerance < 0) {
    throw new RangeError(`The tolerance must be a finite number ≥ 0 (got ${tolerance}).`)
  }
  return { iterations, tolerance }
}
