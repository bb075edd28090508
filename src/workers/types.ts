// What crosses between the page and the analysis worker (comlink). Geometry is in pixels of the
// frame as shown (EXIF orientation applied); frequencies in cycles/pixel along the edge normal.
import type { EdgeMeasurement, EdgeOrientation, PsfModel, Roi } from '@shared/analysis'
import type { LostFrequencies } from '@shared/analysis/restoration'

export type { EdgeMeasurement, EdgeOrientation, PsfModel, Roi }

/** Stages the worker reports with its progress. */
export type AnalysisStage = 'decode' | 'luminance' | 'edges' | 'measure' | 'done'

/** Progress callback: `fraction` from 0 to 1 of the current job. */
export type ProgressFn = (fraction: number, stage: AnalysisStage) => void

/** The decoded frame the worker now holds. */
export interface FrameInfo {
  width: number
  height: number
  /** EXIF orientation found in the file (1 = as stored). */
  orientation: number
  /** Who turned the picture upright: the browser's decoder, this worker, or nobody (1). */
  orientationAppliedBy: 'decoder' | 'worker' | 'none'
  /** A smaller JPEG of the frame for the screen (long side at most PREVIEW_MAX_PX). */
  preview: Blob
  previewWidth: number
  previewHeight: number
}

/** An edge region the engine found in the frame. */
export interface FoundRegion {
  roi: Roi
  orientation: EdgeOrientation
  angleDeg: number
  /** Michelson contrast of the edge. */
  contrast: number
}

export interface RegionRequest {
  id: string
  roi: Roi
  /** Detected from the gradients when omitted (hand-drawn regions). */
  orientation?: EdgeOrientation
}

/** The ESF and LSF of one edge for the profile chart, along the edge normal. */
export interface EdgeProfile {
  /** Distance from the fitted edge, px. */
  xPx: number[]
  /** Edge spread, 0 on the dark side to 1 on the bright side. */
  esf: number[]
  /** Line spread (derivative of the ESF), peak scaled to 1. */
  lsf: number[]
}

export type RegionOutcome =
  | { id: string; roi: Roi; ok: true; measurement: EdgeMeasurement; profile: EdgeProfile }
  | { id: string; roi: Roi; ok: false; error: string }

export interface RestorationRequest {
  roi: Roi
  model: PsfModel
  /** Gaussian σ or disk radius R, px. */
  sizePx: number
  method: 'wiener' | 'richardson-lucy'
  /** Noise σ in linear light (the edge's flat-area noise); estimated when omitted. */
  noiseSigma?: number
}

/** Before and after, as RGBA pixels ready for a canvas, with what cannot come back. */
export interface RestorationPreview {
  width: number
  height: number
  before: Uint8ClampedArray
  after: Uint8ClampedArray
  method: 'wiener' | 'richardson-lucy'
  parameters: Record<string, number | string | boolean>
  label: string
  /** Noise-to-signal ratio the lost bands were judged with. */
  nsr: number
  lost: LostFrequencies
}

export interface AnalysisWorkerApi {
  /** Decodes an image file (PNG or JPEG) and keeps its luminance for the jobs below. */
  loadFrame(file: Blob, onProgress?: ProgressFn): Promise<FrameInfo>
  /** Finds the slanted edges of the frame. */
  findRegions(onProgress?: ProgressFn): Promise<FoundRegion[]>
  /** Measures regions (ISO 12233 e-SFR, kernel fit, warnings); one bad region fails alone. */
  measureRegions(regions: RegionRequest[], onProgress?: ProgressFn): Promise<RegionOutcome[]>
  /** Restores one region with the measured kernel: an illustration, never a record. */
  restorePreview(request: RestorationRequest): Promise<RestorationPreview>
  /** The region's original pixels as a PNG (uploaded for the server's re-check). */
  cropPng(roi: Roi): Promise<Blob>
  /** Forgets the frame. */
  release(): void
}
