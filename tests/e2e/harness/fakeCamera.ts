// A fake phone camera for Chromium: a YUV4MPEG2 (y4m) video of a printed QR label that
// Chromium plays as the camera (--use-file-for-fake-video-capture). y4m is a text header and raw
// frames; with 4:2:0 chroma each frame is the luma plane then quarter-size U and V planes
// (neutral 128 here: a grey picture).
import { writeFileSync } from 'node:fs'
import QRCode from 'qrcode'

export interface QrSceneOptions {
  width?: number
  height?: number
  /** Size of one QR module on screen, px. */
  modulePx?: number
}

/** 8-bit luma of a grey scene with the QR symbol of `text` on a white label in the middle. */
export function qrLumaPicture(text: string, options: QrSceneOptions = {}): Uint8Array {
  const { width = 640, height = 480, modulePx = 8 } = options
  const qr = QRCode.create(text, { errorCorrectionLevel: 'M' }).modules
  const symbolPx = qr.size * modulePx
  const labelPx = symbolPx + 8 * modulePx // 4-module quiet zone each side
  if (labelPx > Math.min(width, height)) {
    throw new RangeError(
      `A ${qr.size}-module code at ${modulePx} px does not fit ${width} × ${height}.`,
    )
  }
  const x0 = Math.floor((width - symbolPx) / 2)
  const y0 = Math.floor((height - symbolPx) / 2)
  const luma = new Uint8Array(width * height)
  for (let y = 0; y < height; y++) {
    for (let x = 0; x < width; x++) {
      const dx = x - x0
      const dy = y - y0
      const onLabel =
        Math.max(Math.abs(dx - symbolPx / 2), Math.abs(dy - symbolPx / 2)) < labelPx / 2
      const onSymbol = dx >= 0 && dy >= 0 && dx < symbolPx && dy < symbolPx
      const dark = onSymbol && qr.get(Math.floor(dy / modulePx), Math.floor(dx / modulePx))
      // Dark modules and a light label, not pure black and white: a photo of paper.
      luma[y * width + x] = dark ? 30 : onLabel ? 225 : 110
    }
  }
  return luma
}

/** Writes `frames` copies of a grey picture as a 4:2:0 y4m file. */
export function writeGreyY4m(
  path: string,
  luma: Uint8Array,
  width: number,
  height: number,
  { frames = 10, fps = 10 } = {},
): void {
  if (width % 2 || height % 2) throw new RangeError('4:2:0 needs an even width and height.')
  if (luma.length !== width * height) throw new RangeError('The picture does not match its size.')
  const header = Buffer.from(`YUV4MPEG2 W${width} H${height} F${fps}:1 Ip A1:1 C420jpeg\n`)
  const chroma = Buffer.alloc((width / 2) * (height / 2) * 2, 128)
  const frame = Buffer.concat([Buffer.from('FRAME\n'), Buffer.from(luma), chroma])
  writeFileSync(path, Buffer.concat([header, ...Array.from({ length: frames }, () => frame)]))
}

/** A y4m file showing the QR code of `text`; returns the Chromium flags that make it the camera. */
export function fakeCameraShowing(path: string, text: string, options: QrSceneOptions = {}) {
  const { width = 640, height = 480 } = options
  writeGreyY4m(path, qrLumaPicture(text, { ...options, width, height }), width, height)
  return ['--use-fake-device-for-media-stream', `--use-file-for-fake-video-capture=${path}`]
}
