import { describe, expect, it } from 'vitest'
import { pixelEsf, sinc, type Kernel } from '../../../../tests/fixtures/edges/analytic'
import { renderEdgeLinear } from '../../../../tests/fixtures/edges/render'
import { measureEdge } from '../../mtf/measureEdge'
import { fitPsf } from '../fit'

/** A noise-free 4× ESF profile sampled from the pixel-integrated analytic ESF (no bin box). */
function profile(kernel: Kernel, angleDeg: number) {
  const n = 4 * 80
  const cos = Math.cos((angleDeg * Math.PI) / 180)
  const values = new Float64Array(n)
  for (let k = 0; k < n; k++)
    values[k] = 0.2 + 0.6 * pixelEsf(kernel, ((k - n / 2) / 4) * cos, angleDeg)
  return {
    values,
    counts: new Uint32Array(n).fill(30),
    centreIndex: n / 2,
    binNormalPx: cos / 4,
    angleRad: (angleDeg * Math.PI) / 180,
  }
}

describe('blur-kernel fit to the edge spread function', () => {
  it.each<[Kernel, number]>([
    [{ type: 'gaussian', sigmaPx: 0.8 }, 5],
    [{ type: 'gaussian', sigmaPx: 2.5 }, 9],
    [{ type: 'disk', radiusPx: 1.5 }, 4],
    [{ type: 'disk', radiusPx: 3.5 }, 11],
  ])(
    'recovers %j at %i° within 1 % and picks its model, reporting both fits',
    (kernel, angleDeg) => {
      // The profile has no ¼-px bin box, the model includes one: that costs < 1 %.
      const size = kernel.type === 'gaussian' ? kernel.sigmaPx : kernel.radiusPx
      const est = fitPsf(profile(kernel, angleDeg), { fitHalfWidthPx: 20 })
      expect(est.model).toBe(kernel.type)
      const fit = kernel.type === 'gaussian' ? est.gaussian : est.disk
      const other = kernel.type === 'gaussian' ? est.disk : est.gaussian
      expect(Math.abs(fit.sizePx - size) / size).toBeLessThan(0.01)
      expect(fit.rmsResidual).toBeLessThan(0.002)
      expect(other.rmsResidual).toBeGreaterThan(2 * fit.rmsResidual)
      expect(est.rmsResidual).toBe(fit.rmsResidual)
      expect(kernel.type === 'gaussian' ? est.sigmaPx : est.radiusPx).toBe(fit.sizePx)
    },
  )

  it('agrees with σ = 0.187391 / MTF50 of the kernel (pixel aperture divided out) within 3 %', () => {
    // DOMAIN.md cross-check: Gaussian MTF50·σ = 0.187391 (Goodman); the square pixel's MTF
    // sinc(f cos θ)·sinc(f sin θ) is divided out of the measured curve first.
    const angle = 6
    const t = (angle * Math.PI) / 180
    const e = renderEdgeLinear({ kernel: { type: 'gaussian', sigmaPx: 2 }, angleDeg: angle })
    const m = measureEdge(
      { width: 120, height: 120, data: Float32Array.from(e.data) },
      { x: 0, y: 0, w: 120, h: 120 },
    )
    const kernelOnly = m.mtf.map(([f, v]) => [
      f,
      v / (sinc(f * Math.cos(t)) * sinc(f * Math.sin(t))),
    ])
    const i = kernelOnly.findIndex(([, v]) => v < 0.5)
    const [f0, v0] = kernelOnly[i - 1]
    const [f1, v1] = kernelOnly[i]
    const mtf50 = f0 + ((v0 - 0.5) / (v0 - v1)) * (f1 - f0)
    expect(Math.abs((m.psf.sigmaPx ?? 0) - 0.187391 / mtf50) / (0.187391 / mtf50)).toBeLessThan(
      0.03,
    )
  })

  it('refuses a profile with too few samples', () => {
    const p = profile({ type: 'gaussian', sigmaPx: 1 }, 5)
    p.counts.fill(0)
    expect(() => fitPsf(p)).toThrow(/Too few ESF samples/)
  })
})
