// The restoration preview: one region deconvolved with the measured kernel (Wiener or
// Richardson–Lucy), shown before and after as sRGB pixels, and the frequencies the blur took
// for good. Always labelled as an illustration (RESTORATION_LABEL).
import {
  cropGrey,
  estimateNoiseSigma,
  linearToSrgb,
  lostFrequencies,
  noiseToSignalRatio,
  psfKernel2d,
  richardsonLucy,
  wienerDeconvolve,
  type GreyImage,
  type PsfModel,
} from '@shared/analysis'
import type { RestorationPreview, RestorationRequest } from '../types'
import { clampRoi } from './frame'

/** Lowest noise-to-signal ratio of the preview [ours]. */
export const MIN_PREVIEW_NSR = 1e-3

/** Odd kernel side that holds the PSF: ±3σ for a Gaussian, R + 1 px for a disk; 3 to 63 px. */
export function kernelSidePx(model: PsfModel, sizePx: number): number {
  const half = model === 'gaussian' ? Math.ceil(3 * sizePx) : Math.ceil(sizePx) + 1
  return Math.min(63, Math.max(3, 2 * half + 1))
}

/** Linear luminance to 8-bit sRGB grey RGBA, clipped to 0..1 (display only). */
export function linearToRgba(data: Float32Array | Float64Array): Uint8ClampedArray {
  const out = new Uint8ClampedArray(data.length * 4)
  for (let i = 0; i < data.length; i++) {
    const v = Math.round(255 * linearToSrgb(Math.min(1, Math.max(0, data[i]))))
    out[4 * i] = v
    out[4 * i + 1] = v
    out[4 * i + 2] = v
    out[4 * i + 3] = 255
  }
  return out
}

function variance(data: Float32Array): number {
  let sum = 0
  let sq = 0
  for (let i = 0; i < data.length; i++) {
    sum += data[i]
    sq += data[i] * data[i]
  }
  const m = sum / data.length
  return Math.max(0, sq / data.length - m * m)
}

export function restoreRegion(image: GreyImage, req: RestorationRequest): RestorationPreview {
  const roi = clampRoi(req.roi, image.width, image.height)
  if (!roi) throw new RangeError('The region for the restoration preview lies outside the frame.')
  if (!(req.sizePx > 0) || !Number.isFinite(req.sizePx)) {
    throw new RangeError(`The kernel size must be a positive number of pixels (got ${req.sizePx}).`)
  }
  const crop = cropGrey(image, roi)
  const kernel = psfKernel2d(req.model, req.sizePx, kernelSidePx(req.model, req.sizePx))
  const noiseSigma = req.noiseSigma ?? estimateNoiseSigma(crop)
  // The same noise-to-signal ratio judges the lost bands for both methods. Its floor, 1e-3
  // [ours], stands for the compression and quantisation noise of an 8-bit snapshot and keeps the
  // preview's ringing down (a noise-free synthetic frame would otherwise get K ≈ 1e-5).
  const nsr = noiseToSignalRatio(variance(crop.data), noiseSigma, MIN_PREVIEW_NSR)
  const result =
    req.method === 'wiener'
      ? wienerDeconvolve(crop, kernel, { nsr })
      : richardsonLucy(crop, kernel, { iterations: 25 })
  const direction = 'horizontal'
  return {
    width: roi.w,
    height: roi.h,
    before: linearToRgba(crop.data),
    after: linearToRgba(result.image.data),
    method: result.method,
    parameters: {
      ...result.parameters,
      model: req.model,
      sizePx: req.sizePx,
      kernelSidePx: kernel.width,
    },
    label: result.label,
    nsr,
    lost: lostFrequencies(kernel, { nsr, direction }),
  }
}
