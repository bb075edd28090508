import { describe, expect, it } from 'vitest'
import { RESTORATION_LABEL, toGreyImage } from '@shared/analysis'
import { firstBelow, kernelOtf, sinc } from '../../../../tests/fixtures/edges/analytic'
import { renderEdgeCodes, type EdgeSpec } from '../../../../tests/fixtures/edges/render'
import { kernelSidePx, linearToRgba, MIN_PREVIEW_NSR, restoreRegion } from '../restoration'

// The restoration preview of the worker on synthetic edges of known blur
// (tests/fixtures/edges: analytic ESF over a 1-px square pixel, 8-bit sRGB).

function edgeImage(spec: Pick<EdgeSpec, 'kernel'>) {
  const { width, height, codes } = renderEdgeCodes({
    widthPx: 96,
    heightPx: 96,
    angleDeg: 5,
    ...spec,
  })
  return toGreyImage({ width, height, data: codes, channels: 1, bitDepth: 8 })
}

/** Steepest step between neighbours along the middle row of RGBA pixels (sRGB codes). */
function steepest(rgba: Uint8ClampedArray, width: number, height: number): number {
  const row = Math.floor(height / 2) * width
  let max = 0
  for (let x = 1; x < width; x++)
    max = Math.max(max, Math.abs(rgba[4 * (row + x)] - rgba[4 * (row + x - 1)]))
  return max
}

describe('the restoration preview', () => {
  it('sizes the kernel to hold ±3σ of a Gaussian or the whole disk', () => {
    expect(kernelSidePx('gaussian', 2)).toBe(13)
    expect(kernelSidePx('disk', 3.2)).toBe(11)
    expect(kernelSidePx('gaussian', 0.1)).toBe(3)
    expect(kernelSidePx('gaussian', 40)).toBe(63)
  })

  it('shows linear light as sRGB codes (IEC 61966-2-1: linear 0.5 → 0.735357 → code 188)', () => {
    expect([...linearToRgba(new Float32Array([0, 0.5, 1, 1.7, -0.2]))]).toEqual([
      0, 0, 0, 255, 188, 188, 188, 255, 255, 255, 255, 255, 255, 255, 255, 255, 0, 0, 0, 255,
    ])
  })

  it.each(['wiener', 'richardson-lucy'] as const)(
    'sharpens a Gaussian edge with %s and labels the result as an illustration',
    (method) => {
      const image = edgeImage({ kernel: { type: 'gaussian', sigmaPx: 2 } })
      const roi = { x: 0, y: 0, w: 96, h: 96 }
      const p = restoreRegion(image, { roi, model: 'gaussian', sizePx: 2, method })
      expect(p.label).toBe(RESTORATION_LABEL)
      expect(p.label).toBe('illustrative — not evidential')
      expect(p.method).toBe(method)
      expect([p.width, p.height]).toEqual([96, 96])
      expect(steepest(p.after, 96, 96)).toBeGreaterThan(1.5 * steepest(p.before, 96, 96))
      expect(p.nsr).toBeGreaterThanOrEqual(MIN_PREVIEW_NSR)
    },
  )

  it('names the band a Gaussian blur lost where its transfer falls below the noise floor', () => {
    const sigma = 2
    const image = edgeImage({ kernel: { type: 'gaussian', sigmaPx: sigma } })
    const p = restoreRegion(image, {
      roi: { x: 0, y: 0, w: 96, h: 96 },
      model: 'gaussian',
      sizePx: sigma,
      method: 'wiener',
    })
    // The displayed kernel is the PSF integrated over the pixel: H(f) = exp(−2π²σ²f²)·sinc(f)
    // [calc, DOMAIN.md]; the band starts where it falls to √K.
    const expected = firstBelow(
      (f) => kernelOtf({ type: 'gaussian', sigmaPx: sigma }, f) * sinc(f),
      Math.sqrt(p.nsr),
    )
    expect(p.lost.bands).toHaveLength(1)
    expect(p.lost.bands[0].fromCyPx).toBeCloseTo(expected, 2)
    expect(p.lost.bands[0].toCyPx).toBe(0.5)
  })

  it('finds the first zero of a defocus disk at 0.609835 / R (Goodman; DOMAIN.md)', () => {
    const R = 3
    const image = edgeImage({ kernel: { type: 'disk', radiusPx: R } })
    const p = restoreRegion(image, {
      roi: { x: 0, y: 0, w: 96, h: 96 },
      model: 'disk',
      sizePx: R,
      method: 'wiener',
    })
    expect(p.lost.zerosCyPx[0]).toBeCloseTo(0.609835 / R, 2)
  })

  it('refuses a region outside the frame and a kernel without a size', () => {
    const image = edgeImage({ kernel: { type: 'gaussian', sigmaPx: 1 } })
    expect(() =>
      restoreRegion(image, {
        roi: { x: 200, y: 0, w: 10, h: 10 },
        model: 'gaussian',
        sizePx: 1,
        method: 'wiener',
      }),
    ).toThrow(/outside the frame/)
    expect(() =>
      restoreRegion(image, {
        roi: { x: 0, y: 0, w: 96, h: 96 },
        model: 'gaussian',
        sizePx: 0,
        method: 'wiener',
      }),
    ).toThrow(/positive number of pixels/)
  })
})
