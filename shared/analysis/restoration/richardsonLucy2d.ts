import type { GreyLike, Kernel2D } from '../convolve/types'
import { assertGrey, assertKernel2D } from '../convolve/validate'
import { transform2dInPlace, type Spectrum2D } from '../fft/fft2d'
import { kernelSpectrum, normalisedKernel } from './kernels'
import { cropWorking, padWithTaper, unpadded } from './padding'
import { RESTORATION_LABEL, type RestorationResult } from './result'
import {
  assertNonNegative,
  checkIterationOptions,
  type RichardsonLucyOptions,
} from './richardsonLucy1d'
import { checkMargin, checkPadding } from './wiener2d'

export interface RichardsonLucy2DOptions extends RichardsonLucyOptions {
  /** `'taper'` (default) or `'none'` (periodic image), as for wienerDeconvolve. */
  padding?: 'taper' | 'none'
  /** Minimum padding on each side with `'taper'`. Default max(16, 2 × the kernel's larger side). */
  marginPx?: number
}

/**
 * Richardson–Lucy deconvolution of a non-negative image by a known PSF (scaled to sum 1), with
 * FFT convolution on a padded grid (see padWithTaper). Options: `iterations` (default 30),
 * `tolerance` (default 1e-4), `padding`, `marginPx`. The result is an illustration, never a record.
 */
export function richardsonLucy(
  image: GreyLike,
  psf: Kernel2D,
  options: RichardsonLucy2DOptions = {},
): RestorationResult {
  assertGrey(image)
  assertKernel2D(psf, 'PSF')
  assertNonNegative(image.data, 'image')
  const weights = normalisedKernel(psf.data, 'PSF')
  const { iterations, tolerance } = checkIterationOptions(options)
  const padding = checkPadding(options.padding)
  const margin = options.marginPx ?? Math.max(16, 2 * Math.max(psf.width, psf.height))
  checkMargin(margin)
  const grid = padding === 'taper' ? padWithTaper(image, margin) : unpadded(image)
  const observed = grid.data
  const n = observed.length
  const H = kernelSpectrum(psf, weights, grid.width, grid.height)
  let mean = 0
  for (let i = 0; i < n; i++) mean += observed[i]
  mean /= n
  const estimate = new Float64Array(n).fill(mean)
  const buf: Spectrum2D = {
    width: grid.width,
    height: grid.height,
    re: new Float64Array(n),
    im: new Float64Array(n),
  }
  let run = 0
  let stoppedEarly = false
  while (run < iterations && mean > 0) {
    // blurred = K·x
    filter(buf, estimate, H, false)
    // ratio = y / (K·x), written back into buf.re, then Kᵀ·ratio
    for (let i = 0; i < n; i++) buf.re[i] = buf.re[i] > 1e-12 * mean ? observed[i] / buf.re[i] : 0
    filter(buf, buf.re, H, true)
    let change = 0
    let size = 0
    for (let i = 0; i < n; i++) {
      const next = estimate[i] * Math.max(buf.re[i], 0)
      change += Math.abs(next - estimate[i])
      size += estimate[i]
      estimate[i] = next
    }
    run++
    if (change <= tolerance * size) {
      stoppedEarly = run < iterations
      break
    }
  }
  return {
    image: {
      width: image.width,
      height: image.height,
      data: cropWorking(grid, estimate, image.width, image.height),
    },
    method: 'richardson-lucy',
    parameters: {
      iterations,
      iterationsRun: run,
      stoppedEarly,
      tolerance,
      padding,
      marginPx: padding === 'taper' ? margin : 0,
      gridWidth: grid.width,
      gridHeight: grid.height,
    },
    label: RESTORATION_LABEL,
  }
}

/** buf.re ← real(IFFT(FFT(values) · H)) (or · conj(H) for the adjoint). `values` may be buf.re. */
function filter(buf: Spectrum2D, values: Float64Array, H: Spectrum2D, adjoint: boolean): void {
  if (values !== buf.re) buf.re.set(values)
  buf.im.fill(0)
  transform2dInPlace(buf, false)
  const sign = adjoint ? -1 : 1
  for (let i = 0; i < buf.re.length; i++) {
    const hr = H.re[i]
    const hi = sign * H.im[i]
    const r = buf.re[i] * hr - buf.im[i] * hi
    buf.im[i] = buf.re[i] * hi + buf.im[i] * hr
    buf.re[i] = r
  }
  transform2dInPlace(buf, true)
}
