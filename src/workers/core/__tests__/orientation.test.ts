import { orientation as readOrientation } from 'exifr'
import jpeg from 'jpeg-js'
import { describe, expect, it } from 'vitest'
import { checkFrameHeader } from '../header'
import {
  applyOrientation,
  decoderApplied,
  normaliseOrientation,
  orientedSize,
  sourceOf,
} from '../orientation'

// EXIF orientation (TIFF 6.0 / Exif 2.3 tag 274): which stored pixel lands where on screen.
// The 3 × 2 picture below is stored as
//   a b c
//   d e f
// and each orientation's display follows from the tag's definition of row 0 and column 0.

const STORED = ['a', 'b', 'c', 'd', 'e', 'f']
const EXPECTED: Record<number, string[]> = {
  1: ['abc', 'def'],
  2: ['cba', 'fed'], // mirrored left–right
  3: ['fed', 'cba'], // turned 180°
  4: ['def', 'abc'], // mirrored top–bottom
  5: ['ad', 'be', 'cf'], // transposed
  6: ['da', 'eb', 'fc'], // turned 90° clockwise
  7: ['fc', 'eb', 'da'], // transverse
  8: ['cf', 'be', 'ad'], // turned 90° anticlockwise
}

function rgbaOf(letters: string[]): Uint8ClampedArray<ArrayBuffer> {
  const out = new Uint8ClampedArray(letters.length * 4)
  letters.forEach((l, i) => out.set([l.charCodeAt(0), 0, 0, 255], i * 4))
  return out
}

function rows(data: Uint8ClampedArray, width: number): string[] {
  const out: string[] = []
  for (let y = 0; y < data.length / 4 / width; y++) {
    let row = ''
    for (let x = 0; x < width; x++) row += String.fromCharCode(data[(y * width + x) * 4])
    out.push(row)
  }
  return out
}

/** A JPEG with an Exif APP1 segment that holds only the orientation tag. */
function jpegWithOrientation(width: number, height: number, orientation: number): Uint8Array {
  const data = Buffer.alloc(width * height * 4, 128)
  const plain = new Uint8Array(jpeg.encode({ data, width, height }, 80).data)
  const tiff = [
    0x4d,
    0x4d,
    0,
    42,
    0,
    0,
    0,
    8,
    0,
    1,
    0x01,
    0x12,
    0,
    3,
    0,
    0,
    0,
    1,
    0,
    orientation,
    0,
    0,
    0,
    0,
    0,
    0,
  ]
  const body = [0x45, 0x78, 0x69, 0x66, 0, 0, ...tiff]
  const app1 = [0xff, 0xe1, (body.length + 2) >> 8, (body.length + 2) & 0xff, ...body]
  return new Uint8Array([...plain.subarray(0, 2), ...app1, ...plain.subarray(2)])
}

describe('EXIF orientation', () => {
  it.each(Object.keys(EXPECTED).map(Number))(
    'orientation %i shows the stored pixels as the tag defines',
    (o) => {
      const out = applyOrientation(rgbaOf(STORED), 3, 2, o)
      expect(rows(out.data, out.width)).toEqual(EXPECTED[o])
      expect(out).toMatchObject(orientedSize(3, 2, o))
    },
  )

  it('maps every display pixel to a distinct stored pixel for all eight orientations', () => {
    for (let o = 1; o <= 8; o++) {
      const { width, height } = orientedSize(5, 3, o)
      const seen = new Set<string>()
      for (let y = 0; y < height; y++)
        for (let x = 0; x < width; x++) seen.add(sourceOf(x, y, 5, 3, o).join(','))
      expect(seen.size).toBe(15)
    }
  })

  it('swaps width and height only for the quarter turns 5–8', () => {
    expect([1, 2, 3, 4].map((o) => orientedSize(4000, 3000, o))).toEqual(
      Array(4).fill({ width: 4000, height: 3000 }),
    )
    expect([5, 6, 7, 8].map((o) => orientedSize(4000, 3000, o))).toEqual(
      Array(4).fill({ width: 3000, height: 4000 }),
    )
  })

  it('treats a missing or invalid tag as "as stored"', () => {
    expect([undefined, 0, 9, 2.5, '6'].map(normaliseOrientation)).toEqual([1, 1, 1, 1, 1])
  })

  it('tells whether the decoder already turned a portrait photo', () => {
    const stored = { width: 4000, height: 3000 }
    expect(decoderApplied(stored, { width: 3000, height: 4000 }, 6)).toBe(true)
    expect(decoderApplied(stored, { width: 4000, height: 3000 }, 6)).toBe(false)
    expect(decoderApplied(stored, { width: 4000, height: 3000 }, 3)).toBe(true)
  })

  it('reads the tag of a phone JPEG held sideways, whose header gives the stored size', async () => {
    const bytes = jpegWithOrientation(64, 48, 6)
    expect(await readOrientation(bytes)).toBe(6)
    const header = checkFrameHeader(bytes)
    expect(header).toMatchObject({ format: 'jpeg', width: 64, height: 48 })
    expect(orientedSize(header.width, header.height, 6)).toEqual({ width: 48, height: 64 })
  })
})
