import { describe, expect, it } from 'vitest'
import { encodePngGrey } from '../../../../tests/fixtures/edges/render'
import { clampRoi, cropRgba, previewSize } from '../frame'
import { checkFrameHeader, FrameImportError, MAX_IMPORT_PIXELS } from '../header'

function importError(bytes: Uint8Array): FrameImportError {
  try {
    checkFrameHeader(bytes)
  } catch (e) {
    if (e instanceof FrameImportError) return e
    throw e
  }
  throw new Error('accepted')
}

/** A PNG signature and IHDR that claim `w × h` (nothing after it). */
function pngHeader(w: number, h: number): Uint8Array {
  const b = new Uint8Array(33)
  b.set([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13, 0x49, 0x48, 0x44, 0x52])
  new DataView(b.buffer).setUint32(16, w)
  new DataView(b.buffer).setUint32(20, h)
  b[24] = 8
  return b
}

describe('checking an imported file from its header', () => {
  it('accepts a PNG and reads its size without decoding it', () => {
    const png = encodePngGrey(40, 30, new Uint8Array(1200))
    expect(checkFrameHeader(png)).toMatchObject({ format: 'png', width: 40, height: 30 })
  })

  it('turns each bad file into a message that says what to do', () => {
    const empty = importError(new Uint8Array(0))
    expect(empty.code).toBe('empty')
    const text = importError(new TextEncoder().encode('GIF89a…'))
    expect(text.code).toBe('unsupported')
    expect(text.message).toMatch(/not a PNG or JPEG.*Export the frame as PNG or JPEG/)
    const cut = importError(pngHeader(100, 100).subarray(0, 20))
    expect(cut.code).toBe('unreadable')
    expect(cut.message).toMatch(/export it again/)
  })

  it('refuses a frame over 24 MP before decoding it, naming its size', () => {
    expect(MAX_IMPORT_PIXELS).toBe(24_000_000)
    const huge = importError(pngHeader(6000, 5000))
    expect(huge.code).toBe('too-large')
    expect(huge.message).toContain('6000 × 5000 px (30.0 MP); the limit is 24 MP')
    expect(checkFrameHeader(pngHeader(6000, 4000))).toMatchObject({ width: 6000, height: 4000 })
  })
})

describe('frame helpers', () => {
  it('crops RGBA pixels row by row', () => {
    const rgba = new Uint8ClampedArray(4 * 4 * 3).map((_, i) => i)
    const crop = cropRgba(rgba, 4, { x: 1, y: 1, w: 2, h: 2 })
    expect([...crop]).toEqual([20, 21, 22, 23, 24, 25, 26, 27, 36, 37, 38, 39, 40, 41, 42, 43])
    expect(() => cropRgba(rgba, 4, { x: 3, y: 0, w: 2, h: 1 })).toThrow(/does not lie inside/)
  })

  it('rounds and cuts a region to the frame, or drops it when nothing is left', () => {
    expect(clampRoi({ x: -4.4, y: 10.6, w: 50, h: 500 }, 100, 100)).toEqual({
      x: 0,
      y: 11,
      w: 46,
      h: 89,
    })
    expect(clampRoi({ x: 120, y: 0, w: 10, h: 10 }, 100, 100)).toBeNull()
  })

  it('scales the on-screen copy down to 2048 px on the long side, never up', () => {
    expect(previewSize(6000, 4000)).toEqual({ width: 2048, height: 1365 })
    expect(previewSize(1280, 800)).toEqual({ width: 1280, height: 800 })
  })
})
