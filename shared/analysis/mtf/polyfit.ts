/**
 * Least-squares polynomial x(t) = Σ c_k t^k with t = (row − centre) / scale, solved from the
 * normal equations by Gaussian elimination with partial pivoting (degree ≤ 5, so at most 6×6).
 */
export interface RowPolynomial {
  coeffs: Float64Array
  centre: number
  scale: number
}

export function fitRowPolynomial(
  rows: ArrayLike<number>,
  values: ArrayLike<number>,
  count: number,
  degree: number,
): RowPolynomial {
  let lo = Infinity
  let hi = -Infinity
  for (let i = 0; i < count; i++) {
    if (rows[i] < lo) lo = rows[i]
    if (rows[i] > hi) hi = rows[i]
  }
  const centre = (lo + hi) / 2
  const scale = Math.max(1, (hi - lo) / 2)
  const n = degree + 1
  const a = new Float64Array(n * (n + 1))
  const powers = new Float64Array(2 * n)
  for (let i = 0; i < count; i++) {
    const t = (rows[i] - centre) / scale
    powers[0] = 1
    for (let k = 1; k < 2 * n; k++) powers[k] = powers[k - 1] * t
    for (let r = 0; r < n; r++) {
      for (let c = 0; c < n; c++) a[r * (n + 1) + c] += powers[r + c]
      a[r * (n + 1) + n] += powers[r] * values[i]
    }
  }
  return { coeffs: solveAugmented(a, n), centre, scale }
}

export function evalRowPolynomial(poly: RowPolynomial, row: number): number {
  const t = (row - poly.centre) / poly.scale
  let v = 0
  for (let k = poly.coeffs.length - 1; k >= 0; k--) v = v * t + poly.coeffs[k]
  return v
}

/** dx/drow of the polynomial at `row`. */
export function slopeRowPolynomial(poly: RowPolynomial, row: number): number {
  const t = (row - poly.centre) / poly.scale
  let v = 0
  for (let k = poly.coeffs.length - 1; k >= 1; k--) v = v * t + k * poly.coeffs[k]
  return v / poly.scale
}

function solveAugmented(a: Float64Array, n: number): Float64Array {
  const w = n + 1
  for (let col = 0; col < n; col++) {
    let pivot = col
    for (let r = col + 1; r < n; r++) {
      if (Math.abs(a[r * w + col]) > Math.abs(a[pivot * w + col])) pivot = r
    }
    if (Math.abs(a[pivot * w + col]) < 1e-300) {
      throw new RangeError('The edge fit is singular: too few rows with a usable edge.')
    }
    if (pivot !== col) {
      for (let c = 0; c < w; c++) {
        const t = a[col * w + c]
        a[col * w + c] = a[pivot * w + c]
        a[pivot * w + c] = t
      }
    }
    for (let r = col + 1; r < n; r++) {
      const f = a[r * w + col] / a[col * w + col]
      for (let c = col; c < w; c++) a[r * w + c] -= f * a[col * w + c]
    }
  }
  const x = new Float64Array(n)
  for (let r = n - 1; r >= 0; r--) {
    let s = a[r * w + n]
    for (let c = r + 1; c < n; c++) s -= a[r * w + c] * x[c]
    x[r] = s / a[r * w + r]
  }
  return x
}
