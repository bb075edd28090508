/**
 * Prints the MTF50 and kernel-size accuracy of the slanted-edge measurement over the synthetic
 * matrix of tests/fixtures/edges/cases.ts (the same cases as the accuracy test):
 * `npx tsx bench/accuracy.ts`.
 */
import { toGreyImage } from '../shared/analysis/image'
import { measureEdge } from '../shared/analysis/mtf'
import { expectedMtf50 } from '../tests/fixtures/edges/analytic'
import {
  CONDITIONS,
  edgeCases,
  KERNELS,
  kernelLabel,
  kernelSize,
  renderCases,
  ROI_PX,
} from '../tests/fixtures/edges/cases'

const stats = (v: number[]) => {
  const a = v.map(Math.abs).sort((x, y) => x - y)
  const mid = a.length >> 1
  return { median: a.length % 2 ? a[mid] : (a[mid - 1] + a[mid]) / 2, worst: a[a.length - 1] }
}
const pct = (v: number) => `${v.toFixed(2)} %`.padStart(8)

const rows: string[] = []
const byCondition = new Map<string, { mtf: number[]; size: number[] }>()
const byFamily = new Map<string, { mtf: number[]; size: number[]; models: number; n: number }>()
const cases = edgeCases()
const frames = renderCases(cases)
cases.forEach((c, i) => {
  const m = measureEdge(toGreyImage(frames[i]), { x: 0, y: 0, w: ROI_PX, h: ROI_PX })
  const expected = expectedMtf50(c.kernel, c.angleDeg)
  const mtfErr = (100 * ((m.mtf50 ?? NaN) - expected)) / expected
  const fit = c.kernel.type === 'gaussian' ? m.psf.gaussian : m.psf.disk
  const sizeErr = (100 * (fit.sizePx - kernelSize(c.kernel))) / kernelSize(c.kernel)
  const key = `${c.condition}|${kernelLabel(c.kernel)}`
  const fam = byFamily.get(key) ?? { mtf: [], size: [], models: 0, n: 0 }
  fam.mtf.push(mtfErr)
  fam.size.push(sizeErr)
  fam.models += m.psf.model === c.kernel.type ? 1 : 0
  fam.n++
  byFamily.set(key, fam)
  const cond = byCondition.get(c.condition) ?? { mtf: [], size: [] }
  cond.mtf.push(mtfErr)
  cond.size.push(sizeErr)
  byCondition.set(c.condition, cond)
})
rows.push(
  'condition  kernel          MTF50 err median   worst   | size err median   worst | model right',
)
for (const condition of CONDITIONS) {
  for (const k of KERNELS) {
    const f = byFamily.get(`${condition}|${kernelLabel(k)}`)!
    const s = stats(f.mtf)
    const z = stats(f.size)
    rows.push(
      `${condition.padEnd(9)}  ${kernelLabel(k).padEnd(14)}  ${pct(s.median)} ${pct(s.worst)}  | ${pct(z.median)} ${pct(z.worst)} | ${f.models}/${f.n}`,
    )
  }
  const all = byCondition.get(condition)!
  const s = stats(all.mtf)
  const z = stats(all.size)
  rows.push(
    `${condition.padEnd(9)}  ${'ALL'.padEnd(14)}  ${pct(s.median)} ${pct(s.worst)}  | ${pct(z.median)} ${pct(z.worst)} |`,
  )
}
console.log(rows.join('\n'))
