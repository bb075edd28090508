export { blurCircleDiameterUm, type BlurCircleInput } from './blurCircle'
export {
  backFocusToleranceUm,
  blurFromSensorShiftUm,
  type BackFocusToleranceInput,
  type SensorShiftInput,
} from './backFocus'
export {
  depthOfField,
  hyperfocalDistanceM,
  type DepthOfField,
  type DepthOfFieldInput,
  type HyperfocalInput,
} from './depthOfField'
export {
  pixelDensityFromFov,
  pixelDensityFromLens,
  pixelDensityFromTarget,
  type FovDensityInput,
  type LensDensityInput,
  type TargetDensityInput,
} from './pixelDensity'
export {
  IEC_62676_4_2014,
  IEC_62676_4_2025_DRAFT,
  iecLevelFor,
  iecLevelsFor,
  type IecLevel,
  type IecScheme,
} from './iecLevels'
export {
  focusErrorFromDiskRadius,
  type FocusCandidate,
  type FocusError,
  type FocusErrorInput,
} from './focusError'
export {
  effectivePixelDensity,
  type EffectiveDensity,
  type EffectiveDensityInput,
} from './effectiveDensity'
