import type { EdgeSamples } from './extract'
import {
  evalRowPolynomial,
  fitRowPolynomial,
  slopeRowPolynomial,
  type RowPolynomial,
} from './polyfit'

/** The fitted edge location x(row) in the edge-down-the-rows layout. */
export interface EdgeFit {
  poly: RowPolynomial
  /** tan θ: dx/drow at the middle of the rows used. */
  slope: number
  /** First row and number of rows kept (a whole number of phase cycles when possible). */
  rowStart: number
  rowCount: number
  /** Half-width of the centroid window of the final pass, px. */
  halfWindowPx: number
}

export interface EdgeFitOptions {
  /** Polynomial degree of x(row): 1 is a straight line (default), 2–5 for curved edges. */
  degree?: number
  /** Initial half-width of the centroid window around the first fit, px. @default 12 */
  halfWindowPx?: number
}

/**
 * ISO 12233 steps 4–6: per-row centroid of the [−½, 0, +½] derivative, first over the whole
 * row, then twice inside a window centred on the previous fit (the window widens to 4 LSF
 * standard deviations for wide blur); least-squares polynomial; rows trimmed to a whole
 * number of phase cycles (1/tan θ rows each) and the fit repeated on them.
 */
export function fitEdge(samples: EdgeSamples, sign: 1 | -1, options: EdgeFitOptions = {}): EdgeFit {
  const { degree = 1, halfWindowPx = 12 } = options
  if (!Number.isInteger(degree) || degree < 1 || degree > 5) {
    throw new RangeError(`The edge fit degree must be an integer from 1 to 5 (got ${degree}).`)
  }
  const { rows, cols } = samples
  const centroids = new Float64Array(rows)
  const spread = new Float64Array(rows)
  const steps = new Float64Array(rows)
  const rowIdx = new Float64Array(rows)
  const vals = new Float64Array(rows)
  const predicted = new Float64Array(rows)

  rowCentroids(samples, sign, null, 0, centroids, spread, steps)
  let poly = fitValid(centroids, 0, rows, degree, rowIdx, vals)
  let hw = Math.min(halfWindowPx, Math.floor(cols / 2))
  for (let pass = 0; pass < 3; pass++) {
    for (let r = 0; r < rows; r++) predicted[r] = evalRowPolynomial(poly, r)
    rowCentroids(samples, sign, predicted, hw, centroids, spread, steps)
    poly = fitValid(centroids, 0, rows, degree, rowIdx, vals)
    const lsfSigma = median(spread)
    const needed = Math.min(Math.floor(cols / 2), Math.ceil(4 * lsfSigma) + 2)
    if (pass === 0 && needed > hw) hw = needed
  }
  poly = rejectOutliers(poly, centroids, 0, rows, degree, rowIdx, vals)

  const slope = slopeRowPolynomial(poly, (rows - 1) / 2)
  const cycles = Math.floor(rows * Math.abs(slope))
  let rowCount = rows
  if (cycles >= 1) rowCount = Math.min(rows, Math.floor(cycles / Math.abs(slope) + 1e-9))
  const rowStart = Math.floor((rows - rowCount) / 2)
  if (rowCount < rows) {
    poly = rejectOutliers(
      fitValid(centroids, rowStart, rowCount, degree, rowIdx, vals),
      centroids,
      rowStart,
      rowCount,
      degree,
      rowIdx,
      vals,
    )
  }
  return {
    poly,
    slope: slopeRowPolynomial(poly, rowStart + (rowCount - 1) / 2),
    rowStart,
    rowCount,
    halfWindowPx: hw,
  }
}

