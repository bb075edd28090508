import type { GreyLike } from '../convolve/types'
import { assertGrey } from '../convolve/validate'

/**
 * Standard deviation of additive white noise in an image, by Immerkær's fast estimator
 * (J. Immerkær, "Fast Noise Variance Estimation", CVIU 64(2), 1996):
 * σ = √(π/2) · Σ|I ∗ N| / (6·(W − 2)·(H − 2)), N = [[1, −2, 1], [−2, 4, −2], [1, −2, 1]],
 * summed over the interior. N removes smooth structure (it is the difference of two Laplacians),
 * so edges inflate the estimate a little. Needs at least 3 × 3 pixels.
 */
export function estimateNoiseSigma(image: GreyLike): number {
  assertGrey(image)
  const { width: w, height: h, data } = image
  if (w < 3 || h < 3) {
    throw new RangeError(
      `Noise estimation needs an image of at least 3 × 3 pixels (got ${w} × ${h}).`,
    )
  }
  let sum = 0
  for (let y = 1; y < h - 1; y++) {
    const row = y * w
    const up = row - w
    const down = row + w
    for (let x = 1; x < w - 1; x++) {
      const corners = data[up + x - 1] + data[up + x + 1] + data[down + x - 1] + data[down + x + 1]
      const sides = data[up + x] + data[down + x] + data[row + x - 1] + data[row + x + 1]
      sum += Math.abs(corners - 2 * sides + 4 * data[row + x])
    }
  }
  return (Math.sqrt(Math.PI / 2) * sum) / (6 * (w - 2) * (h - 2))
}

/**
 * Noise-to-signal power ratio K for a Wiener filter: σn² / (var(observed) − σn²), with the signal
 * power clamped at a tiny positive value, and K at least `minNsr`.
 */
export function noiseToSignalRatio(
  observedVariance: number,
  noiseSigma: number,
  minNsr: number,
): number {
  const noisePower = noiseSigma * noiseSigma
  const signalPower = Math.max(observedVariance - noisePower, 1e-12)
  return Math.max(noisePower / signalPower, minNsr)
}

/** Population variance of a sequence. */
export function variance(values: ArrayLike<number>): number {
  const n = values.length
  let mean = 0
  for (let i = 0; i < n; i++) mean += values[i]
  mean /= n
  let acc = 0
  for (let i = 0; i < n; i++) acc += (values[i] - mean) ** 2
  return acc / n
}

/**
 * Noise σ of a 1-D signal from the median absolute second difference
 * (d = x[i−1] − 2x[i] + x[i+1] has variance 6σ² for white noise; MAD/0.6745 estimates its σ).
 */
export function estimateNoiseSigma1d(signal: ArrayLike<number>): number {
  const n = signal.length
  if (n < 3) return 0
  const d = new Float64Array(n - 2)
  for (let i = 1; i < n - 1; i++) d[i - 1] = Math.abs(signal[i - 1] - 2 * signal[i] + signal[i + 1])
  d.sort()
  const m = d.length
  const median = m % 2 ? d[(m - 1) / 2] : 0.5 * (d[m / 2 - 1] + d[m / 2])
  return median / 0.6744897501960817 / Math.sqrt(6)
}
