import { describe, expect, it } from 'vitest'
import { encodePngGrey, renderEdgeCodes } from '../../../../tests/fixtures/edges/render'
import { expectedMtf50 } from '../../../../tests/fixtures/edges/analytic'
import { AppError } from '../../../errors'
import { cropRaw, decodeImage, inspectImage } from '../image'
import { remeasure } from '../remeasure'

function appError(fn: () => unknown): AppError {
  try {
    fn()
  } catch (err) {
    if (err instanceof AppError) return err
    throw err
  }
  throw new Error('expected an AppError')
}

describe('inspecting an uploaded image before decoding', () => {
  it('recognises PNG by its bytes and reads its size', () => {
    const png = encodePngGrey(32, 20, new Uint8Array(640))
    expect(inspectImage(png)).toMatchObject({
      mime: 'image/png',
      ext: 'png',
      header: { width: 32, height: 20 },
    })
  })

  it('refuses empty files, other formats and oversize headers with distinct codes', () => {
    expect(appError(() => inspectImage(new Uint8Array(0)))).toMatchObject({
      status: 400,
      code: 'upload.empty',
    })
    expect(appError(() => inspectImage(new TextEncoder().encode('GIF89a....')))).toMatchObject({
      status: 415,
      code: 'upload.unsupported_type',
    })
    const header = encodePngGrey(4, 4, new Uint8Array(16))
    const huge = header.slice()
    new DataView(huge.buffer).setUint32(16, 20_000)
    new DataView(huge.buffer).setUint32(20, 6_000) // 120 MP > 100 MP
    expect(appError(() => inspectImage(huge))).toMatchObject({
      status: 422,
      code: 'upload.too_many_pixels',
    })
  })

  it('names a PNG cut short in its data as undecodable', () => {
    const png = encodePngGrey(
      64,
      64,
      new Uint8Array(4096).map((_, i) => (i * 37) % 256),
    )
    const cut = png.subarray(0, Math.floor(png.length / 2))
    expect(appError(() => decodeImage(cut, inspectImage(cut)))).toMatchObject({
      status: 422,
      code: 'upload.undecodable',
    })
  })
})

describe('cropping raw pixels', () => {
  it('copies exactly the rectangle, row by row', () => {
    const raw = {
      width: 4,
      height: 3,
      channels: 1,
      bitDepth: 8 as const,
      data: Uint8Array.from([0, 1, 2, 3, 10, 11, 12, 13, 20, 21, 22, 23]),
    }
    expect(Array.from(cropRaw(raw, 1, 1, 2, 2).data)).toEqual([11, 12, 21, 22])
  })
})

describe('re-measuring a region on the server', () => {
  // Analytic MTF50 of a Gaussian (σ = 0.8 px) edge over a 1-px pixel at 6° (tests/fixtures/edges).
  const kernel = { type: 'gaussian' as const, sigmaPx: 0.8 }
  const expected = expectedMtf50(kernel, 6)
  const edge = renderEdgeCodes({ kernel, angleDeg: 6, widthPx: 100, heightPx: 100 })
  const raw = { width: 100, height: 100, channels: 1, bitDepth: 8 as const, data: edge.codes }
  const roi = { x: 0, y: 0, w: 100, h: 100 }
  const device = (mtf50CyPx: number) => ({
    id: '0d7e5b57-4a50-4c1f-9d51-3b0f43c1a0aa',
    roiX: 0,
    roiY: 0,
    roiW: 100,
    roiH: 100,
    orientation: 'vertical' as const,
    mtf50CyPx,
  })

  it('agrees with a device value equal to the analytic MTF50', () => {
    const r = remeasure(raw, roi, device(expected), 'srgb')
    expect(Math.abs(r.serverMtf50CyPx! - expected) / expected).toBeLessThan(0.02)
    expect(r.disagreement).toBe(false)
  })

  it('flags a device value 5 % off as a disagreement', () => {
    const r = remeasure(raw, roi, device(expected * 1.05), 'srgb')
    expect(r.disagreement).toBe(true)
    expect(r.relativeDifference!).toBeGreaterThan(0.02)
  })

  it('flags a region with no edge, with the engine’s reason', () => {
    const flat = { ...raw, data: new Uint8Array(10_000).fill(128) }
    const r = remeasure(flat, roi, device(expected), 'srgb')
    expect(r).toMatchObject({ serverMtf50CyPx: null, disagreement: true })
    expect(r.error).toBeTruthy()
  })
})
