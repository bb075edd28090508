import { encodeJpeg, encodePng, Image } from 'image-js'
import { describe, expect, it } from 'vitest'
import { assertFrameSize, readImageHeader } from '../header'

function pngHeader(width: number, height: number): Uint8Array {
  const b = new Uint8Array(33)
  b.set([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13, 0x49, 0x48, 0x44, 0x52])
  new DataView(b.buffer).setUint32(16, width)
  new DataView(b.buffer).setUint32(20, height)
  b[24] = 8
  return b
}

describe('image headers read before decoding', () => {
  it('reads the size of PNG and JPEG files written by image-js', () => {
    const img = new Image(37, 21, { colorModel: 'GREY' })
    expect(readImageHeader(encodePng(img))).toEqual({
      format: 'png',
      width: 37,
      height: 21,
      bitDepth: 8,
    })
    const img16 = new Image(5, 3, { colorModel: 'GREY', bitDepth: 16 })
    expect(readImageHeader(encodePng(img16)).bitDepth).toBe(16)
    expect(readImageHeader(encodeJpeg(img, { quality: 90 }))).toEqual({
      format: 'jpeg',
      width: 37,
      height: 21,
      bitDepth: 8,
    })
  })

  it('refuses a header that claims more than 100 megapixels', () => {
    const header = readImageHeader(pngHeader(20000, 20000))
    expect(() => assertFrameSize(header)).toThrow(
      /20000 × 20000 \(400\.0 MP\), larger than the 100 MP limit/,
    )
    expect(() => assertFrameSize(readImageHeader(pngHeader(10000, 10000)))).not.toThrow()
  })

  it('names files that are neither PNG nor JPEG, or are cut short', () => {
    expect(() => readImageHeader(new TextEncoder().encode('{"not":"an image"}'))).toThrow(TypeError)
    expect(() => readImageHeader(pngHeader(1, 1).subarray(0, 20))).toThrow(/cut short/)
    expect(() => readImageHeader(new Uint8Array([0xff, 0xd8, 0xff, 0xe0, 0, 16]))).toThrow(
      /cut short/,
    )
  })
})
