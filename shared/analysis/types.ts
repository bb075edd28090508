/**
 * Types shared by the slanted-edge measurement (image, edge, mtf, psf, frame).
 * Units are in the names or stated: frequencies in cycles/pixel along the edge normal,
 * lengths in pixels, luminance linear in 0..1.
 */

/** Linear luminance, row-major: `data[y * width + x]`, nominally 0 (black) to 1 (white). */
export interface GreyImage {
  width: number
  height: number
  data: Float32Array
}

/** A rectangle in pixels: `x, y` is the top-left pixel, `w × h` its size. */
export interface Roi {
  x: number
  y: number
  w: number
  h: number
}

/** `vertical`: a near-vertical edge (dark/light change along x); `horizontal`: along y. */
export type EdgeOrientation = 'vertical' | 'horizontal'

/** `rising`: dark to light in the direction of increasing x (vertical) or y (horizontal). */
export type EdgePolarity = 'rising' | 'falling'

/** How code values map to linear light. */
export type Transfer = { kind: 'srgb' } | { kind: 'linear' } | { kind: 'gamma'; gamma: number }

/** What is known about how the frame was encoded; sets the clipping thresholds. */
export interface EncodingInfo {
  transfer: Transfer
  bitDepth: 8 | 16
}

/** Warning codes of one edge measurement (messages in `mtf/warnings.ts`). */
export type EdgeWarning =
  | 'roi-too-narrow'
  | 'few-phase-cycles'
  | 'critical-angle'
  | 'clipping'
  | 'low-contrast'
  | 'sharpening'

export type PsfModel = 'gaussian' | 'disk'

/** One model fitted to the edge spread function. */
export interface PsfFit {
  model: PsfModel
  /** Gaussian σ or disk radius R in pixels. */
  sizePx: number
  /** RMS of the ESF fit residual as a fraction of the edge step. */
  rmsResidual: number
}

/** The blur-kernel estimate: the better fit, plus both fits. */
export interface PsfEstimate {
  model: PsfModel
  sigmaPx?: number
  radiusPx?: number
  rmsResidual: number
  gaussian: PsfFit
  disk: PsfFit
}

/** Result of one slanted-edge measurement (ISO 12233 e-SFR) on one region. */
export interface EdgeMeasurement {
  roi: Roi
  orientation: EdgeOrientation
  polarity: EdgePolarity
  /** Edge angle off the vertical (vertical edges) or horizontal axis, degrees, signed. */
  angleDeg: number
  /** First frequency (c/p) where the SFR falls to 0.5; null when it does not within 1 c/p. */
  mtf50: number | null
  /** First frequency where the SFR falls to half its peak (robust to sharpening). */
  mtf50p: number | null
  mtf10: number | null
  /** SFR at 0.5 c/p. */
  mtfNyquist: number
  /** SFR on a 0.01 c/p grid from 0 to 1 c/p: `[[f, m], ...]`. */
  mtf: [number, number][]
  /** 10–90 % rise of the ESF along the edge normal, pixels. */
  rise1090Px: number
  /** Peak above the bright plateau, fraction of the step. */
  overshoot: number
  /** Dip below the dark plateau, fraction of the step. */
  undershoot: number
  /** Standard deviation of the linear luminance in the flat areas. */
  noise: number
  /** Edge step divided by the noise; null when the flat areas are noise-free. */
  snr: number | null
  /** Edge step in linear luminance (bright plateau − dark plateau). */
  contrast: number
  /** Rows (along the edge) used after trimming to whole phase cycles. */
  rowsUsed: number
  psf: PsfEstimate
  warnings: EdgeWarning[]
}

/** Frame-wide no-reference focus measures (compare only with the same camera's baseline). */
export interface FocusSummary {
  laplacianVariance: number
  tenengrad: number
  brenner: number
}

/** A region the edge search proposed that the measurement turned down, with the reason. */
export interface RejectedRegion {
  roi: Roi
  /** The measurement's message, e.g. "No usable edge in the region: …". */
  reason: string
}

/** Whole-frame result; the CLI prints it with the file name added. */
export interface FrameAnalysis {
  width: number
  height: number
  edges: EdgeMeasurement[]
  /** Found regions skipped because they hold no measurable edge (always empty with given regions). */
  rejected: RejectedRegion[]
  focus: FocusSummary
}
