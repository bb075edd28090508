import type { VerdictEdge } from './types'
import { median } from './median'

/** 10–90 % rise of a Gaussian edge is 2.563103·σ (DOMAIN.md [calc]). */
const RISE_PER_SIGMA = 2.563103

export interface HazeEvidence {
  /** Median measured MTF at the probe frequency over the edges with a curve and a rise. */
  measuredMtf: number
  /** Median MTF the edges' own 10–90 % rise predicts there (Gaussian of that rise). */
  predictedMtf: number
  /** Median 10–90 % rise, px. */
  rise1090Px: number
  edges: number
}

/**
 * Evidence for haze (a dirty or scratched dome or window): veiling glare lowers the MTF at every
 * frequency, also near zero, while the edge itself stays steep. Defocus instead widens the edge,
 * and then the low-frequency MTF is what the width predicts. For each valid edge with an MTF
 * curve and a rise this compares MTF(probe) with exp(−2π²σ²f²), σ = rise / 2.563103 [ours].
 * Returns null when no edge has both.
 */
export function hazeEvidence(
  edges: readonly VerdictEdge[],
  probeCyPx: number,
): HazeEvidence | null {
  const measured: number[] = []
  const predicted: number[] = []
  const rises: number[] = []
  for (const e of edges) {
    if (!e.valid || !e.mtf || e.rise1090Px == null || !(e.rise1090Px > 0)) continue
    const m = interpolate(e.mtf, probeCyPx)
    if (m === null) continue
    const sigma = e.rise1090Px / RISE_PER_SIGMA
    measured.push(m)
    predicted.push(Math.exp(-2 * Math.PI ** 2 * sigma ** 2 * probeCyPx ** 2))
    rises.push(e.rise1090Px)
  }
  if (measured.length === 0) return null
  return {
    measuredMtf: median(measured),
    predictedMtf: median(predicted),
    rise1090Px: median(rises),
    edges: measured.length,
  }
}

/** Linear interpolation in an ascending [f, mtf] curve; null outside it. */
export function interpolate(
  curve: readonly (readonly [number, number])[],
  f: number,
): number | null {
  for (let i = 1; i < curve.length; i++) {
    const [f0, m0] = curve[i - 1]
    const [f1, m1] = curve[i]
    if (f0 <= f && f <= f1) return f1 === f0 ? m0 : m0 + ((m1 - m0) * (f - f0)) / (f1 - f0)
  }
  return null
}
