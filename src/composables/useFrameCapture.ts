// Getting a frame: a file (camera snapshot, recorder export, or the phone's camera through the
// file input) checked from its header before anything is decoded, or a still from a live
// preview (getUserMedia) where the browser allows it.
import { onScopeDispose, ref, shallowRef } from 'vue'
import { liveCameraSupported } from '@/utils/camera'
import type { ImageHeader } from '@shared/analysis'
import {
  checkFrameHeader,
  FrameImportError,
  HEADER_BYTES,
  MAX_IMPORT_BYTES,
} from '@/workers/core/header'

export interface AcceptedFrame {
  file: Blob
  name: string
  header: ImageHeader
}

/** Checks a chosen file without decoding it; throws a FrameImportError that says what to do. */
export async function validateFrameFile(file: Blob, name = 'frame'): Promise<AcceptedFrame> {
  if (file.size > MAX_IMPORT_BYTES) {
    const mb = (file.size / 1024 / 1024).toFixed(0)
    throw new FrameImportError(
      'too-large',
      `The file is ${mb} MB; the limit is ${MAX_IMPORT_BYTES / 1024 / 1024} MB. Export a smaller snapshot.`,
    )
  }
  let head: Uint8Array
  try {
    head = new Uint8Array(await file.slice(0, HEADER_BYTES).arrayBuffer())
  } catch {
    throw new FrameImportError(
      'unreadable',
      'The file could not be read from the device. Choose it again, or copy it to the phone first.',
    )
  }
  return { file, name, header: checkFrameHeader(head) }
}

/** A still from a playing video element, as a PNG file (lossless: no extra compression). */
export async function grabVideoFrame(video: HTMLVideoElement): Promise<Blob> {
  const { videoWidth: w, videoHeight: h } = video
  if (!w || !h) throw new Error('The camera preview has not started yet.')
  const canvas = document.createElement('canvas')
  canvas.width = w
  canvas.height = h
  const ctx = canvas.getContext('2d')
  if (!ctx) throw new Error('This browser cannot copy the camera preview.')
  ctx.drawImage(video, 0, 0, w, h)
  return new Promise((resolve, reject) =>
    canvas.toBlob(
      (b) => (b ? resolve(b) : reject(new Error('The still could not be saved.'))),
      'image/png',
    ),
  )
}

export function useFrameCapture() {
  const error = ref<string | null>(null)
  const checking = ref(false)
  const accepted = shallowRef<AcceptedFrame | null>(null)
  const stream = shallowRef<MediaStream | null>(null)
  let liveAttempt = 0
  const liveSupported = liveCameraSupported()

  async function accept(file: Blob, name?: string): Promise<AcceptedFrame | null> {
    error.value = null
    checking.value = true
    try {
      const frame = await validateFrameFile(file, name ?? (file as File).name ?? 'frame')
      accepted.value = frame
      return frame
    } catch (e) {
      error.value = e instanceof FrameImportError ? e.message : 'The file could not be read.'
      return null
    } finally {
      checking.value = false
    }
  }

  async function startLive(video: HTMLVideoElement): Promise<boolean> {
    error.value = null
    if (!liveSupported) {
      error.value =
        'Live preview is not available in this browser: use “Take photo” or “Import file”.'
      return false
    }
    const attempt = ++liveAttempt
    try {
      const s = await navigator.mediaDevices.getUserMedia({
        video: { facingMode: 'environment', width: { ideal: 3840 }, height: { ideal: 2160 } },
        audio: false,
      })
      if (attempt !== liveAttempt) {
        // Stopped while the browser was still opening the camera: let it go at once.
        s.getTracks().forEach((t) => t.stop())
        return false
      }
      stream.value = s
      video.srcObject = s
      await video.play()
      return true
    } catch (e) {
      stopLive()
      const denied = e instanceof DOMException && e.name === 'NotAllowedError'
      error.value = denied
        ? 'The camera permission was refused. Allow it in the browser settings, or use “Take photo”.'
        : 'The camera could not be started. Use “Take photo” or “Import file” instead.'
      return false
    }
  }

  function stopLive(): void {
    liveAttempt++ // a start still waiting for the camera gives it up when it arrives
    stream.value?.getTracks().forEach((t) => t.stop())
    stream.value = null
  }

  async function captureLive(video: HTMLVideoElement): Promise<AcceptedFrame | null> {
    try {
      const still = await grabVideoFrame(video)
      stopLive()
      return accept(still, `live-${new Date().toISOString()}.png`)
    } catch (e) {
      error.value = (e as Error).message
      return null
    }
  }

  /** Shows a problem met outside this composable (e.g. while grabbing a still). */
  function fail(message: string): void {
    error.value = message
  }

  function reset(): void {
    accepted.value = null
    error.value = null
  }

  onScopeDispose(stopLive)

  return {
    error,
    checking,
    accepted,
    stream,
    liveSupported,
    accept,
    startLive,
    stopLive,
    captureLive,
    fail,
    reset,
  }
}
