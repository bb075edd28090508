// The analysis worker: decodes the frame (createImageBitmap + OffscreenCanvas), keeps its
// luminance, and runs the engine (shared/analysis) through the thin functions in ./core.
// The page talks to it through comlink; cancelling means terminating the worker.
import { expose } from 'comlink'
import { orientation as readOrientation } from 'exifr'
import type { GreyImage, Roi } from '@shared/analysis'
import { checkFrameHeader } from './core/header'
import { clampRoi, cropRgba, greyFromRgba, previewSize } from './core/frame'
import { applyOrientation, decoderApplied, normaliseOrientation } from './core/orientation'
import { findRegions, measureRegions } from './core/regions'
import { restoreRegion } from './core/restoration'
import type { AnalysisWorkerApi, FrameInfo } from './types'

interface HeldFrame {
  width: number
  height: number
  rgba: Uint8ClampedArray<ArrayBuffer>
  grey: GreyImage
}

let frame: HeldFrame | null = null

function held(): HeldFrame {
  if (!frame) throw new Error('No frame is loaded: import or take a photo first.')
  return frame
}

function canvas2d(width: number, height: number) {
  const canvas = new OffscreenCanvas(width, height)
  const ctx = canvas.getContext('2d', { willReadFrequently: true })
  if (!ctx) throw new Error('This browser cannot draw images in the background.')
  return { canvas, ctx }
}

async function decode(file: Blob): Promise<ImageBitmap> {
  try {
    return await createImageBitmap(file, { imageOrientation: 'from-image' })
  } catch {
    throw new Error(
      'The image could not be decoded: the file may be damaged or cut short. Export it again or take a new photo.',
    )
  }
}

const api: AnalysisWorkerApi = {
  async loadFrame(file, onProgress) {
    frame = null
    onProgress?.(0, 'decode')
    const head = new Uint8Array(await file.slice(0, 256 * 1024).arrayBuffer())
    const header = checkFrameHeader(head)
    let orientation = 1
    try {
      orientation = normaliseOrientation(await readOrientation(head))
    } catch {
      orientation = 1 // no readable EXIF: as stored
    }
    const bitmap = await decode(file)
    onProgress?.(0.4, 'decode')
    let { width, height } = { width: bitmap.width, height: bitmap.height }
    const { ctx } = canvas2d(width, height)
    ctx.drawImage(bitmap, 0, 0)
    bitmap.close()
    let rgba = ctx.getImageData(0, 0, width, height).data
    let appliedBy: FrameInfo['orientationAppliedBy'] = orientation === 1 ? 'none' : 'decoder'
    if (!decoderApplied(header, { width, height }, orientation)) {
      const turned = applyOrientation(rgba, width, height, orientation)
      ;({ width, height } = turned)
      rgba = turned.data
      appliedBy = 'worker'
    }
    onProgress?.(0.6, 'luminance')
    const grey = greyFromRgba(rgba, width, height)
    frame = { width, height, rgba, grey }
    onProgress?.(0.85, 'luminance')
    const size = previewSize(width, height)
    const full = canvas2d(width, height)
    full.ctx.putImageData(new ImageData(rgba, width, height), 0, 0)
    const small = canvas2d(size.width, size.height)
    small.ctx.drawImage(full.canvas, 0, 0, size.width, size.height)
    const preview = await small.canvas.convertToBlob({ type: 'image/jpeg', quality: 0.85 })
    onProgress?.(1, 'done')
    return {
      width,
      height,
      orientation,
      orientationAppliedBy: appliedBy,
      preview,
      previewWidth: size.width,
      previewHeight: size.height,
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

  async cropPng(roi: Roi) {
    const f = held()
    const r = clampRoi(roi, f.width, f.height)
    if (!r) throw new RangeError('The region lies outside the frame.')
    const { canvas, ctx } = canvas2d(r.w, r.h)
    ctx.putImageData(new ImageData(cropRgba(f.rgba, f.width, r), r.w, r.h), 0, 0)
    return canvas.convertToBlob({ type: 'image/png' })
  },

  release() {
    frame = null
  },
}

expose(api)
