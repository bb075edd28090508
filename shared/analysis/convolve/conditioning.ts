import type { Signal } from './types'
import { assertSignal } from './validate'

const EPS = 2.220446049250313e-16

/**
 * Condition number of the n × n circulant matrix of `kernel` (circular convolution, border
 * `wrap`): its eigenvalues are the DFT values H(k) = Σ_j k[j]·e^(−2πi·jk/n), so the 2-norm
 * condition number is max|H| / min|H|. Returns Infinity when the matrix is singular
 * (min|H| ≤ n·ε·max|H|). Example (DOMAIN.md): [0.2, 0.6, 0.2], n = 8 → 5; [0.25, 0.5, 0.25] → Infinity.
 */
export function circulantConditionNumber(kernel: Signal, n: number): number {
  assertSignal(kernel, 'kernel')
  if (!Number.isInteger(n) || n < 1) {
    throw new RangeError(`The signal length must be a positive integer (got ${n}).`)
  }
  if (kernel.length > n) {
    throw new RangeError(`The kernel (${kernel.length} taps) is longer than the signal (${n}).`)
  }
  let maxMag = 0
  let minMag = Infinity
  for (let k = 0; k < n; k++) {
    let re = 0
    let im = 0
    for (let j = 0; j < kernel.length; j++) {
      const phase = (-2 * Math.PI * ((j * k) % n)) / n
      re += kernel[j] * Math.cos(phase)
      im += kernel[j] * Math.sin(phase)
    }
    const mag = Math.hypot(re, im)
    if (mag > maxMag) maxMag = mag
    if (mag < minMag) minMag = mag
  }
  if (maxMag === 0 || minMag <= n * EPS * maxMag) return Infinity
  return maxMag / minMag
}

/**
 * Singular values of a matrix given as rows (one-sided Jacobi, Hestenes 1958), largest first.
 * Meant for the small matrices of the restoration explainer (n up to a few hundred).
 */
export function singularValues(rows: readonly ArrayLike<number>[]): Float64Array {
  const m = rows.length
  if (m < 1) throw new RangeError('The matrix must have at least one row.')
  const n = rows[0].length
  if (n < 1) throw new RangeError('The matrix must have at least one column.')
  // Columns of A as contiguous arrays.
  const cols: Float64Array[] = []
  for (let j = 0; j < n; j++) cols.push(new Float64Array(m))
  for (let i = 0; i < m; i++) {
    if (rows[i].length !== n) {
      throw new RangeError(`Matrix row ${i} has ${rows[i].length} columns; row 0 has ${n}.`)
    }
    for (let j = 0; j < n; j++) {
      const v = rows[i][j]
      if (!Number.isFinite(v))
        throw new RangeError(`The matrix holds a non-finite value at (${i}, ${j}).`)
      cols[j][i] = v
    }
  }
  for (let sweep = 0; sweep < 60; sweep++) {
    let rotated = false
    for (let p = 0; p < n - 1; p++) {
      for (let q = p + 1; q < n; q++) {
        const a = cols[p]
        const b = cols[q]
        let alpha = 0
        let beta = 0
        let gamma = 0
        for (let i = 0; i < m; i++) {
          alpha += a[i] * a[i]
          beta += b[i] * b[i]
          gamma += a[i] * b[i]
        }
        if (Math.abs(gamma) <= EPS * Math.sqrt(alpha * beta) || gamma === 0) continue
        rotated = true
        const zeta = (beta - alpha) / (2 * gamma)
        const t = Math.sign(zeta || 1) / (Math.abs(zeta) + Math.sqrt(1 + zeta * zeta))
        const c = 1 / Math.sqrt(1 + t * t)
        const s = c * t
        for (let i = 0; i < m; i++) {
          const ai = a[i]
          const bi = b[i]
          a[i] = c * ai - s * bi
          b[i] = s * ai + c * bi
        }
      }
    }
    if (!rotated) break
  }
  const sv = new Float64Array(n)
  for (let j = 0; j < n; j++) {
    let s = 0
    for (let i = 0; i < m; i++) s += cols[j][i] * cols[j][i]
    sv[j] = Math.sqrt(s)
  }
  return sv.sort().reverse()
}

/**
 * 2-norm condition number σ_max / σ_min of a square matrix given as rows (e.g. from
 * convolutionMatrix). Infinity when singular (σ_min ≤ n·ε·σ_max).
 */
export function matrixConditionNumber(rows: readonly ArrayLike<number>[]): number {
  if (rows.length > 0 && rows[0].length !== rows.length) {
    throw new RangeError(`The matrix must be square (got ${rows.length} × ${rows[0].length}).`)
  }
  const sv = singularValues(rows)
  const max = sv[0]
  const min = sv[sv.length - 1]
  if (max === 0 || min <= sv.length * EPS * max) return Infinity
  return max / min
}
