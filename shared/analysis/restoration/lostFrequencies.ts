import type { Kernel2D, Signal } from '../convolve/types'

/** A transfer function of frequency in cycles/pixel; signed (real OTF) or a magnitude. */
export type TransferFunction = (fCyPx: number) => number

export interface LostFrequenciesOptions {
  /**
   * |H| below which a frequency counts as lost. Default √nsr: there the Wiener gain
   * |H|² / (|H|² + K) falls below ½, i.e. the noise floor wins [ours].
   */
  threshold?: number
  /** Noise-to-signal power ratio used for the default threshold. Default 0.01 (threshold 0.1). */
  nsr?: number
  /** Highest frequency examined. Default 0.5 c/p (Nyquist). */
  maxCyPx?: number
  /** Grid samples over [0, maxCyPx] before refinement. Default 2048. */
  samples?: number
  /** For a 2-D kernel: the axis along which frequencies run. Default `'horizontal'`. */
  direction?: 'horizontal' | 'vertical'
}

export interface LostBand {
  fromCyPx: number
  /** Equal to maxCyPx when the band runs past the examined range. */
  toCyPx: number
  /** Where |H| is smallest inside the band. */
  deepestCyPx: number
  minMagnitude: number
}

export interface LostFrequencies {
  thresholdMagnitude: number
  maxCyPx: number
  /** Intervals where |H| < threshold: detail there cannot come back above the noise. */
  bands: LostBand[]
  /**
   * Zeros of H inside the bands: there the information is gone whatever the noise. Only zeros
   * with |H| above numerical noise nearby (see ZERO_NEIGHBOURHOOD_FLOOR) are reported.
   */
  zerosCyPx: number[]
}

/**
 * Which frequencies a blur destroys: the bands where the kernel's transfer function falls below
 * the noise floor, and its zeros (e.g. a disk of radius R: 0.609835/R, 1.116557/R, …).
 * `source` is a transfer function, a 1-D kernel, or a 2-D kernel (its line spread function along
 * `direction`). Kernels are scaled to sum 1; a function is taken as it is (H(0) should be 1).
 */
export function lostFrequencies(
  source: TransferFunction | Signal | Kernel2D,
  options: LostFrequenciesOptions = {},
): LostFrequencies {
  const H = toTransfer(source, options.direction ?? 'horizontal')
  const nsr = options.nsr ?? 0.01
  if (!Number.isFinite(nsr) || nsr < 0) {
    throw new RangeError(`The noise-to-signal ratio must be a finite number ≥ 0 (got ${nsr}).`)
  }
  const threshold = options.threshold ?? Math.sqrt(nsr)
  const maxCyPx = options.maxCyPx ?? 0.5
  const samples = options.samples ?? 2048
  if (!Number.isFinite(threshold) || threshold < 0) {
    throw new RangeError(`The threshold must be a finite number ≥ 0 (got ${threshold}).`)
  }
  if (!Number.isFinite(maxCyPx) || maxCyPx <= 0) {
    throw new RangeError(
      `The highest frequency must be a positive number of cycles/pixel (got ${maxCyPx}).`,
    )
  }
  if (!Number.isInteger(samples) || samples < 16) {
    throw new RangeError(`The sample count must be a whole number ≥ 16 (got ${samples}).`)
  }
  const below = (f: number) => Math.abs(H(f)) < threshold
  const step = maxCyPx / samples
  const bands: LostBand[] = []
  const zeros: number[] = []
  const isReal = realZeroTest(H, maxCyPx, threshold)
  let start = -1
  for (let k = 0; k <= samples; k++) {
    const f = k * step
    const inBand = below(f)
    if (inBand && start < 0) start = k === 0 ? 0 : bisect((g) => below(g), f - step, f)
    const last = k === samples
    if (start >= 0 && (!inBand || last)) {
      const end = inBand ? maxCyPx : bisect((g) => !below(g), f - step, f)
      bands.push(describeBand(H, start, end, zeros, isReal))
      start = -1
    }
  }
  return { thresholdMagnitude: threshold, maxCyPx, bands, zerosCyPx: zeros }
}

/** Smallest g in (lo, hi] with test(g) true, given test(lo) false and test(hi) true. */
function bisect(test: (f: number) => boolean, lo: number, hi: number): number {
  for (let i = 0; i < 60; i++) {
    const mid = 0.5 * (lo + hi)
    if (test(mid)) hi = mid
    else lo = mid
  }
  return 0.5 * (lo + hi)
}

/** Relative floor of numerical noise: |H| below 1e-3 × |H(0)| carries no real zero [ours]. */
export const ZERO_NEIGHBOURHOOD_FLOOR = 1e-3

/**
 * A zero is real when |H| rises above a floor within maxCyPx/10 on each side (one side at the
 * ends of the examined range). The floor is 1e-3 × |H(0)| and at least a tenth of the lost-band
 * threshold [ours]: ripples of a sampled or truncated kernel deep inside a lost band (a Gaussian
 * cut at ±3σ ripples at |H| ≈ 1e-3, finer sampling errors at ≈ 1e-4) change sign without
 * leaving it, while a disk's or a box's zeros sit between lobes far above it.
 */
