import type { EdgeFit } from './edgeFit'
import type { EdgeSamples } from './extract'
import { evalRowPolynomial } from './polyfit'

/** Bins per pixel of horizontal distance (ISO 12233: 4× oversampling). */
export const BINS_PER_PX = 4

/**
 * The 4× oversampled edge spread function over horizontal distance dx = col − x_edge(row):
 * bin k holds the mean of the pixels with round(4 dx) = k − centreIndex.
 */
export interface Esf {
  /** Bin means; empty bins filled by interpolation (ends: nearest filled bin). */
  values: Float64Array
  /** Pixels per bin before filling (0 = filled). */
  counts: Uint32Array
  /** Index of the bin at dx = 0 (the fitted edge). */
  centreIndex: number
}

/** ISO 12233 step 7 over the rows kept by the fit: N = 4 × cols bins centred on the edge. */
export function binEsf(samples: EdgeSamples, fit: EdgeFit): Esf {
  const { cols, data } = samples
  const n = BINS_PER_PX * cols
  const centreIndex = (BINS_PER_PX * cols) >> 1
  const sums = new Float64Array(n)
  const counts = new Uint32Array(n)
  for (let r = fit.rowStart; r < fit.rowStart + fit.rowCount; r++) {
    const offset = centreIndex - BINS_PER_PX * evalRowPolynomial(fit.poly, r)
    const row = r * cols
    for (let c = 0; c < cols; c++) {
      const k = Math.round(BINS_PER_PX * c + offset)
      if (k >= 0 && k < n) {
        sums[k] += data[row + c]
        counts[k]++
      }
    }
  }
  return { values: fillEmptyBins(sums, counts), counts, centreIndex }
}

/** Divides sums by counts; an empty bin takes the linear interpolation of its neighbours. */
function fillEmptyBins(sums: Float64Array, counts: Uint32Array): Float64Array {
  const n = sums.length
  const values = new Float64Array(n)
  let prev = -1
  for (let k = 0; k < n; k++) {
    if (counts[k] === 0) continue
    values[k] = sums[k] / counts[k]
    if (prev === -1) {
      for (let j = 0; j < k; j++) values[j] = values[k]
    } else if (k - prev > 1) {
      for (let j = prev + 1; j < k; j++) {
        values[j] = values[prev] + ((values[k] - values[prev]) * (j - prev)) / (k - prev)
      }
    }
    prev = k
  }
  if (prev === -1)
    throw new RangeError('No usable edge in the region: the spread function is empty.')
  for (let j = prev + 1; j < n; j++) values[j] = values[prev]
  return values
}

/**
 * Standard deviation of the pixels at least `flatPx` from the edge around their bin mean:
 * the noise of the flat areas, with any profile across the edge removed.
 */
export function flatAreaNoise(
  samples: EdgeSamples,
  fit: EdgeFit,
  esf: Esf,
  flatPx: number,
): number {
  const { cols, data } = samples
  const n = esf.values.length
  let sum = 0
  let count = 0
  for (let r = fit.rowStart; r < fit.rowStart + fit.rowCount; r++) {
    const edge = evalRowPolynomial(fit.poly, r)
    const offset = esf.centreIndex - BINS_PER_PX * edge
    const row = r * cols
    for (let c = 0; c < cols; c++) {
      if (Math.abs(c - edge) < flatPx) continue
      const k = Math.round(BINS_PER_PX * c + offset)
      if (k < 0 || k >= n || esf.counts[k] < 2) continue
      const d = data[row + c] - esf.values[k]
      // The bin mean includes this pixel: n/(n−1) makes the variance unbiased.
      sum += (d * d * esf.counts[k]) / (esf.counts[k] - 1)
      count++
    }
  }
  return count > 1 ? Math.sqrt(sum / count) : 0
}
