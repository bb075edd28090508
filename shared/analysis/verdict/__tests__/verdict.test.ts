import { describe, expect, it } from 'vitest'
import { IEC_62676_4_2014 } from '../../optics/iecLevels'
import { evaluateVerdict } from '../evaluate'
import { TASK_DEFAULTS, thresholdsFor } from '../tasks'
import type { VerdictEdge } from '../types'

/**
 * An edge blurred by a Gaussian σ over a 1-px square pixel: MTF = exp(−2π²σ²f²)·|sinc f|
 * (Goodman); MTF50 from DOMAIN.md [calc]: σ 0.5 → 0.32309, σ 1 → 0.17996, σ 2 → 0.09273.
 * 10–90 % rise of the Gaussian alone 2.563103σ (DOMAIN.md).
 */
function gaussianEdge(sigma: number, mtf50CyPx: number, contrast = 1): VerdictEdge {
  const mtf: [number, number][] = []
  for (let f = 0; f <= 1.0001; f += 0.025) {
    const sinc = f === 0 ? 1 : Math.abs(Math.sin(Math.PI * f) / (Math.PI * f))
    mtf.push([
      f,
      (f === 0 ? 1 : contrast) * Math.exp(-2 * Math.PI ** 2 * sigma ** 2 * f ** 2) * sinc,
    ])
  }
  return { valid: true, mtf50CyPx, mtf, rise1090Px: 2.563103 * sigma, warnings: [] }
}
const sharp = gaussianEdge(0.5, 0.32309)
const soft = gaussianEdge(1, 0.17996)
const defocused = gaussianEdge(2, 0.09273)
const edge = (mtf50CyPx: number): VerdictEdge => ({ valid: true, mtf50CyPx })

describe('sharpness against the task minimum (DESIGN.md)', () => {
  it('passes sharp edges for identify (0.323 c/p against 0.20)', () => {
    const v = evaluateVerdict({ edges: [sharp, sharp, sharp] }, { task: 'identify' })
    expect(v.verdict).toBe('pass')
    expect(v.reasons).toHaveLength(1)
    expect(v.reasons[0]).toMatchObject({ code: 'sharpness', severity: 'ok' })
    expect(v.reasons[0].message).toBe(
      'Sharpness 0.323 c/p (median MTF50 of 3 edges) meets the 0.200 c/p minimum for identify.',
    )
  })

  it('is marginal within 10 % below the minimum, including exactly 10 %', () => {
    const v = evaluateVerdict({ edges: [edge(0.185)] }, { task: 'identify' })
    expect(v.verdict).toBe('marginal')
    expect(v.reasons[0].message).toBe(
      'Sharpness 0.185 c/p (median MTF50 of 1 edge) is 8 % below the 0.200 c/p minimum for identify, within the 10 % margin.',
    )
    expect(evaluateVerdict({ edges: [edge(0.18)] }, { task: 'identify' }).verdict).toBe('marginal')
  })

  it('fails further below and tells to refocus (σ = 1 px edge for inspect, 0.180 against 0.25)', () => {
    const v = evaluateVerdict({ edges: [soft, soft] }, { task: 'inspect' })
    expect(v.verdict).toBe('fail')
    expect(v.reasons[0].message).toBe(
      'Sharpness 0.180 c/p (median MTF50 of 2 edges) is 28 % below the 0.250 c/p minimum for inspect. Refocus the camera.',
    )
  })

  it('uses the median of the valid edges and says how many regions it left out', () => {
    const rejected: VerdictEdge = { valid: false, mtf50CyPx: 0.05, warnings: ['clipped pixels'] }
    const v = evaluateVerdict(
      { edges: [edge(0.1), edge(0.3), edge(0.26), edge(0.22), rejected] },
      { task: 'identify' },
    )
    expect(v.reasons.find((r) => r.code === 'sharpness')?.values.medianMtf50CyPx).toBeCloseTo(
      0.24,
      12,
    )
    expect(v.reasons.find((r) => r.code === 'edges-rejected')?.message).toBe(
      '1 of 5 edge regions were not used (clipped pixels).',
    )
    expect(v.verdict).toBe('pass')
  })

  it('takes per-camera overrides over the task defaults', () => {
    // 0.25 against a camera minimum of 0.30 is 17 % below → fail; the task default 0.20 would pass.
    const v = evaluateVerdict(
      { edges: [edge(0.25)] },
      { task: 'identify', thresholds: { minMtf50CyPx: 0.3 } },
    )
    expect(v.verdict).toBe('fail')
    expect(v.thresholds.minMtf50CyPx).toBe(0.3)
    expect(v.thresholds.minPixelDensityPxPerM).toBe(250)
    expect(evaluateVerdict({ edges: [edge(0.25)] }, { task: 'identify' }).verdict).toBe('pass')
  })
})

