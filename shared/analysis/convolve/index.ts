export type { GreyLike, Kernel2D, Signal } from './types'
export {
  BORDER_RULES,
  assertBorderRule,
  borderIndex,
  borderIndexTable,
  type BorderRule,
} from './border'
export { convolve1d, correlate1d, type Convolve1DOptions } from './convolve1d'
export { convolve2d, correlate2d, type Convolve2DOptions, type ConvolvedImage } from './convolve2d'
export { convolveSeparable } from './separable'
export { padImage, type PaddedImage } from './pad'
export { convolutionMatrix, multiplyMatrixVector } from './matrix'
export { circulantConditionNumber, matrixConditionNumber, singularValues } from './conditioning'
