/**
 * Sharpfield's measurement engine: pure TypeScript on typed arrays (no DOM, no Node), used by
 * the analysis worker, the server and the CLI. One algorithm per file; see each folder.
 */
export * from './types'
export * from './image'
export * from './edge'
export * from './mtf'
export * from './psf'
export * from './frame'
export * from './convolve'
export * from './fft'
export * from './focus'
export * from './restoration'
export * from './optics'
export * from './verdict'