function realZeroTest(
  H: TransferFunction,
  maxCyPx: number,
  threshold: number,
): (zCyPx: number) => boolean {
  const floor = Math.max(ZERO_NEIGHBOURHOOD_FLOOR * Math.abs(H(0)), 0.1 * threshold)
  const reach = maxCyPx / 10
  const n = 32
  const side = (z: number, dir: number): boolean | null => {
    const end = Math.min(maxCyPx, Math.max(0, z + dir * reach))
    if (Math.abs(end - z) < reach / n) return null
    for (let i = 1; i <= n; i++) if (Math.abs(H(z + ((end - z) * i) / n)) >= floor) return true
    return false
  }
  return (z) => {
    const left = side(z, -1)
    const right = side(z, 1)
    return left !== false && right !== false && (left === true || right === true)
  }
}

function describeBand(
  H: TransferFunction,
  from: number,
  to: number,
  zeros: number[],
  isReal: (zCyPx: number) => boolean,
): LostBand {
  const found: number[] = []
  const n = 256
  let deepest = from
  let min = Infinity
  let prev = H(from)
  for (let i = 0; i <= n; i++) {
    const f = from + ((to - from) * i) / n
    const v = H(f)
    if (Math.abs(v) < min) {
      min = Math.abs(v)
      deepest = f
    }
    if (i > 0 && Math.sign(v) !== Math.sign(prev) && v !== 0 && prev !== 0) {
      found.push(signChange(H, f - (to - from) / n, f))
    } else if (v === 0) found.push(f)
    prev = v
  }
  // Refine the deepest point (golden section on |H| around the best grid sample).
  const h = (to - from) / n
  let a = Math.max(from, deepest - h)
  let b = Math.min(to, deepest + h)
  const phi = (Math.sqrt(5) - 1) / 2
  for (let i = 0; i < 80; i++) {
    const c = b - phi * (b - a)
    const d = a + phi * (b - a)
    if (Math.abs(H(c)) < Math.abs(H(d))) b = d
    else a = c
  }
  const refined = 0.5 * (a + b)
  if (Math.abs(H(refined)) < min) {
    min = Math.abs(H(refined))
    deepest = refined
  }
  // A magnitude that touches zero without changing sign is a zero too.
  if (min < 1e-9 && !found.some((z) => Math.abs(z - deepest) < 2 * h)) found.push(deepest)
  zeros.push(...found.filter(isReal))
  zeros.sort((p, q) => p - q)
  return { fromCyPx: from, toCyPx: to, deepestCyPx: deepest, minMagnitude: min }
}

function signChange(H: TransferFunction, lo: number, hi: number): number {
  const sLo = Math.sign(H(lo))
  for (let i = 0; i < 60; i++) {
    const mid = 0.5 * (lo + hi)
    if (Math.sign(H(mid)) === sLo) lo = mid
    else hi = mid
  }
  return 0.5 * (lo + hi)
}

/** H(f) of a kernel: signed (real) when symmetric, else the magnitude. */
function toTransfer(
  source: TransferFunction | Signal | Kernel2D,
  direction: string,
): TransferFunction {
  if (typeof source === 'function') return source
  if (source === null || typeof source !== 'object') {
    throw new TypeError('The source must be a transfer function, a 1-D kernel or a 2-D kernel.')
  }
  let taps: ArrayLike<number>
  if ('data' in source && 'width' in source) {
    const k = source as Kernel2D
    if (direction !== 'horizontal' && direction !== 'vertical') {
      throw new TypeError(
        `Unknown direction ${JSON.stringify(direction)}: use 'horizontal' or 'vertical'.`,
      )
    }
    const along = direction === 'horizontal' ? k.width : k.height
    const lsf = new Float64Array(along)
    for (let y = 0; y < k.height; y++) {
      for (let x = 0; x < k.width; x++)
        lsf[direction === 'horizontal' ? x : y] += k.data[y * k.width + x]
    }
    taps = lsf
  } else {
    taps = source as Signal
  }
  if (taps.length < 1) throw new RangeError('The kernel must not be empty.')
  let sum = 0
  for (let j = 0; j < taps.length; j++) sum += taps[j]
  if (!Number.isFinite(sum) || sum === 0) {
    throw new RangeError('The kernel must have finite values and a non-zero sum.')
  }
  const w = Float64Array.from(taps, (v) => v / sum)
  const c = (w.length - 1) / 2
  let symmetric = true
  for (let j = 0; j < w.length; j++)
    if (Math.abs(w[j] - w[w.length - 1 - j]) > 1e-12) symmetric = false
  return (f) => {
    let re = 0
    let im = 0
    for (let j = 0; j < w.length; j++) {
      const a = -2 * Math.PI * f * (j - c)
      re += w[j] * Math.cos(a)
      im += w[j] * Math.sin(a)
    }
    return symmetric ? re : Math.hypot(re, im)
  }
}
