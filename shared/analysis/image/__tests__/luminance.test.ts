import { describe, expect, it } from 'vitest'
import { toGreyImage } from '../luminance'
import { srgbToLinear } from '../transfer'

describe('luminance from decoded frames', () => {
  it('weights linear R, G, B by Rec. 709 by default (0.2126, 0.7152, 0.0722)', () => {
    // ITU-R BT.709 luma coefficients on linear light.
    const data = new Uint8Array([255, 0, 0, 0, 255, 0, 0, 0, 255, 255, 255, 255])
    const img = toGreyImage({ width: 4, height: 1, data, channels: 3, bitDepth: 8 })
    expect(Array.from(img.data).map((v) => +v.toFixed(6))).toEqual([0.2126, 0.7152, 0.0722, 1])
  })

  it('uses Rec. 601 weights (0.299, 0.587, 0.114) on request', () => {
    // ITU-R BT.601 luma coefficients.
    const data = new Uint8Array([255, 0, 0, 255, 0, 255, 0, 255, 0, 0, 255, 255])
    const img = toGreyImage(
      { width: 3, height: 1, data, channels: 4, bitDepth: 8 },
      { weights: 'rec601', transfer: { kind: 'linear' } },
    )
    expect(Array.from(img.data).map((v) => +v.toFixed(6))).toEqual([0.299, 0.587, 0.114])
  })

  it('linearises before weighting, ignores alpha and handles grey, grey+alpha and 16-bit data', () => {
    const rgba = toGreyImage({
      width: 1,
      height: 1,
      data: new Uint8Array([128, 128, 128, 7]),
      channels: 4,
      bitDepth: 8,
    })
    expect(rgba.data[0]).toBeCloseTo(srgbToLinear(128 / 255), 6)
    const greyA = toGreyImage({
      width: 2,
      height: 1,
      data: new Uint8Array([0, 9, 255, 0]),
      channels: 2,
      bitDepth: 8,
    })
    expect(Array.from(greyA.data)).toEqual([0, 1])
    const grey16 = toGreyImage({
      width: 1,
      height: 1,
      data: new Uint16Array([30000]),
      channels: 1,
      bitDepth: 16,
    })
    expect(grey16.data[0]).toBeCloseTo(srgbToLinear(30000 / 65535), 6)
  })

  it('rejects a buffer whose length does not match the size, and odd channel counts', () => {
    expect(() =>
      toGreyImage({ width: 2, height: 2, data: new Uint8Array(11), channels: 3, bitDepth: 8 }),
    ).toThrow(RangeError)
    expect(() =>
      toGreyImage({ width: 2, height: 2, data: new Uint8Array(11), channels: 3, bitDepth: 8 }),
    ).toThrow(/2 × 2 × 3 needs 12/)
    expect(() =>
      toGreyImage({ width: 1, height: 1, data: new Uint8Array(5), channels: 5, bitDepth: 8 }),
    ).toThrow(/1 to 4 channels/)
    expect(() =>
      toGreyImage({ width: 0, height: 1, data: new Uint8Array(0), channels: 1, bitDepth: 8 }),
    ).toThrow(/positive integer/)
  })
})

describe('caller-owned output buffer', () => {
  it('writes into the buffer it is given and refuses one of the wrong size', () => {
    const out = new Float32Array(2)
    const img = toGreyImage(
      { width: 2, height: 1, data: new Uint8Array([0, 255]), channels: 1, bitDepth: 8 },
      { out },
    )
    expect(img.data).toBe(out)
    expect(Array.from(out)).toEqual([0, 1])
    expect(() =>
      toGreyImage(
        { width: 2, height: 1, data: new Uint8Array([0, 255]), channels: 1, bitDepth: 8 },
        { out: new Float32Array(3) },
      ),
    ).toThrow(/holds 3 samples, but the image needs 2/)
  })
})
