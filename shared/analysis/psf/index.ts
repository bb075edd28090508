export { fitPsf, type EsfProfile, type PsfFitOptions } from './fit'
export { modelEsf, kernelEsf, apertureQuadrature, erfc, type ApertureQuadrature } from './models'
export { psfKernel2d, type PsfKernel2D } from './kernel2d'
export { motionBlurHint, type MotionBlurHint } from './motion'
