import type { VerdictReason } from '../../../shared/schemas/checks'
import type { CheckMode, Verdict } from '../../../shared/schemas/enums'
import type { measurements } from '../schema'
import type { Rng } from './random'

// Plausible measurements for the demo history. Each edge is modelled as a Gaussian blur:
// MTF(f) = exp(−2π²σ²f²), so σ = 0.187391 / MTF50, MTF10 = 0.341541 / σ and the 10–90 % rise
// is 2.563103 σ (DOMAIN.md, "Blur kernels", [calc]). Demo data only — never a test oracle.

type MeasurementRow = typeof measurements.$inferInsert

const MTF50_SIGMA = 0.187391
const MTF10_SIGMA = 0.341541
const RISE_SIGMA = 2.563103

export function gaussianMtf(sigmaPx: number, fCyPx: number): number {
  return Math.exp(-2 * Math.PI ** 2 * sigmaPx ** 2 * fCyPx ** 2)
}

const round = (x: number, digits = 4) => Number(x.toFixed(digits))

/** Four edges (two vertical, two horizontal) around the check's sharpness. */
export function demoMeasurements(
  rng: Rng,
  checkId: string,
  mtf50CyPx: number,
  frame: { widthPx: number; heightPx: number },
): MeasurementRow[] {
  const rows: MeasurementRow[] = []
  for (let i = 0; i < 4; i++) {
    const orientation = i < 2 ? 'vertical' : 'horizontal'
    const mtf50 = Math.max(0.04, mtf50CyPx * rng.normal(1, 0.025))
    const sigma = MTF50_SIGMA / mtf50
    const long = rng.int(160, 240)
    const short = rng.int(96, 160)
    const w = orientation === 'vertical' ? short : long
    const h = orientation === 'vertical' ? long : short
    const curve: [number, number][] = []
    for (let k = 0; k <= 25; k++)
      curve.push([round(k * 0.02, 2), round(gaussianMtf(sigma, k * 0.02))])
    rows.push({
      id: rng.uuid(),
      checkId,
      roiX: rng.int(100, frame.widthPx - w - 100),
      roiY: rng.int(100, frame.heightPx - h - 100),
      roiW: w,
      roiH: h,
      orientation,
      angleDeg: round(rng.pick([-1, 1]) * rng.between(4, 6.5), 2),
      mtf50CyPx: round(mtf50),
      mtf50pCyPx: round(mtf50),
      mtf10CyPx: round(Math.min(MTF10_SIGMA / sigma, 1)),
      mtfNyquist: round(gaussianMtf(sigma, 0.5)),
      rise1090Px: round(RISE_SIGMA * sigma, 3),
      overshoot: 0,
      noise: round(rng.between(0.004, 0.012)),
      psfModel: 'gaussian',
      sigmaPx: round(sigma, 3),
      radiusPx: null,
      psfRms: round(rng.between(0.002, 0.008)),
      mtfCurve: curve,
      warnings: [],
    })
  }
  return rows
}

export function median(values: number[]): number {
  const s = [...values].sort((a, b) => a - b)
  const m = s.length >> 1
  return s.length % 2 ? s[m] : (s[m - 1] + s[m]) / 2
}

export interface JudgeInput {
  mtf50CyPx: number
  minMtf50CyPx: number
  marginalBand: number
  baselineMtf50CyPx: number | null
  pixelDensityPxPerM: number
  requiredPxPerM: number
  mode: CheckMode
  dayMtf50CyPx?: number
}

const RANK: Record<Verdict, number> = { pass: 0, marginal: 1, fail: 2 }
const f3 = (x: number) => x.toFixed(3)

/** The demo's verdict, following DESIGN.md's default rules, with plain-word reasons. */
export function judgeDemo(i: JudgeInput): { verdict: Verdict; reasons: VerdictReason[] } {
  const reasons: VerdictReason[] = []
  let verdict: Verdict = 'pass'
  const raise = (v: Verdict) => {
    if (RANK[v] > RANK[verdict]) verdict = v
  }
  const values = { mtf50CyPx: i.mtf50CyPx, minMtf50CyPx: i.minMtf50CyPx }
  if (i.mtf50CyPx >= i.minMtf50CyPx) {
    reasons.push({
      code: 'sharpness.ok',
      text: `Median MTF50 ${f3(i.mtf50CyPx)} c/p meets the minimum ${f3(i.minMtf50CyPx)} c/p.`,
      values,
    })
  } else if (i.mtf50CyPx >= i.minMtf50CyPx * (1 - i.marginalBand)) {
    raise('marginal')
    reasons.push({
      code: 'sharpness.marginal',
      text: `Median MTF50 ${f3(i.mtf50CyPx)} c/p is just below the minimum ${f3(i.minMtf50CyPx)} c/p.`,
      values,
    })
  } else {
    raise('fail')
    reasons.push({
      code: 'sharpness.low',
      text: `Median MTF50 ${f3(i.mtf50CyPx)} c/p is well below the minimum ${f3(i.minMtf50CyPx)} c/p.`,
      values,
    })
  }
  if (i.baselineMtf50CyPx) {
    const ratio = i.mtf50CyPx / i.baselineMtf50CyPx
    const v = { ratio: Number(ratio.toFixed(3)), baselineMtf50CyPx: i.baselineMtf50CyPx }
    if (ratio < 0.6) {
      raise('fail')
      reasons.push({
        code: 'drift.fail',
        text: `Sharpness is ${(ratio * 100).toFixed(0)} % of the commissioning baseline (fail below 60 %).`,
        values: v,
      })
    } else if (ratio < 0.8) {
      raise('marginal')
      reasons.push({
        code: 'drift.warn',
        text: `Sharpness is ${(ratio * 100).toFixed(0)} % of the commissioning baseline (warning below 80 %).`,
        values: v,
      })
    }
  }
  const pd = { pixelDensityPxPerM: i.pixelDensityPxPerM, requiredPxPerM: i.requiredPxPerM }
  if (i.pixelDensityPxPerM < i.requiredPxPerM) {
    raise('fail')
    reasons.push({
      code: 'density.low',
      text: `Pixel density ${i.pixelDensityPxPerM.toFixed(0)} px/m is below the required ${i.requiredPxPerM} px/m.`,
      values: pd,
    })
  } else {
    reasons.push({
      code: 'density.ok',
      text: `Pixel density ${i.pixelDensityPxPerM.toFixed(0)} px/m meets the required ${i.requiredPxPerM} px/m.`,
      values: pd,
    })
  }
  if (i.mode === 'night' && i.dayMtf50CyPx) {
    const ratio = i.mtf50CyPx / i.dayMtf50CyPx
    if (ratio < 0.8) {
      raise('marginal')
      reasons.push({
        code: 'night.ir_focus_shift',
        text: `At night MTF50 is ${(ratio * 100).toFixed(0)} % of the day value: likely infrared focus shift; refocus with the IR-cut filter out.`,
        values: { ratio: Number(ratio.toFixed(3)) },
      })
    }
  }
  return { verdict, reasons }
}
