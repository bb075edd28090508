export {
  measureEdge,
  lsfWindowPx,
  MIN_ROI_ACROSS_PX,
  MIN_ROI_ALONG_PX,
  type MeasureEdgeOptions,
} from './measureEdge'
export { detectOrientation, extractEdgeSamples, edgeSign, type EdgeSamples } from './extract'
export { fitEdge, type EdgeFit, type EdgeFitOptions } from './edgeFit'
export { binEsf, flatAreaNoise, BINS_PER_PX, type Esf } from './esf'
export { makeSfr, derivativeResponse, binResponse, type Sfr } from './sfr'
export {
  summariseSfr,
  firstCrossing,
  esfStats,
  CURVE_STEP_CY_PX,
  CURVE_MAX_CY_PX,
  type SfrSummary,
  type EsfStats,
} from './metrics'
export { edgeWarnings, EDGE_WARNING_MESSAGES, type WarningInputs } from './warnings'
export {
  fitRowPolynomial,
  evalRowPolynomial,
  slopeRowPolynomial,
  type RowPolynomial,
} from './polyfit'
