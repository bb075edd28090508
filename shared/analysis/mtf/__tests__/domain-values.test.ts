import { describe, expect, it } from 'vitest'
import {
  besselJ1,
  expectedMtf50,
  firstBelow,
  kernelOtf,
} from '../../../../tests/fixtures/edges/analytic'
import { renderEdgeCodes, greyRaw } from '../../../../tests/fixtures/edges/render'
import { toGreyImage } from '../../image/luminance'
import { measureEdge } from '../measureEdge'
import { binResponse, derivativeResponse } from '../sfr'

describe('check values of DOMAIN.md', () => {
  it('the analytic oracles reproduce the Gaussian, disk and pixel-aperture MTF50 values', () => {
    // DOMAIN.md [calc] from Goodman: Gaussian MTF50·σ = 0.187391, MTF10·σ = 0.341541.
    expect(expectedMtf50({ type: 'gaussian', sigmaPx: 1 }, null)).toBeCloseTo(0.187391, 6)
    expect(firstBelow((f) => kernelOtf({ type: 'gaussian', sigmaPx: 1 }, f), 0.1)).toBeCloseTo(
      0.341541,
      6,
    )
    // With the square pixel (edge at 0°): 0.32309 (σ 0.5), 0.17996 (σ 1), 0.09273 (σ 2).
    expect(expectedMtf50({ type: 'gaussian', sigmaPx: 0.5 }, 0)).toBeCloseTo(0.32309, 5)
    expect(expectedMtf50({ type: 'gaussian', sigmaPx: 1 }, 0)).toBeCloseTo(0.17996, 5)
    expect(expectedMtf50({ type: 'gaussian', sigmaPx: 2 }, 0)).toBeCloseTo(0.09273, 5)
    // Disk: MTF50·R = 0.352542; R = 1: OTF(0.25) = 0.721703, OTF(0.5) = 0.181192; first zero 0.609835/R.
    expect(expectedMtf50({ type: 'disk', radiusPx: 1 }, null)).toBeCloseTo(0.352542, 6)
    expect(kernelOtf({ type: 'disk', radiusPx: 1 }, 0.25)).toBeCloseTo(0.721703, 6)
    expect(kernelOtf({ type: 'disk', radiusPx: 1 }, 0.5)).toBeCloseTo(0.181192, 6)
    expect(besselJ1(2 * Math.PI * 0.609835)).toBeCloseTo(0, 6)
    // Pixel aperture alone: MTF50 at 0.603355 c/p (DOMAIN.md).
    expect(firstBelow((f) => Math.sin(Math.PI * f) / (Math.PI * f), 0.5)).toBeCloseTo(0.603355, 6)
  })

  it('divides out the derivative response D(0.25) = 0.974495, D(0.5) = 0.900316 and the ¼-px bin sinc(f/4)', () => {
    // DOMAIN.md step 10 [calc].
    expect(derivativeResponse(0.25)).toBeCloseTo(0.974495, 6)
    expect(derivativeResponse(0.5)).toBeCloseTo(0.900316, 6)
    // The bin box: sinc(0.5/4) = 0.974495 at 0.5 c/p (DOMAIN.md step 10).
    expect(binResponse(0.5)).toBeCloseTo(0.974495, 6)
  })

  it('measures the σ = 1 px edge at 3° as MTF50 0.17996 c/p within 1 %', () => {
    // DOMAIN.md: Gaussian σ 1 with the pixel aperture, MTF50 = 0.17996 (edge at 0°; at 3° the
    // sin θ part of the aperture moves it by −0.006 %).
    const e = renderEdgeCodes({
      kernel: { type: 'gaussian', sigmaPx: 1 },
      angleDeg: 3,
      widthPx: 120,
      heightPx: 120,
      darkLinear: 0.2016,
      brightLinear: 0.7991,
    })
    const m = measureEdge(toGreyImage(greyRaw(e.width, e.height, e.codes)), {
      x: 0,
      y: 0,
      w: 120,
      h: 120,
    })
    expect(Math.abs((m.mtf50 ?? 0) - 0.17996) / 0.17996).toBeLessThan(0.01)
  })

  it('reports frequencies along the edge normal: a 20° edge reads its analytic MTF50, not 1/cos θ off', () => {
    // 1/cos 20° = 1.064: without the normal projection MTF50 would read 6 % off (DOMAIN.md step 11).
    const kernel = { type: 'gaussian' as const, sigmaPx: 1.5 }
    const e = renderEdgeCodes({
      kernel,
      angleDeg: 20,
      widthPx: 120,
      heightPx: 120,
      darkLinear: 0.2016,
      brightLinear: 0.7991,
    })
    const m = measureEdge(toGreyImage(greyRaw(e.width, e.height, e.codes)), {
      x: 0,
      y: 0,
      w: 120,
      h: 120,
    })
    const expected = expectedMtf50(kernel, 20)
    expect(Math.abs((m.mtf50 ?? 0) - expected) / expected).toBeLessThan(0.01)
  })
})
