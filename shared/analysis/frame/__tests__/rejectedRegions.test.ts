import { describe, expect, it, vi } from 'vitest'
import { expectedMtf50 } from '../../../../tests/fixtures/edges/analytic'
import { renderEdgeLinear, seededNormal } from '../../../../tests/fixtures/edges/render'
import type * as FindEdgesModule from '../../edge/findEdges'
import type { GreyImage, Roi } from '../../types'
import { analyzeFrame } from '../analyzeFrame'

// The edge search runs for real; each test may add candidates to what it returns, standing in
// for a proposal the measurement turns down (the search's own checks rarely let one through).
const extra = vi.hoisted(() => ({ candidates: [] as { roi: Roi; orientation: 'vertical' }[] }))
vi.mock('../../edge/findEdges', async (importOriginal) => {
  const real = await importOriginal<typeof FindEdgesModule>()
  return {
    ...real,
    findEdges: (...args: Parameters<typeof real.findEdges>) => [
      ...real.findEdges(...args),
      ...extra.candidates.map((c) => ({ ...c, angleDeg: 0, contrast: 0, score: 0 })),
    ],
  }
})

/** 320 × 160 frame: left half a Gaussian σ = 1 px edge 5° off vertical, right half flat grey. */
function edgeAndFlatFrame(): GreyImage {
  const edge = renderEdgeLinear({
    kernel: { type: 'gaussian', sigmaPx: 1 },
    angleDeg: 5,
    widthPx: 160,
    heightPx: 160,
  })
  const noise = seededNormal(5)
  const data = new Float32Array(320 * 160)
  for (let y = 0; y < 160; y++) {
    for (let x = 0; x < 320; x++) {
      const clean = x < 160 ? edge.data[y * 160 + x] : 0.5
      data[y * 320 + x] = clean + 0.002 * noise()
    }
  }
  return { width: 320, height: 160, data }
}

const flatRoi: Roi = { x: 200, y: 20, w: 80, h: 120 }

describe('found regions the measurement turns down', () => {
  const frame = edgeAndFlatFrame()

  it('skips a found region without an edge, lists it with the reason, and measures the good edge', () => {
    extra.candidates = [{ roi: flatRoi, orientation: 'vertical' }]
    const a = analyzeFrame(frame)
    expect(a.rejected).toEqual([{ roi: flatRoi, reason: expect.stringMatching(/^No usable edge/) }])
    expect(a.edges.length).toBeGreaterThanOrEqual(1)
    // Expected: Gaussian OTF × 1-px pixel aperture along the normal at 5° (tests/fixtures analytic).
    const mtf50 = expectedMtf50({ type: 'gaussian', sigmaPx: 1 }, 5)
    for (const e of a.edges) {
      expect(e.roi.x + e.roi.w).toBeLessThanOrEqual(160)
      expect(Math.abs((e.mtf50 ?? 0) - mtf50) / mtf50).toBeLessThan(0.03)
    }
  })

  it('still throws, naming the region, when that region is asked for explicitly', () => {
    extra.candidates = []
    expect(() =>
      analyzeFrame(frame, { rois: [{ x: 20, y: 20, w: 120, h: 120 }, flatRoi] }),
    ).toThrow(/^Region 200,20,80,120: No usable edge/)
  })
})
