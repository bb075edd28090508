// The package decoder against QR symbols made by an independent encoder (the `qrcode` package,
// the one that draws the labels and targets), at the sizes and contrasts a phone sees.
import QRCode from 'qrcode'
import { describe, expect, it } from 'vitest'
import { encodeCameraLabel } from '@shared/target'
import { decodeQrPixels } from '../qrPixels'

interface Scene {
  width: number
  height: number
  /** Module size in pixels and top-left corner of the symbol. */
  modulePx: number
  x0: number
  y0: number
  dark: number
  light: number
  /** Uniform noise amplitude (± code values), from a fixed-seed generator. */
  noise?: number
}

/** An RGBA picture of a grey scene with the QR symbol of `text` printed on a light label. */
function render(text: string, s: Scene): Uint8ClampedArray {
  const qr = QRCode.create(text, { errorCorrectionLevel: 'M' }).modules
  const out = new Uint8ClampedArray(s.width * s.height * 4)
  let seed = 12345
  const rand = () => ((seed = (seed * 1103515245 + 12345) & 0x7fffffff) / 0x7fffffff) * 2 - 1
  const quiet = 4 * s.modulePx
  for (let y = 0; y < s.height; y++) {
    for (let x = 0; x < s.width; x++) {
      const mx = Math.floor((x - s.x0) / s.modulePx)
      const my = Math.floor((y - s.y0) / s.modulePx)
      const onSymbol = mx >= 0 && my >= 0 && mx < qr.size && my < qr.size
      const onLabel =
        x >= s.x0 - quiet &&
        y >= s.y0 - quiet &&
        x < s.x0 + qr.size * s.modulePx + quiet &&
        y < s.y0 + qr.size * s.modulePx + quiet
      let v = onSymbol && qr.get(my, mx) ? s.dark : onLabel ? s.light : 90
      if (s.noise) v += s.noise * rand()
      const i = 4 * (y * s.width + x)
      out[i] = out[i + 1] = out[i + 2] = v
      out[i + 3] = 255
    }
  }
  return out
}

describe('decoding a QR label from camera pixels', () => {
  const text = encodeCameraLabel({ assetTag: 'MTD-004' })

  it('reads a label printed black on white', () => {
    const scene = { width: 320, height: 240, modulePx: 5, x0: 90, y0: 60, dark: 0, light: 255 }
    expect(decodeQrPixels(render(text, scene), scene.width, scene.height)).toBe(text)
  })

  it('reads a small, low-contrast, noisy label off centre', () => {
    const scene = {
      width: 640,
      height: 360,
      modulePx: 3,
      x0: 400,
      y0: 40,
      dark: 70,
      light: 190,
      noise: 20,
    }
    expect(decodeQrPixels(render(text, scene), scene.width, scene.height)).toBe(text)
  })

  it('finds nothing in a picture without a code', () => {
    const blank = new Uint8ClampedArray(160 * 120 * 4).fill(128)
    expect(decodeQrPixels(blank, 160, 120)).toBeNull()
  })

  it('refuses a buffer that does not match the stated size', () => {
    expect(() => decodeQrPixels(new Uint8ClampedArray(100), 10, 10)).toThrow(/needs 400/)
    expect(() => decodeQrPixels(new Uint8ClampedArray(0), 0, 10)).toThrow(RangeError)
  })
})
