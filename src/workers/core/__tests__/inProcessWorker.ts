// The analysis worker's API run in-process for tests (Node has no Worker, OffscreenCanvas or
// createImageBitmap): image-js decodes and encodes; everything else is the worker's own core.
import { decode, encodePng, Image } from 'image-js'
import type { GreyImage } from '@shared/analysis'
import type { WorkerHandle } from '@/composables/useAnalysisWorker'
import type { AnalysisWorkerApi } from '../../types'
import { clampRoi, cropRgba, greyFromRgba } from '../frame'
import { checkFrameHeader } from '../header'
import { findRegions, measureRegions } from '../regions'
import { restoreRegion } from '../restoration'

/** Decoded pixels as RGBA, whatever the file's channels. */
export function toRgba(bytes: Uint8Array): {
  width: number
  height: number
  rgba: Uint8ClampedArray<ArrayBuffer>
} {
  const raw = decode(bytes).getRawImage()
  const { width, height, channels, data } = raw
  const rgba = new Uint8ClampedArray(width * height * 4)
  for (let i = 0; i < width * height; i++) {
    const grey = channels < 3
    rgba[4 * i] = data[i * channels]
    rgba[4 * i + 1] = data[i * channels + (grey ? 0 : 1)]
    rgba[4 * i + 2] = data[i * channels + (grey ? 0 : 2)]
    rgba[4 * i + 3] = 255
  }
  return { width, height, rgba }
}

export interface InProcessWorker extends WorkerHandle {
  api: AnalysisWorkerApi
  stats: { loads: number; terminated: number }
}

export function inProcessWorker(stats = { loads: 0, terminated: 0 }): InProcessWorker {
  let frame: {
    width: number
    height: number
    rgba: Uint8ClampedArray<ArrayBuffer>
    grey: GreyImage
  } | null = null
  const held = () => {
    if (!frame) throw new Error('No frame is loaded: import or take a photo first.')
    return frame
  }
  const api: AnalysisWorkerApi = {
    async loadFrame(file, onProgress) {
      const bytes = new Uint8Array(await file.arrayBuffer())
      checkFrameHeader(bytes)
      const { width, height, rgba } = toRgba(bytes)
      frame = { width, height, rgba, grey: greyFromRgba(rgba, width, height) }
      stats.loads++
      onProgress?.(1, 'done')
      return {
        width,
        height,
        orientation: 1,
        orientationAppliedBy: 'none',
        preview: new Blob([]),
        previewWidth: width,
        previewHeight: height,
      }
    },
    async findRegions(onProgress) {
      return findRegions(held().grey, onProgress)
    },
    async measureRegions(regions, onProgress) {
      return measureRegions(held().grey, regions, onProgress)
    },
    async restorePreview(request) {
      return restoreRegion(held().grey, request)
    },
    async cropPng(roi) {
      const f = held()
      const r = clampRoi(roi, f.width, f.height)!
      const img = new Image(r.w, r.h, {
        colorModel: 'RGBA',
        data: new Uint8Array(cropRgba(f.rgba, f.width, r).buffer),
      })
      return new Blob([new Uint8Array(encodePng(img))], { type: 'image/png' })
    },
    release() {
      frame = null
    },
  }
  return { api, stats, terminate: () => void stats.terminated++ }
}
