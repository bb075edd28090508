import { describe, expect, it } from 'vitest'
import { renderTargetFrame } from '../../../../tests/fixtures/edges/frame'
import { renderEdgeLinear } from '../../../../tests/fixtures/edges/render'
import { toGreyImage } from '../../image/luminance'
import type { GreyImage } from '../../types'
import { analyzeFrame } from '../analyzeFrame'

const targetFrame = (sigmaPx: number): GreyImage => {
  const f = renderTargetFrame({ width: 1920, height: 1080, sigmaPx, seed: 2 })
  return toGreyImage({ width: f.width, height: f.height, data: f.codes, channels: 1, bitDepth: 8 })
}

describe('whole-frame analysis', () => {
  const sharp = targetFrame(1.5)

  it('finds and measures the target edges: MTF50 = 0.187391/σ within 3 %, kernel σ within 10 %', () => {
    // The frame renderer samples the blurred scene at pixel centres (no pixel aperture), so the
    // edge MTF is the Gaussian's alone: MTF50·σ = 0.187391 (Goodman; DOMAIN.md).
    const a = analyzeFrame(sharp)
    expect(a.edges.length).toBeGreaterThanOrEqual(14)
    for (const e of a.edges) {
      expect(Math.abs((e.mtf50 ?? 0) - 0.187391 / 1.5) / (0.187391 / 1.5)).toBeLessThan(0.03)
      expect(e.psf.model).toBe('gaussian')
      expect(Math.abs((e.psf.sigmaPx ?? 0) - 1.5) / 1.5).toBeLessThan(0.1)
    }
  })

  it('returns exactly width, height, edges, rejected regions and the three focus measures', () => {
    const a = analyzeFrame(sharp, { rois: [] })
    expect(Object.keys(a).sort()).toEqual(['edges', 'focus', 'height', 'rejected', 'width'])
    expect(a.rejected).toEqual([])
    expect(Object.keys(a.focus).sort()).toEqual(['brenner', 'laplacianVariance', 'tenengrad'])
    expect([a.width, a.height]).toEqual([1920, 1080])
  })

  it('gives larger focus measures to the sharper of two frames of the same scene', () => {
    const soft = analyzeFrame(targetFrame(3), { rois: [] }).focus
    const crisp = analyzeFrame(sharp, { rois: [] }).focus
    expect(crisp.laplacianVariance).toBeGreaterThan(soft.laplacianVariance)
    expect(crisp.tenengrad).toBeGreaterThan(soft.tenengrad)
    expect(crisp.brenner).toBeGreaterThan(soft.brenner)
  })

  it('measures given regions in order and reports progress up to done', () => {
    const e = renderEdgeLinear({
      kernel: { type: 'disk', radiusPx: 2 },
      angleDeg: 6,
      widthPx: 200,
      heightPx: 150,
    })
    const img: GreyImage = { width: 200, height: 150, data: Float32Array.from(e.data) }
    const steps: [number, string][] = []
    const a = analyzeFrame(img, {
      rois: [
        { x: 40, y: 10, w: 120, h: 120 },
        { x: 60, y: 20, w: 80, h: 100 },
      ],
      onProgress: (fraction, stage) => steps.push([fraction, stage]),
    })
    expect(a.edges.map((m) => m.roi)).toEqual([
      { x: 40, y: 10, w: 120, h: 120 },
      { x: 60, y: 20, w: 80, h: 100 },
    ])
    expect(a.edges[0].psf.model).toBe('disk')
    for (let i = 1; i < steps.length; i++)
      expect(steps[i][0]).toBeGreaterThanOrEqual(steps[i - 1][0])
    expect(steps.at(-1)).toEqual([1, 'done'])
  })

  it('names the region when a given region is outside the frame or holds no edge', () => {
    const flat: GreyImage = { width: 100, height: 100, data: new Float32Array(10000).fill(0.4) }
    expect(() => analyzeFrame(flat, { rois: [{ x: 50, y: 50, w: 60, h: 20 }] })).toThrow(
      /50,50,60,20 does not lie inside/,
    )
    expect(() => analyzeFrame(flat, { rois: [{ x: 10, y: 10, w: 60, h: 60 }] })).toThrow(
      /^Region 10,10,60,60: /,
    )
  })
})
