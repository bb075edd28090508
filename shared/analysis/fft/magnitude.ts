import type { ComplexArray } from './fft1d'

/** |X| per sample. */
export function magnitude(spectrum: ComplexArray): Float64Array {
  const { re, im } = spectrum
  const out = new Float64Array(re.length)
  for (let k = 0; k < re.length; k++) out[k] = Math.hypot(re[k], im[k])
  return out
}

/** |X|² per sample (power spectrum). */
export function powerSpectrum(spectrum: ComplexArray): Float64Array {
  const { re, im } = spectrum
  const out = new Float64Array(re.length)
  for (let k = 0; k < re.length; k++) out[k] = re[k] * re[k] + im[k] * im[k]
  return out
}

/** log(1 + |X|) per sample, the usual display scaling of a spectrum. */
export function logMagnitude(spectrum: ComplexArray): Float64Array {
  const out = magnitude(spectrum)
  for (let k = 0; k < out.length; k++) out[k] = Math.log1p(out[k])
  return out
}
