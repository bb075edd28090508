import { describe, expect, it } from 'vitest'
import { expectedMtf50, type Kernel } from '../../../../tests/fixtures/edges/analytic'
import {
  greyRaw,
  renderEdgeCodes,
  renderEdgeLinear,
  type EdgeSpec,
} from '../../../../tests/fixtures/edges/render'
import { toGreyImage } from '../../image/luminance'
import type { GreyImage } from '../../types'
import { measureEdge } from '../measureEdge'

const sigma1: Kernel = { type: 'gaussian', sigmaPx: 1 }

function codesImage(spec: EdgeSpec): GreyImage {
  const e = renderEdgeCodes({ widthPx: 120, heightPx: 120, ...spec })
  return toGreyImage(greyRaw(e.width, e.height, e.codes))
}

const full = (img: GreyImage) => ({ x: 0, y: 0, w: img.width, h: img.height })

/** Unsharp mask in linear light: I + amount·(I − G_σ * I), separable, replicate border. */
function unsharp(img: GreyImage, sigmaPx: number, amount: number): GreyImage {
  const r = Math.ceil(3 * sigmaPx)
  const k = Array.from({ length: 2 * r + 1 }, (_, i) =>
    Math.exp(-((i - r) ** 2) / (2 * sigmaPx ** 2)),
  )
  const sum = k.reduce((a, b) => a + b)
  const { width: w, height: h, data } = img
  const tmp = new Float64Array(w * h)
  const blur = new Float64Array(w * h)
  const at = (x: number, y: number) =>
    data[Math.min(h - 1, Math.max(0, y)) * w + Math.min(w - 1, Math.max(0, x))]
  for (let y = 0; y < h; y++)
    for (let x = 0; x < w; x++)
      tmp[y * w + x] = k.reduce((a, kv, i) => a + kv * at(x + i - r, y), 0) / sum
  const tat = (x: number, y: number) => tmp[Math.min(h - 1, Math.max(0, y)) * w + x]
  for (let y = 0; y < h; y++)
    for (let x = 0; x < w; x++)
      blur[y * w + x] = k.reduce((a, kv, i) => a + kv * tat(x, y + i - r), 0) / sum
  return {
    width: w,
    height: h,
    data: Float32Array.from(data, (v, i) => v + amount * (v - blur[i])),
  }
}

