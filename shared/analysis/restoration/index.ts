export { RESTORATION_LABEL, type RestorationResult } from './result'
export { wienerDeconvolve1d, type Wiener1DOptions, type Wiener1DResult } from './wiener1d'
export { wienerDeconvolve, type WienerOptions } from './wiener2d'
export {
  richardsonLucy1d,
  type RichardsonLucy1DResult,
  type RichardsonLucyOptions,
} from './richardsonLucy1d'
export { richardsonLucy, type RichardsonLucy2DOptions } from './richardsonLucy2d'
export { estimateNoiseSigma, estimateNoiseSigma1d, noiseToSignalRatio } from './noise'
export { padWithTaper, type WorkingImage } from './padding'
export { besselJ1, diskOtf } from './diskOtf'
export {
  lostFrequencies,
  type LostBand,
  type LostFrequencies,
  type LostFrequenciesOptions,
  type TransferFunction,
} from './lostFrequencies'
