// The frequencies a blur destroyed, in plain words: as stripe periods in pixels and, when the
// pixel density is known, in millimetres at the target.
import type { LostFrequencies } from '@shared/analysis'

function period(fCyPx: number, pxPerM: number | null): string {
  const px = 1 / fCyPx
  const mm = pxPerM
    ? ` ≈ ${(1000 / (fCyPx * pxPerM)).toFixed(pxPerM > 500 ? 1 : 0)} mm at the target`
    : ''
  return `${px.toFixed(1)} px${mm}`
}

/**
 * Zeros are named only for a defocus disk, whose transfer function truly crosses zero (first at
 * 0.609835 / R, DOMAIN.md); a Gaussian never does, and the sign changes a sampled kernel shows
 * deep inside a lost band are rounding, not information.
 */
export function lostFrequencyWords(
  lost: LostFrequencies,
  pxPerM: number | null,
  model: 'gaussian' | 'disk',
): string[] {
  const out: string[] = []
  const top = lost.maxCyPx
  for (const band of lost.bands) {
    const from = band.fromCyPx.toFixed(2)
    if (band.toCyPx >= top - 1e-9) {
      out.push(
        `Detail finer than stripes ${period(band.fromCyPx, pxPerM)} apart (above ${from} c/p, up to Nyquist) is below the noise floor: no restoration brings it back.`,
      )
    } else {
      out.push(
        `Stripes between ${period(band.toCyPx, pxPerM)} and ${period(band.fromCyPx, pxPerM)} apart (${from}–${band.toCyPx.toFixed(2)} c/p) are below the noise floor.`,
      )
    }
  }
  const zeros = model === 'disk' ? lost.zerosCyPx.slice(0, 1) : []
  for (const z of zeros) {
    out.push(
      `At ${z.toFixed(3)} c/p (stripes ${period(z, pxPerM)} apart) the kernel passes nothing: that detail is gone whatever the noise, and just beyond it contrast is reversed.`,
    )
  }
  if (!out.length) {
    out.push(
      'No frequency up to Nyquist falls below the noise floor: the detail is weakened, not lost, so refocusing should bring it back.',
    )
  }
  return out
}