/** Centroid (and LSF standard deviation) per row; NaN where the row holds no edge. */
function rowCentroids(
  samples: EdgeSamples,
  sign: number,
  centre: Float64Array | null,
  halfWindow: number,
  out: Float64Array,
  spreadOut: Float64Array,
  stepOut: Float64Array,
): void {
  const { rows, cols, data } = samples
  for (let r = 0; r < rows; r++) {
    const row = r * cols
    let lo = 1
    let hi = cols - 2
    if (centre) {
      lo = Math.max(1, Math.round(centre[r] - halfWindow))
      hi = Math.min(cols - 2, Math.round(centre[r] + halfWindow))
    }
    let s0 = 0
    let s1 = 0
    let s2 = 0
    for (let c = lo; c <= hi; c++) {
      const d = sign * (data[row + c + 1] - data[row + c - 1])
      s0 += d
      s1 += c * d
      s2 += c * c * d
    }
    if (s0 > 0 && hi > lo) {
      const m = s1 / s0
      out[r] = m
      spreadOut[r] = Math.sqrt(Math.max(0, s2 / s0 - m * m))
    } else {
      out[r] = NaN
      spreadOut[r] = NaN
      stepOut[r] = NaN
    }
  }
  // A row whose step is far below the typical one holds no edge (e.g. it crosses a gap):
  // drop it from the fit. The windowed derivative sum telescopes to the step of the row.
  for (let r = 0; r < rows; r++) {
    if (Number.isNaN(out[r])) continue
    const row = r * cols
    const lo = centre ? Math.max(1, Math.round(centre[r] - halfWindow)) : 1
    const hi = centre ? Math.min(cols - 2, Math.round(centre[r] + halfWindow)) : cols - 2
    stepOut[r] = sign * (data[row + hi + 1] + data[row + hi] - data[row + lo] - data[row + lo - 1])
  }
  const floor = 0.25 * median(stepOut)
  for (let r = 0; r < rows; r++) {
    if (!Number.isNaN(out[r]) && (stepOut[r] < floor || out[r] < 0 || out[r] > cols - 1)) {
      out[r] = NaN
    }
  }
}

function fitValid(
  centroids: Float64Array,
  start: number,
  count: number,
  degree: number,
  rowIdx: Float64Array,
  vals: Float64Array,
): RowPolynomial {
  let n = 0
  for (let r = start; r < start + count; r++) {
    if (!Number.isNaN(centroids[r])) {
      rowIdx[n] = r
      vals[n] = centroids[r]
      n++
    }
  }
  if (n < Math.max(3, degree + 2)) {
    throw new RangeError(
      `No usable edge in the region: only ${n} rows show a step (need at least ${Math.max(3, degree + 2)}).`,
    )
  }
  return fitRowPolynomial(rowIdx, vals, n, degree)
}

/** Refits without rows whose centroid is more than max(0.5 px, 4 robust σ) off the fit. */
function rejectOutliers(
  poly: RowPolynomial,
  centroids: Float64Array,
  start: number,
  count: number,
  degree: number,
  rowIdx: Float64Array,
  vals: Float64Array,
): RowPolynomial {
  const residuals: number[] = []
  for (let r = start; r < start + count; r++) {
    if (!Number.isNaN(centroids[r]))
      residuals.push(Math.abs(centroids[r] - evalRowPolynomial(poly, r)))
  }
  const limit = Math.max(0.5, 4 * 1.4826 * median(Float64Array.from(residuals)))
  let dropped = 0
  for (let r = start; r < start + count; r++) {
    if (
      !Number.isNaN(centroids[r]) &&
      Math.abs(centroids[r] - evalRowPolynomial(poly, r)) > limit
    ) {
      centroids[r] = NaN
      dropped++
    }
  }
  return dropped > 0 ? fitValid(centroids, start, count, degree, rowIdx, vals) : poly
}

function median(values: Float64Array): number {
  const finite = Array.from(values).filter((v) => Number.isFinite(v))
  if (finite.length === 0) return 0
  finite.sort((a, b) => a - b)
  const mid = finite.length >> 1
  return finite.length % 2 ? finite[mid] : (finite[mid - 1] + finite[mid]) / 2
}
