// The edge profile for the chart: the 4× oversampled ESF of one region, its derivative (LSF),
// along the edge normal, normalised so the dark side is 0 and the bright side 1.
import {
  binEsf,
  BINS_PER_PX,
  edgeSign,
  extractEdgeSamples,
  fitEdge,
  type EdgeMeasurement,
  type GreyImage,
} from '@shared/analysis'
import type { EdgeProfile } from '../types'

/** Half-width of the profile around the edge, px: 4 × the 10–90 % rise, 6 px at least. */
export function profileHalfWidthPx(rise1090Px: number): number {
  return Math.max(6, Math.min(64, 4 * rise1090Px))
}

/** Plain arrays, rounded to 4 decimals (small to store, exact enough to draw). */
const round4 = (v: number) => Math.round(v * 1e4) / 1e4

export function edgeProfile(image: GreyImage, m: EdgeMeasurement): EdgeProfile {
  const samples = extractEdgeSamples(image, m.roi, m.orientation)
  const sign = edgeSign(samples)
  const fit = fitEdge(samples, sign)
  const esf = binEsf(samples, fit)
  const cosTheta = Math.cos(Math.atan(fit.slope))
  const n = esf.values.length
  const values = sign > 0 ? esf.values : esf.values.slice().reverse()
  const centre = sign > 0 ? esf.centreIndex : n - 1 - esf.centreIndex
  const reach = Math.floor((profileHalfWidthPx(m.rise1090Px) * BINS_PER_PX) / cosTheta)
  const lo = Math.max(1, centre - reach)
  const hi = Math.min(n - 2, centre + reach)
  const dark = mean(values, lo, Math.min(hi, lo + 7))
  const bright = mean(values, Math.max(lo, hi - 7), hi)
  const step = bright - dark || 1
  const xPx: number[] = []
  const esfOut: number[] = []
  const lsf: number[] = []
  for (let k = lo; k <= hi; k++) {
    xPx.push(round4(((k - centre) * cosTheta) / BINS_PER_PX))
    esfOut.push((values[k] - dark) / step)
    lsf.push((values[k + 1] - values[k - 1]) / 2 / step)
  }
  const peak = Math.max(...lsf.map(Math.abs)) || 1
  return { xPx, esf: esfOut.map(round4), lsf: lsf.map((v) => round4(v / peak)) }
}

function mean(values: Float64Array, from: number, to: number): number {
  let sum = 0
  for (let k = from; k <= to; k++) sum += values[k]
  return sum / (to - from + 1)
}
