import type { GreyLike, Kernel2D } from '../convolve/types'
import { assertGrey, assertKernel2D } from '../convolve/validate'
import { fft2d, ifft2dReal } from '../fft/fft2d'
import { kernelSpectrum, normalisedKernel } from './kernels'
import { estimateNoiseSigma, variance } from './noise'
import { cropWorking, padWithTaper, unpadded } from './padding'
import { RESTORATION_LABEL, type RestorationResult } from './result'
import { chooseNsr } from './wiener1d'

export interface WienerOptions {
  /** Noise-to-signal power ratio K. Default: σn² / (var(image) − σn²), at least `minNsr`. */
  nsr?: number
  /** Noise σ (e.g. measured on the edge's flat sides); default Immerkær's estimate on the image. */
  noiseSigma?: number
  /** Lower bound on an estimated K. Default 1e-4 [ours]. */
  minNsr?: number
  /**
   * `'taper'` (default): mirror padding blended to the mean (see padWithTaper) so the FFT's
   * wrap-around makes no ghosts. `'none'`: treat the image as periodic (circular convolution).
   */
  padding?: 'taper' | 'none'
  /** Minimum padding on each side with `'taper'`. Default max(16, 2 × the kernel's larger side). */
  marginPx?: number
}

/**
 * Wiener deconvolution of an image by a known PSF (any odd-sized non-negative kernel, scaled to
 * sum 1): X̂ = H*·Y / (|H|² + K) (Gonzalez & Woods). The result is an illustration, never a record.
 */
export function wienerDeconvolve(
  image: GreyLike,
  psf: Kernel2D,
  options: WienerOptions = {},
): RestorationResult {
  assertGrey(image)
  assertKernel2D(psf, 'PSF')
  const weights = normalisedKernel(psf.data, 'PSF')
  const padding = checkPadding(options.padding)
  const nsr = chooseNsr(
    options,
    () => variance(image.data),
    () => estimateNoiseSigma(image),
  )
  const margin = options.marginPx ?? Math.max(16, 2 * Math.max(psf.width, psf.height))
  checkMargin(margin)
  const work = padding === 'taper' ? padWithTaper(image, margin) : unpadded(image)
  const Y = fft2d(work)
  const H = kernelSpectrum(psf, weights, work.width, work.height)
  for (let i = 0; i < Y.re.length; i++) {
    const hr = H.re[i]
    const hi = H.im[i]
    const denom = hr * hr + hi * hi + nsr
    const yr = Y.re[i]
    const yi = Y.im[i]
    Y.re[i] = denom === 0 ? 0 : (hr * yr + hi * yi) / denom
    Y.im[i] = denom === 0 ? 0 : (hr * yi - hi * yr) / denom
  }
  const restored = ifft2dReal(Y).data
  return {
    image: {
      width: image.width,
      height: image.height,
      data: cropWorking(work, restored, image.width, image.height),
    },
    method: 'wiener',
    parameters: {
      nsr,
      padding,
      marginPx: padding === 'taper' ? margin : 0,
      gridWidth: work.width,
      gridHeight: work.height,
    },
    label: RESTORATION_LABEL,
  }
}

export function checkPadding(padding: unknown): 'taper' | 'none' {
  if (padding === undefined) return 'taper'
  if (padding !== 'taper' && padding !== 'none') {
    throw new TypeError(`Unknown padding ${JSON.stringify(padding)}: use 'taper' or 'none'.`)
  }
  return padding
}

export function checkMargin(margin: number): void {
  if (!Number.isInteger(margin) || margin < 1) {
    throw new RangeError(
      `The padding margin must be a positive whole number of pixels (got ${margin}).`,
    )
  }
}
