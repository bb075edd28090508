export { fftPlan, isPowerOfTwo, nextPowerOfTwo, type FftPlan } from './plan'
export { fft1d, ifft1d, type ComplexArray, type Fft1DOptions } from './fft1d'
export {
  fft2d,
  ifft2d,
  ifft2dReal,
  transform2dInPlace,
  type Fft2DOptions,
  type Spectrum2D,
} from './fft2d'
export { logMagnitude, magnitude, powerSpectrum } from './magnitude'
export { fftFrequencyCyPx, fftShift2d } from './shift'