describe('drift against the baseline (DESIGN.md: < 0.8 marginal, < 0.6 fail)', () => {
  const run = (mtf50: number) =>
    evaluateVerdict({ edges: [edge(mtf50)], baselineMtf50CyPx: 0.32 }, { task: 'monitor' })

  it('is fine at 94 % of the baseline', () => {
    expect(run(0.3).verdict).toBe('pass')
  })

  it('is marginal at 75 % and fails at 56 %, with the numbers in the message', () => {
    const marginal = run(0.24)
    expect(marginal.verdict).toBe('marginal')
    expect(marginal.reasons.find((r) => r.code === 'drift')?.message).toBe(
      'MTF50 is 75 % of the commissioning baseline (0.240 c/p against 0.320 c/p); below 80 % is marginal.',
    )
    const failed = run(0.18)
    expect(failed.verdict).toBe('fail')
    expect(failed.reasons.find((r) => r.code === 'drift')).toMatchObject({
      severity: 'fail',
      values: { ratio: 0.5625 },
    })
  })
})

describe('pixel density', () => {
  it('fails below the task px/m whatever the sharpness (96 px/m for identify)', () => {
    // 96 px/m: DOMAIN.md example (1920 px, 90°, 10 m); identify needs 250 px/m (IEC 62676-4:2014).
    const v = evaluateVerdict({ edges: [sharp], pixelDensityPxPerM: 96 }, { task: 'identify' })
    expect(v.verdict).toBe('fail')
    expect(v.reasons.find((r) => r.code === 'pixel-density')?.message).toBe(
      'Pixel density 96 px/m at the target is below the 250 px/m needed for identify; refocusing cannot fix this — zoom in, move the camera closer or change the lens.',
    )
  })

  it('passes at or above it', () => {
    const v = evaluateVerdict({ edges: [sharp], pixelDensityPxPerM: 137.93 }, { task: 'recognise' })
    expect(v.verdict).toBe('pass')
    expect(v.reasons.map((r) => r.code)).toEqual(['sharpness', 'pixel-density'])
  })
})

describe('night against day', () => {
  it('names an infrared focus shift below a night/day ratio of 0.8', () => {
    const v = evaluateVerdict(
      { edges: [edge(0.2)], mode: 'night', dayMtf50CyPx: 0.3 },
      { task: 'monitor' },
    )
    expect(v.verdict).toBe('marginal')
    const r = v.reasons.find((x) => x.code === 'infrared-focus-shift')
    expect(r?.message).toContain(
      'At night MTF50 is 67 % of the day value (0.200 c/p against 0.300 c/p): likely infrared focus shift.',
    )
  })

  it('says nothing about infrared when the night check holds up or is a day check', () => {
    const ok = evaluateVerdict(
      { edges: [edge(0.28)], mode: 'night', dayMtf50CyPx: 0.3 },
      { task: 'monitor' },
    )
    expect(ok.reasons.find((x) => x.code === 'night-day')?.severity).toBe('ok')
    const day = evaluateVerdict(
      { edges: [edge(0.1)], mode: 'day', dayMtf50CyPx: 0.3 },
      { task: 'monitor' },
    )
    expect(
      day.reasons.some((x) => x.code === 'infrared-focus-shift' || x.code === 'night-day'),
    ).toBe(false)
  })
})