describe('measurement warnings', () => {
  it('flags clipping above 0.5 % of the region, and the clipped edge reads too sharp', () => {
    // DOMAIN.md: clipping raised MTF50 by 42 % on its clipped σ = 1 edge; reject > 0.5 % clipped [ours].
    const img = codesImage({ kernel: sigma1, angleDeg: 5, darkLinear: 0.2, brightLinear: 1.8 })
    const m = measureEdge(img, full(img))
    expect(m.warnings).toContain('clipping')
    expect(m.mtf50 ?? 0).toBeGreaterThan(1.1 * expectedMtf50(sigma1, 5))
    const ok = codesImage({ kernel: sigma1, angleDeg: 5 })
    expect(measureEdge(ok, full(ok)).warnings).not.toContain('clipping')
  })

  it('flags a region too narrow for the blur, which hides defocus', () => {
    // DOMAIN.md [calc]: σ = 3 px, true MTF50 0.0622 → 0.0849 read at 16 px width; rule ≥ max(64, 10 × rise) [ours].
    const kernel: Kernel = { type: 'gaussian', sigmaPx: 3 }
    const img = codesImage({ kernel, angleDeg: 5, widthPx: 120, heightPx: 120 })
    const narrow = measureEdge(img, { x: 52, y: 0, w: 16, h: 120 })
    expect(narrow.warnings).toContain('roi-too-narrow')
    expect(narrow.mtf50 ?? 0).toBeGreaterThan(1.15 * expectedMtf50(kernel, 5))
    expect(measureEdge(img, { x: 28, y: 0, w: 64, h: 120 }).warnings).toContain('roi-too-narrow')
    expect(measureEdge(img, full(img)).warnings).not.toContain('roi-too-narrow')
  })

  it.each([45, (Math.atan(0.5) * 180) / Math.PI])(
    'flags the critical angle %f° where sample phases repeat',
    (angleDeg) => {
      // DOMAIN.md: critical angles tan θ = 1/k (45°, 26.57°, 18.43°, 14.04°).
      const img = codesImage({ kernel: sigma1, angleDeg })
      expect(measureEdge(img, full(img), { orientation: 'vertical' }).warnings).toContain(
        'critical-angle',
      )
    },
  )

  it('does not flag 44° or 8° on a 120-row region', () => {
    for (const angleDeg of [44, 8]) {
      const img = codesImage({ kernel: sigma1, angleDeg })
      expect(measureEdge(img, full(img), { orientation: 'vertical' }).warnings).not.toContain(
        'critical-angle',
      )
    }
  })

  it('flags too few phase cycles: an edge 1.5° off the axis over 120 rows, or 5° over 40 rows', () => {
    // Require rows·tan θ ≥ 4 [ours, DOMAIN.md]: 120·tan 1.5° = 3.1; 40·tan 5° = 3.5.
    const img = codesImage({ kernel: sigma1, angleDeg: 1.5 })
    expect(measureEdge(img, full(img)).warnings).toContain('few-phase-cycles')
    const short = codesImage({ kernel: sigma1, angleDeg: 5, heightPx: 40 })
    expect(measureEdge(short, full(short)).warnings).toContain('few-phase-cycles')
    const tall = codesImage({ kernel: sigma1, angleDeg: 5, heightPx: 60 })
    expect(measureEdge(tall, full(tall)).warnings).not.toContain('few-phase-cycles')
  })

  it('refuses a region of fewer than 8 rows along the edge', () => {
    const img = codesImage({ kernel: sigma1, angleDeg: 5, heightPx: 7 })
    expect(() => measureEdge(img, full(img), { orientation: 'vertical' })).toThrow(
      /at least 16 px across and 8 px along/,
    )
  })

  it('flags low contrast', () => {
    const img = codesImage({ kernel: sigma1, angleDeg: 5, darkLinear: 0.45, brightLinear: 0.55 })
    expect(measureEdge(img, full(img)).warnings).toContain('low-contrast')
  })

  it('detects sharpening by its overshoot, which also inflates MTF50', () => {
    // DOMAIN.md: a mild unsharp mask gave +31 % MTF50 with ≈ 2.6 % overshoot. Here: USM radius
    // σ 1.5 px, amount 0.8 on a σ 1.2 px edge.
    const e = renderEdgeLinear({ kernel: { type: 'gaussian', sigmaPx: 1.2 }, angleDeg: 5 })
    const plain: GreyImage = { width: 120, height: 120, data: Float32Array.from(e.data) }
    const sharp = unsharp(plain, 1.5, 0.8)
    const m = measureEdge(sharp, full(sharp))
    const p = measureEdge(plain, full(plain))
    expect(m.warnings).toContain('sharpening')
    expect(m.overshoot).toBeGreaterThan(0.02)
    expect(m.undershoot).toBeGreaterThan(0.02)
    expect(m.mtf50 ?? 0).toBeGreaterThan(1.15 * (p.mtf50 ?? 1))
    expect(p.warnings).toEqual([])
    expect(p.overshoot).toBeLessThan(0.002)
  })

  it('does not mistake noise at SNR 60 for sharpening', () => {
    for (let seed = 1; seed <= 6; seed++) {
      const img = codesImage({
        kernel: { type: 'gaussian', sigmaPx: 0.5 + seed * 0.3 },
        angleDeg: 4 + seed,
        snr: 60,
        seed,
      })
      expect(measureEdge(img, full(img)).warnings).toEqual([])
    }
  })
})
