// Adding up per-(site, task) rows into the overall, per-site and per-task counts.
import type { FleetCounts } from '../../../shared/schemas/fleet'

export interface GroupRow {
  siteId: number
  taskId: string
  cameras: number
  checked: number
  passed: number
  marginal: number
  failing: number
  overdue: number
}

type Tally = Omit<FleetCounts, 'passRate'>

export const emptyTally = (): Tally => ({
  cameras: 0,
  checked: 0,
  passed: 0,
  marginal: 0,
  failing: 0,
  overdue: 0,
})

export function addInto(t: Tally, r: Tally): void {
  t.cameras += r.cameras
  t.checked += r.checked
  t.passed += r.passed
  t.marginal += r.marginal
  t.failing += r.failing
  t.overdue += r.overdue
}

export function withRate(t: Tally): FleetCounts {
  return { ...t, passRate: t.checked > 0 ? t.passed / t.checked : null }
}

/** Groups rows by a key, summing their counts. */
export function tallyBy<K>(rows: readonly GroupRow[], key: (r: GroupRow) => K): Map<K, Tally> {
  const out = new Map<K, Tally>()
  for (const r of rows) {
    const k = key(r)
    let t = out.get(k)
    if (!t) out.set(k, (t = emptyTally()))
    addInto(t, r)
  }
  return out
}
