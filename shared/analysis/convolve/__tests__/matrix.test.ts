import { describe, expect, it } from 'vitest'
import { loadReference } from '../../../../tests/fixtures/reference/load'
import { BORDER_RULES, type BorderRule } from '../border'
import { circulantConditionNumber, matrixConditionNumber, singularValues } from '../conditioning'
import { convolve1d } from '../convolve1d'
import { convolutionMatrix, multiplyMatrixVector } from '../matrix'

interface MatrixCase {
  label: string
  kernel: number[]
  n: number
  matrix: Record<BorderRule, number[][]>
  cond: Record<BorderRule, number | null>
}
const ref = loadReference<{ matrices: MatrixCase[] }>('convolve.json')

describe('convolutionMatrix', () => {
  for (const c of ref.matrices) {
    it(`matches the matrix scipy.ndimage.convolve1d applies, for every border (${c.label})`, () => {
      for (const border of BORDER_RULES) {
        const rows = convolutionMatrix(c.kernel, c.n, border)
        // Source: convolve.json, columns K·e_j from scipy.ndimage.convolve1d.
        rows.forEach((row, i) =>
          row.forEach((v, j) => expect(v).toBeCloseTo(c.matrix[border][i][j], 12)),
        )
      }
    })
  }

  it('gives y = K·x equal to convolve1d (DOMAIN.md border oracle signal)', () => {
    const x = [5, 0, 0, 0, 0, 0, 0, 9]
    for (const border of BORDER_RULES) {
      const y = multiplyMatrixVector(convolutionMatrix([0.2, 0.6, 0.2], 8, border), x)
      const direct = convolve1d(x, [0.2, 0.6, 0.2], { border })
      y.forEach((v, i) => expect(v).toBeCloseTo(direct[i], 12))
    }
  })

  it('rejects a non-positive signal length', () => {
    expect(() => convolutionMatrix([1], 0)).toThrow(
      new RangeError('The signal length must be a positive integer (got 0).'),
    )
  })
})

describe('condition numbers', () => {
  it('is 5 for the circulant [0.2, 0.6, 0.2], N = 8 (DOMAIN.md [calc])', () => {
    // Closed form: H(k) = 0.6 + 0.4·cos(2πk/8) ∈ [0.2, 1] → 1 / 0.2 = 5.
    expect(circulantConditionNumber([0.2, 0.6, 0.2], 8)).toBeCloseTo(5, 12)
  })

  it('is infinite (singular) for the circulant [0.25, 0.5, 0.25], N = 8 (DOMAIN.md [calc])', () => {
    // H(4) = 0.5 + 0.5·cos(π) = 0.
    expect(circulantConditionNumber([0.25, 0.5, 0.25], 8)).toBe(Infinity)
  })

  it('agrees with the SVD of the wrap-around matrix and with numpy.linalg.svd for every border', () => {
    for (const c of ref.matrices) {
      const circulant = circulantConditionNumber(c.kernel, c.n)
      const wrapSvd = matrixConditionNumber(convolutionMatrix(c.kernel, c.n, 'wrap'))
      if (circulant === Infinity) expect(wrapSvd).toBe(Infinity)
      else expect(wrapSvd / circulant).toBeCloseTo(1, 9)
      for (const border of BORDER_RULES) {
        const ours = matrixConditionNumber(convolutionMatrix(c.kernel, c.n, border))
        const numpy = c.cond[border] // Source: convolve.json, numpy.linalg.svd (null = singular).
        if (numpy === null) expect(ours).toBe(Infinity)
        else expect(ours / numpy).toBeCloseTo(1, 9)
      }
    }
  })

  it('finds the singular values of a diagonal matrix', () => {
    // By definition: the singular values of diag(3, −4, 1) are 4, 3, 1.
    const sv = singularValues([
      [3, 0, 0],
      [0, -4, 0],
      [0, 0, 1],
    ])
    expect(Array.from(sv)).toEqual([4, 3, 1])
  })

  it('rejects kernels longer than the signal and non-square matrices', () => {
    expect(() => circulantConditionNumber([1, 2, 3], 2)).toThrow(
      new RangeError('The kernel (3 taps) is longer than the signal (2).'),
    )
    expect(() => matrixConditionNumber([[1, 2]])).toThrow(
      new RangeError('The matrix must be square (got 1 × 2).'),
    )
  })
})
