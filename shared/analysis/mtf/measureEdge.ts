import { clippedFraction, clipThresholds } from '../image/clipping'
import { assertGreyImage, assertRoiInside } from '../image/validate'
import { fitPsf } from '../psf/fit'
import type { EdgeMeasurement, EdgeOrientation, EncodingInfo, GreyImage, Roi } from '../types'
import { fitEdge } from './edgeFit'
import { BINS_PER_PX, binEsf, flatAreaNoise } from './esf'
import { detectOrientation, edgeSign, extractEdgeSamples } from './extract'
import { esfStats, summariseSfr } from './metrics'
import { makeSfr } from './sfr'
import { edgeWarnings } from './warnings'

export interface MeasureEdgeOptions {
  /** Edge orientation; detected from the gradients when omitted. */
  orientation?: EdgeOrientation
  /** Polynomial degree of the edge fit (1 straight, 2–5 curved). @default 1 */
  edgeFitDegree?: number
  /** Sets the clipping thresholds (half a code value from the extremes). @default 8-bit sRGB */
  encodingInfo?: EncodingInfo
}

/**
 * Length of the Hamming window on the LSF, px of horizontal distance: 24 × the 10–90 % rise,
 * at least 32 px, never more than the LSF. ISO 12233 spans the whole LSF; a shorter window
 * leaves out the noise of flat areas far from a sharp edge (at SNR 60 on a 120-px region the
 * worst MTF50 error of a σ = 0.5 px edge drops from ≈ 3.6 % to ≈ 2.3 %, measured on the
 * synthetic edges of tests/fixtures) while its own bias stays small: for a Gaussian LSF of
 * standard deviation s, a Hamming window of length L raises MTF50 by ≈ 9.1 s²/L² [calc],
 * 0.2 % at L = 24 × rise (rise ≈ 2.56 s).
 */
export function lsfWindowPx(riseHorizontalPx: number): number {
  return Math.max(32, 24 * riseHorizontalPx)
}

/** Smallest region the measurement accepts (the warnings ask for more). */
export const MIN_ROI_ACROSS_PX = 16
export const MIN_ROI_ALONG_PX = 8

/**
 * Smallest step between the two sides, in units of the region's noise σ, that counts as an
 * edge [ours]: below it no single row shows the step, so the row-wise edge fit follows noise.
 * The plateaus of a flat noisy region differ by ≈ σ·√(2/n) ≪ σ; a real edge at SNR 10 (the
 * low-contrast warning) passes with a wide margin.
 */
export const MIN_STEP_TO_NOISE = 3

/**
 * ISO 12233 e-SFR of the slanted edge in `roi` of a linear grey image (DOMAIN.md steps 1–12),
 * with the 10–90 % rise, over/undershoot, flat-area noise, the blur-kernel fit and warnings.
 */
export function measureEdge(
  image: GreyImage,
  roi: Roi,
  options: MeasureEdgeOptions = {},
): EdgeMeasurement {
  assertGreyImage(image)
  assertRoiInside(roi, image.width, image.height)
  const orientation = options.orientation ?? detectOrientation(image, roi)
  if (orientation !== 'vertical' && orientation !== 'horizontal') {
    throw new RangeError(
      `The orientation must be vertical or horizontal (got ${String(orientation)}).`,
    )
  }
  const samples = extractEdgeSamples(image, roi, orientation)
  if (samples.cols < MIN_ROI_ACROSS_PX || samples.rows < MIN_ROI_ALONG_PX) {
    throw new RangeError(
      `The region ${roi.w} × ${roi.h} is too small for a ${orientation} edge: it needs at least ${MIN_ROI_ACROSS_PX} px across and ${MIN_ROI_ALONG_PX} px along the edge.`,
    )
  }
  const sign = edgeSign(samples)
  const fit = fitEdge(samples, sign, { degree: options.edgeFitDegree ?? 1 })
  const angleRad = Math.atan(fit.slope)
  const cosTheta = Math.cos(angleRad)

  const esf = binEsf(samples, fit)
  const stats = esfStats(esf, samples.cols / 2)
  const contrast = Math.abs(stats.right - stats.left)
  if (!(contrast > 0))
    throw new RangeError('No usable edge in the region: both sides are equally bright.')
  // Edge-strength test before the SFR: the scatter of every pixel around its ESF bin is the
  // noise of a flat region (and close to it on a real edge), whatever the region's size.
  const regionNoise = flatAreaNoise(samples, fit, esf, 0)
  if (contrast < MIN_STEP_TO_NOISE * regionNoise) {
    throw new RangeError(
      `No usable edge in the region: the step (${contrast.toPrecision(2)}) is less than ${MIN_STEP_TO_NOISE} × the noise (${regionNoise.toPrecision(2)}).`,
    )
  }
  const sfr = makeSfr(esf, sign, cosTheta, lsfWindowPx(stats.riseHorizontalPx))
  const summary = summariseSfr(sfr)

  const rise1090Px = stats.riseHorizontalPx * cosTheta
  const flatPx = Math.max(4, 2 * stats.riseHorizontalPx)
  const noise = flatAreaNoise(samples, fit, esf, flatPx)
  const snr = noise > 0 ? contrast / noise : null
  // A 1-px average of the ESF holds one pixel per row used.
  const profileNoise = noise > 0 ? noise / contrast / Math.sqrt(fit.rowCount) : 0

  const psf = fitPsf(
    {
      values: esf.values,
      counts: esf.counts,
      centreIndex: esf.centreIndex,
      binNormalPx: cosTheta / BINS_PER_PX,
      angleRad,
    },
    { fitHalfWidthPx: Math.min(samples.cols / 2, Math.max(8, 3 * rise1090Px + 4)) },
  )

  const warnings = edgeWarnings({
    colsPx: samples.cols,
    rowsPx: fit.rowCount,
    tanTheta: fit.slope,
    riseHorizontalPx: stats.riseHorizontalPx,
    clippedFraction: clippedFraction(image, roi, clipThresholds(options.encodingInfo)),
    michelson: contrast / Math.max(1e-12, stats.left + stats.right),
    snr,
    overshoot: stats.overshoot,
    undershoot: stats.undershoot,
    sfrPeak: summary.peak,
    profileNoise,
  })

  return {
    roi: { ...roi },
    orientation,
    polarity: stats.right > stats.left ? 'rising' : 'falling',
    angleDeg: (angleRad * 180) / Math.PI,
    mtf50: summary.mtf50,
    mtf50p: summary.mtf50p,
    mtf10: summary.mtf10,
    mtfNyquist: summary.mtfNyquist,
    mtf: summary.curve,
    rise1090Px,
    overshoot: stats.overshoot,
    undershoot: stats.undershoot,
    noise,
    snr,
    contrast,
    rowsUsed: fit.rowCount,
    psf,
    warnings,
  }
}
