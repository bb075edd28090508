export {
  srgbToLinear,
  linearToSrgb,
  parseTransfer,
  decodeTransfer,
  linearisationTable,
} from './transfer'
export {
  toGreyImage,
  LUMA_WEIGHTS,
  type RawImage,
  type LumaWeights,
  type LuminanceOptions,
} from './luminance'
export { cropGrey, transposeGrey } from './crop'
export { clippedFraction, clipThresholds, type ClipThresholds } from './clipping'
export { assertGreyImage, assertRoiInside } from './validate'
export { readImageHeader, assertFrameSize, MAX_FRAME_PIXELS, type ImageHeader } from './header'
