import { encode as encodePng } from 'fast-png'
import jpeg from 'jpeg-js'
import { describe, expect, it } from 'vitest'
import { AppError } from '../../../errors'
import { sniffImage } from '../photos'

const png = (width: number, height: number) =>
  Buffer.from(encodePng({ width, height, data: new Uint8Array(width * height * 3), channels: 3 }))
const jpg = (width: number, height: number) =>
  Buffer.from(jpeg.encode({ width, height, data: Buffer.alloc(width * height * 4, 90) }, 75).data)

describe('sniffing photo bytes', () => {
  it('reads the size of PNG and JPEG files made by independent encoders', () => {
    expect(sniffImage(png(17, 9))).toEqual({ mime: 'image/png', width: 17, height: 9 })
    expect(sniffImage(jpg(33, 21))).toEqual({ mime: 'image/jpeg', width: 33, height: 21 })
  })

  it('refuses other formats and damaged files with a sentence', () => {
    const cases: [Buffer, string][] = [
      [Buffer.alloc(0), 'The photo file is empty.'],
      [Buffer.from('GIF89a……'), 'Only PNG and JPEG photos can be attached.'],
      [png(4, 4).subarray(0, 16), 'The PNG file is damaged: it has no image header.'],
      [jpg(8, 8).subarray(0, 40), 'The JPEG file is damaged'],
    ]
    for (const [bytes, message] of cases) {
      let caught: unknown
      try {
        sniffImage(bytes)
      } catch (err) {
        caught = err
      }
      expect(caught).toBeInstanceOf(AppError)
      expect((caught as AppError).status).toBe(400)
      expect((caught as AppError).message).toContain(message)
    }
  })

  it('refuses a header claiming more than 100 megapixels', () => {
    const big = png(2, 2)
    big.writeUInt32BE(20_000, 16)
    big.writeUInt32BE(20_000, 20)
    expect(() => sniffImage(big)).toThrow('at most 100 megapixels')
  })
})