describe('haze (low MTF at all frequencies with a steep edge)', () => {
  // Veiling glare: the σ = 0.5 px edge with 75 % contrast above zero frequency.
  const hazy = { ...gaussianEdge(0.5, 0.16, 0.75) }

  it('advises cleaning, not refocusing', () => {
    const v = evaluateVerdict({ edges: [hazy, hazy] }, { task: 'observe' })
    const haze = v.reasons.find((r) => r.code === 'haze')
    expect(haze?.severity).toBe('marginal')
    // Measured 0.75·e^(−2π²·0.5²·0.05²)·sinc(0.05) = 0.738; the 1.28 px rise predicts 0.988.
    const sinc = Math.sin(0.05 * Math.PI) / (0.05 * Math.PI)
    expect(haze?.values.mtfAtProbe).toBeCloseTo(
      0.75 * Math.exp(-2 * Math.PI ** 2 * 0.25 * 0.0025) * sinc,
      9,
    )
    expect(haze?.values.predictedMtfAtProbe).toBeCloseTo(
      Math.exp(-2 * Math.PI ** 2 * 0.25 * 0.0025),
      9,
    )
    expect(haze?.message).toContain(
      'likely a dirty or scratched dome or window. Clean it; do not refocus.',
    )
    expect(v.verdict).toBe('marginal')
  })

  it('adds the cleaning advice to a failing sharpness instead of "refocus"', () => {
    const v = evaluateVerdict({ edges: [hazy] }, { task: 'identify' })
    expect(v.verdict).toBe('fail')
    expect(v.reasons[0].message).toContain(
      'Clean the dome or window and check again before refocusing.',
    )
    expect(v.reasons[0].message).not.toContain('Refocus the camera')
  })

  it('does not call a defocused edge haze: its wide edge explains its low MTF', () => {
    // σ = 2 px: MTF(0.05) = 0.82, as its 5.1 px rise predicts.
    const v = evaluateVerdict({ edges: [defocused] }, { task: 'observe' })
    expect(v.reasons.some((r) => r.code === 'haze')).toBe(false)
    expect(v.verdict).toBe('fail')
    expect(v.reasons[0].message).toContain('Refocus the camera.')
  })
})

describe('no usable edge', () => {
  it('is inconclusive and quotes why the regions were rejected', () => {
    const edges: VerdictEdge[] = [
      { valid: false, mtf50CyPx: null, warnings: ['too few phase cycles'] },
      { valid: false, mtf50CyPx: null, warnings: ['clipped pixels', 'too few phase cycles'] },
    ]
    const v = evaluateVerdict({ edges }, { task: 'detect' })
    expect(v.verdict).toBe('inconclusive')
    expect(v.reasons).toEqual([
      {
        code: 'no-valid-edge',
        severity: 'info',
        values: { regions: 2 },
        message:
          'None of the 2 edge regions could be measured (too few phase cycles; clipped pixels), so sharpness could not be judged. Reposition the target and capture again.',
      },
    ])
    expect(evaluateVerdict({ edges: [] }, { task: 'detect' }).verdict).toBe('inconclusive')
  })

  it('still fails when the pixel density alone is too low', () => {
    const v = evaluateVerdict({ edges: [], pixelDensityPxPerM: 10 }, { task: 'detect' })
    expect(v.verdict).toBe('fail')
  })
})

describe('task defaults and thresholds', () => {
  it('use the IEC 62676-4:2014 densities for the six surveillance tasks [std]', () => {
    for (const level of IEC_62676_4_2014) {
      const task = TASK_DEFAULTS[level.id as keyof typeof TASK_DEFAULTS]
      expect(task.minPixelDensityPxPerM).toBe(level.minPxPerM)
      expect(task.pixelDensitySource).toContain('[std]')
    }
  })

  it('mark every MTF50 minimum as ours, inside the practice range 0.12–0.35 c/p', () => {
    for (const task of Object.values(TASK_DEFAULTS)) {
      expect(task.mtf50Source).toContain('[ours]')
      expect(task.mtf50Source).toContain('[practice]')
      expect(task.minMtf50CyPx).toBeGreaterThanOrEqual(0.12)
      expect(task.minMtf50CyPx).toBeLessThanOrEqual(0.35)
    }
  })

  it('reject missing minimums, unknown tasks and contradictory ratios', () => {
    expect(() => evaluateVerdict({ edges: [] })).toThrow(
      new TypeError(
        'Give a task or thresholds.minMtf50CyPx: the verdict needs a minimum to compare with.',
      ),
    )
    expect(() => thresholdsFor('watch' as 'detect')).toThrow(TypeError)
    expect(() => thresholdsFor('detect', { driftFailRatio: 0.9 })).toThrow(
      new RangeError('Threshold driftFailRatio (0.9) must not exceed driftMarginalRatio (0.8).'),
    )
    expect(() => thresholdsFor('detect', { marginalBand: -0.1 })).toThrow(
      new RangeError('Threshold marginalBand must be a finite number ≥ 0 (got -0.1).'),
    )
    expect(() => evaluateVerdict({} as never, { task: 'detect' })).toThrow(
      new TypeError('The verdict needs an input with an edges array.'),
    )
  })

  it('work from explicit thresholds without a task', () => {
    const v = evaluateVerdict(
      { edges: [edge(0.3)] },
      { thresholds: { minMtf50CyPx: 0.2, minPixelDensityPxPerM: 100 } },
    )
    expect(v.verdict).toBe('pass')
    expect(v.reasons[0].message).toBe(
      'Sharpness 0.300 c/p (median MTF50 of 1 edge) meets the 0.200 c/p minimum.',
    )
  })
})
