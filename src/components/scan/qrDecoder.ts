// Reads QR codes from the live video: the browser's own BarcodeDetector where it has one that
// knows QR codes (fast, native), otherwise the jsqr package on a downscaled copy of the frame.
// Both work offline: the package ships with the app.

/** The part of the Shape Detection API used here (not yet in TypeScript's DOM types). */
interface NativeDetector {
  detect(source: CanvasImageSource): Promise<{ rawValue: string }[]>
}
interface NativeDetectorClass {
  new (options: { formats: string[] }): NativeDetector
  getSupportedFormats(): Promise<string[]>
}

export interface QrDecoder {
  readonly engine: 'native' | 'jsqr'
  /** The text of a QR code in the video's current frame, or null. */
  decode(video: HTMLVideoElement): Promise<string | null>
}

/** Long side of the copy handed to jsqr: enough for a label filling a fifth of the view. */
export const SCAN_MAX_SIDE_PX = 960

async function nativeDetector(): Promise<NativeDetector | null> {
  const Detector = (globalThis as { BarcodeDetector?: NativeDetectorClass }).BarcodeDetector
  if (!Detector) return null
  try {
    const formats = await Detector.getSupportedFormats()
    return formats.includes('qr_code') ? new Detector({ formats: ['qr_code'] }) : null
  } catch {
    return null
  }
}

async function jsqrDecoder(): Promise<QrDecoder> {
  const { decodeQrPixels } = await import('./qrPixels')
  const canvas = document.createElement('canvas')
  const ctx = canvas.getContext('2d', { willReadFrequently: true })
  if (!ctx) throw new Error('This browser cannot copy the camera picture.')
  return {
    engine: 'jsqr',
    async decode(video) {
      const { videoWidth: w, videoHeight: h } = video
      if (!w || !h) return null
      const scale = Math.min(1, SCAN_MAX_SIDE_PX / Math.max(w, h))
      const sw = Math.max(1, Math.round(w * scale))
      const sh = Math.max(1, Math.round(h * scale))
      if (canvas.width !== sw || canvas.height !== sh) {
        canvas.width = sw
        canvas.height = sh
      }
      ctx.drawImage(video, 0, 0, sw, sh)
      return decodeQrPixels(ctx.getImageData(0, 0, sw, sh).data, sw, sh)
    },
  }
}

export async function createQrDecoder(): Promise<QrDecoder> {
  const native = await nativeDetector()
  if (!native) return jsqrDecoder()
  let fallback: Promise<QrDecoder> | null = null
  let failures = 0
  return {
    engine: 'native',
    async decode(video) {
      if (fallback) return (await fallback).decode(video)
      try {
        const found = await native.detect(video)
        failures = 0
        return found.find((b) => b.rawValue)?.rawValue ?? null
      } catch {
        // Some platforms list QR codes yet fail on every frame: after a few failures in a row,
        // switch to the package for good.
        if (++failures < 3) return null
        fallback = jsqrDecoder()
        return (await fallback).decode(video)
      }
    },
  }
}
