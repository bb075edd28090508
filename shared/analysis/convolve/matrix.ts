import { assertBorderRule, borderIndex, type BorderRule } from './border'
import type { Signal } from './types'
import { assertKernel1D } from './validate'

/**
 * The n × n matrix K with y = K·x equal to convolve1d(x, kernel, { border }): row i holds the
 * flipped kernel shifted to i, folded back into the signal by the border rule (taps that land on
 * the same sample add up; `zero` drops them). Returns the rows. Default border `'reflect101'`.
 */
export function convolutionMatrix(
  kernel: Signal,
  n: number,
  border: BorderRule = 'reflect101',
): Float64Array[] {
  assertKernel1D(kernel)
  assertBorderRule(border)
  if (!Number.isInteger(n) || n < 1) {
    throw new RangeError(`The signal length must be a positive integer (got ${n}).`)
  }
  const c = (kernel.length - 1) >> 1
  const rows: Float64Array[] = []
  for (let i = 0; i < n; i++) {
    const row = new Float64Array(n)
    for (let j = 0; j < kernel.length; j++) {
      const col = borderIndex(i + c - j, n, border)
      if (col >= 0) row[col] += kernel[j]
    }
    rows.push(row)
  }
  return rows
}

/** y = K·x for a matrix given as rows. */
export function multiplyMatrixVector(rows: readonly Float64Array[], x: Signal): Float64Array {
  const y = new Float64Array(rows.length)
  for (let i = 0; i < rows.length; i++) {
    const row = rows[i]
    if (row.length !== x.length) {
      throw new RangeError(
        `Matrix row ${i} has ${row.length} columns but the vector has ${x.length} entries.`,
      )
    }
    let acc = 0
    for (let j = 0; j < row.length; j++) acc += row[j] * x[j]
    y[i] = acc
  }
  return y
}
