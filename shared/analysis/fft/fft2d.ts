import type { GreyLike } from '../convolve/types'
import { assertGrey } from '../convolve/validate'
import { fftPlan, nextPowerOfTwo } from './plan'

/** A 2-D complex array, row-major: index y·width + x. */
export interface Spectrum2D {
  width: number
  height: number
  re: Float64Array
  im: Float64Array
}

export interface Fft2DOptions {
  /**
   * Zero-pad the image on the right and bottom to the next powers of two before transforming
   * (faster; the spectrum then samples the padded image). Default false: an exact DFT of the
   * given size (Bluestein for non-power-of-two sizes).
   */
  padToPowerOfTwo?: boolean
}

/** 2-D DFT of a real image: F(u, v) = Σ_y Σ_x I(x, y)·e^(−2πi(ux/W + vy/H)) (unscaled, like numpy.fft.fft2). */
export function fft2d(image: GreyLike, options: Fft2DOptions = {}): Spectrum2D {
  assertGrey(image)
  const pad = options.padToPowerOfTwo ?? false
  const width = pad ? nextPowerOfTwo(image.width) : image.width
  const height = pad ? nextPowerOfTwo(image.height) : image.height
  const re = new Float64Array(width * height)
  const im = new Float64Array(width * height)
  for (let y = 0; y < image.height; y++) {
    const src = y * image.width
    const dst = y * width
    for (let x = 0; x < image.width; x++) re[dst + x] = image.data[src + x]
  }
  const spectrum = { width, height, re, im }
  transform2dInPlace(spectrum, false)
  return spectrum
}

/** Inverse 2-D DFT (divided by W·H). Returns a new complex array. */
export function ifft2d(spectrum: Spectrum2D): Spectrum2D {
  assertSpectrum(spectrum)
  const out = {
    width: spectrum.width,
    height: spectrum.height,
    re: Float64Array.from(spectrum.re),
    im: Float64Array.from(spectrum.im),
  }
  transform2dInPlace(out, true)
  return out
}

/** Real part of the inverse 2-D DFT, as a grey image of the spectrum's size. */
export function ifft2dReal(spectrum: Spectrum2D): {
  width: number
  height: number
  data: Float64Array
} {
  const out = ifft2d(spectrum)
  return { width: out.width, height: out.height, data: out.re }
}

/** Forward or inverse 2-D DFT in place: rows, then columns. */
export function transform2dInPlace(s: Spectrum2D, inverse: boolean): void {
  const { width, height, re, im } = s
  const rowPlan = fftPlan(width)
  const rowRe = new Float64Array(width)
  const rowIm = new Float64Array(width)
  for (let y = 0; y < height; y++) {
    const off = y * width
    rowRe.set(re.subarray(off, off + width))
    rowIm.set(im.subarray(off, off + width))
    rowPlan.run(rowRe, rowIm, inverse)
    re.set(rowRe, off)
    im.set(rowIm, off)
  }
  const colPlan = fftPlan(height)
  const colRe = new Float64Array(height)
  const colIm = new Float64Array(height)
  for (let x = 0; x < width; x++) {
    for (let y = 0; y < height; y++) {
      colRe[y] = re[y * width + x]
      colIm[y] = im[y * width + x]
    }
    colPlan.run(colRe, colIm, inverse)
    for (let y = 0; y < height; y++) {
      re[y * width + x] = colRe[y]
      im[y * width + x] = colIm[y]
    }
  }
}

function assertSpectrum(s: Spectrum2D): void {
  if (
    s === null ||
    typeof s !== 'object' ||
    !(s.re instanceof Float64Array) ||
    !(s.im instanceof Float64Array)
  ) {
    throw new TypeError('The spectrum must have width, height and Float64Array re and im parts.')
  }
  const n = s.width * s.height
  if (!Number.isInteger(s.width) || !Number.isInteger(s.height) || s.width < 1 || s.height < 1) {
    throw new RangeError(
      `The spectrum must have positive integer width and height (got ${s.width} × ${s.height}).`,
    )
  }
  if (s.re.length !== n || s.im.length !== n) {
    throw new RangeError(
      `The spectrum parts must hold ${n} values each (got ${s.re.length} and ${s.im.length}).`,
    )
  }
}
