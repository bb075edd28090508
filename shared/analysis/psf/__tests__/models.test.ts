import { describe, expect, it } from 'vitest'
import { erfcPrecise, pixelEsf, type Kernel } from '../../../../tests/fixtures/edges/analytic'
import { apertureQuadrature, erfc, kernelEsf, modelEsf } from '../models'

const rise = (esf: (x: number) => number) => {
  const at = (level: number) => {
    let lo = -50
    let hi = 50
    for (let i = 0; i < 100; i++) {
      const mid = (lo + hi) / 2
      if (esf(mid) < level) lo = mid
      else hi = mid
    }
    return lo
  }
  return at(0.9) - at(0.1)
}

describe('blur-kernel edge models', () => {
  it('computes erfc within the stated 1.2e-7 relative error of a series/continued-fraction reference', () => {
    for (let x = -4; x <= 5; x += 0.05) {
      const ref = erfcPrecise(x)
      expect(Math.abs(erfc(x) - ref) / ref).toBeLessThan(1.2e-7)
    }
  })

  it('gives the 10–90 % rise of DOMAIN.md: 2.563103 σ (Gaussian) and 1.374098 R (disk)', () => {
    // DOMAIN.md [calc]: Gaussian rise = 2 × 1.281552 σ; disk rise 1.374098 R.
    for (const s of [0.7, 2])
      expect(rise((x) => kernelEsf('gaussian', s, x)) / s).toBeCloseTo(2.563103, 5)
    for (const r of [1, 3.5])
      expect(rise((x) => kernelEsf('disk', r, x)) / r).toBeCloseTo(1.374098, 5)
  })

  it.each<[Kernel, number]>([
    [{ type: 'gaussian', sigmaPx: 0.5 }, 3],
    [{ type: 'gaussian', sigmaPx: 1.5 }, 12],
    [{ type: 'disk', radiusPx: 1 }, 8],
    [{ type: 'disk', radiusPx: 3 }, 20],
  ])(
    'matches the pixel-integrated ESF of an independent reference within 2e-5: %j at %i°',
    (kernel, angleDeg) => {
      // Reference: exact integration across cos θ, 8-point Gauss–Legendre across sin θ (analytic.ts).
      const q = apertureQuadrature((angleDeg * Math.PI) / 180, 0)
      const size = kernel.type === 'gaussian' ? kernel.sigmaPx : kernel.radiusPx
      for (let u = -8; u <= 8; u += 0.173) {
        expect(
          Math.abs(modelEsf(kernel.type, size, u, q) - pixelEsf(kernel, u, angleDeg)),
        ).toBeLessThan(2e-5)
      }
    },
  )
})
