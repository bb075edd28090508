import { fftPlan } from './plan'

export interface ComplexArray {
  re: Float64Array
  im: Float64Array
}

export interface Fft1DOptions {
  /** Inverse transform (e^(+2πi·jk/n), divided by n). Default false. */
  inverse?: boolean
}

/**
 * Complex DFT of any length ≥ 1: X[k] = Σ_j (re[j] + i·im[j])·e^(−2πi·jk/n), unscaled forward,
 * 1/n on the inverse (the numpy.fft convention). `im` may be omitted for real input.
 * Returns new arrays; the input is not changed.
 */
export function fft1d(
  re: ArrayLike<number>,
  im?: ArrayLike<number> | null,
  options: Fft1DOptions = {},
): ComplexArray {
  if (re === null || typeof re !== 'object' || typeof re.length !== 'number') {
    throw new TypeError('The real part must be an array of numbers.')
  }
  const n = re.length
  if (n < 1) throw new RangeError('The signal must not be empty.')
  if (im && im.length !== n) {
    throw new RangeError(`The imaginary part has ${im.length} samples but the real part has ${n}.`)
  }
  const outRe = Float64Array.from(re)
  const outIm = im ? Float64Array.from(im) : new Float64Array(n)
  for (let k = 0; k < n; k++) {
    if (!Number.isFinite(outRe[k]) || !Number.isFinite(outIm[k])) {
      throw new RangeError(`The signal holds a value that is not a finite number at index ${k}.`)
    }
  }
  fftPlan(n).run(outRe, outIm, options.inverse ?? false)
  return { re: outRe, im: outIm }
}

/** Inverse of fft1d: ifft1d(fft1d(x)) = x. */
export function ifft1d(re: ArrayLike<number>, im?: ArrayLike<number> | null): ComplexArray {
  return fft1d(re, im, { inverse: true })
}
