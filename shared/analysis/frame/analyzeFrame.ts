import { findEdges, type FindEdgesOptions } from '../edge/findEdges'
import { brenner, laplacianVariance, tenengrad } from '../focus'
import { assertGreyImage, assertRoiInside } from '../image/validate'
import { measureEdge } from '../mtf/measureEdge'
import type {
  EdgeMeasurement,
  EncodingInfo,
  FrameAnalysis,
  GreyImage,
  RejectedRegion,
  Roi,
} from '../types'

export type AnalysisStage = 'edges' | 'measure' | 'focus' | 'done'

export interface AnalyzeFrameOptions {
  /** Regions to measure; when omitted the edges are found in the frame. */
  rois?: Roi[]
  /** How the frame was encoded (clipping thresholds). @default 8-bit sRGB */
  encodingInfo?: EncodingInfo
  /** Called as work progresses, `fraction` from 0 to 1. */
  onProgress?: (fraction: number, stage: AnalysisStage) => void
  /** Options of the edge search (ignored with `rois`). */
  findEdges?: Omit<FindEdgesOptions, 'encodingInfo'>
}

/**
 * Measures a whole frame: the slanted edges (given regions, or those the edge search finds),
 * each with its e-SFR, kernel fit and warnings, and the frame's no-reference focus measures
 * (variance of Laplacian, Tenengrad, Brenner; sums over the frame, replicate border).
 * A given region without a measurable edge throws a RangeError naming the region; a found
 * region the measurement turns down is skipped and listed in `rejected` with the reason.
 */
export function analyzeFrame(image: GreyImage, options: AnalyzeFrameOptions = {}): FrameAnalysis {
  assertGreyImage(image)
  const { encodingInfo, onProgress } = options
  const progress = (fraction: number, stage: AnalysisStage) => onProgress?.(fraction, stage)
  progress(0, 'edges')
  let targets: { roi: Roi; orientation?: 'vertical' | 'horizontal' }[]
  if (options.rois) {
    for (const roi of options.rois) assertRoiInside(roi, image.width, image.height)
    targets = options.rois.map((roi) => ({ roi }))
  } else {
    targets = findEdges(image, { ...options.findEdges, encodingInfo })
  }
  progress(0.3, 'measure')
  const edges: EdgeMeasurement[] = []
  const rejected: RejectedRegion[] = []
  targets.forEach((target, i) => {
    try {
      edges.push(measureEdge(image, target.roi, { orientation: target.orientation, encodingInfo }))
    } catch (error) {
      if (!(error instanceof RangeError)) throw error
      // A found region is only a candidate: skip it and measure the rest.
      if (!options.rois) rejected.push({ roi: { ...target.roi }, reason: error.message })
      else {
        const { x, y, w, h } = target.roi
        throw new RangeError(`Region ${x},${y},${w},${h}: ${error.message}`)
      }
    }
    progress(0.3 + (0.4 * (i + 1)) / targets.length, 'measure')
  })
  progress(0.7, 'focus')
  const focus = {
    laplacianVariance: laplacianVariance(image),
    tenengrad: tenengrad(image),
    brenner: brenner(image),
  }
  progress(1, 'done')
  return { width: image.width, height: image.height, edges, rejected, focus }
}
