// Chart series: share of passing checks per week (overall and by site) and the distribution of
// checks' median MTF50 by camera model. Both count checks in the period (not cameras).
import { inArray, sql } from 'drizzle-orm'
import {
  MTF50_BIN_COUNT,
  MTF50_BIN_CY_PX,
} from '../../../shared/schemas/fleet'
import type {
  FleetFilter,
  MtfDistribution,
  PassRateTrend,
  WeekPoint,
} from '../../../shared/schemas/fleet'
import type { Db } from '../../db/client'
import { cameraModels, sites } from '../../db/schema'
import { cameraScope, num, periodOf } from './scope'

const DAY_MS = 86_400_000

/** Monday 00:00 UTC of the week holding `t`, as YYYY-MM-DD. */
export function weekStart(t: Date): string {
  const day = (t.getUTCDay() + 6) % 7 // Monday 0 … Sunday 6
  const d = new Date(Date.UTC(t.getUTCFullYear(), t.getUTCMonth(), t.getUTCDate()) - day * DAY_MS)
  return d.toISOString().slice(0, 10)
}

/** Every week start from the week of `from` up to the week of the last instant before `to`. */
export function weeksOf(from: Date, to: Date): string[] {
  const out: string[] = []
  const last = weekStart(new Date(to.getTime() - 1))
  for (let w = weekStart(from); w <= last; ) {
    out.push(w)
    w = new Date(Date.parse(`${w}T00:00:00Z`) + 7 * DAY_MS).toISOString().slice(0, 10)
  }
  return out
}

const rate = (checks: number, passed: number) => (checks > 0 ? passed / checks : null)

export async function passRateTrend(
  db: Db,
  f: FleetFilter & { sites: number },
  now: Date,
): Promise<PassRateTrend> {
  const p = periodOf(f, now)
  const [rows] = (await db.execute(sql`
    select cameras.site_id as siteId,
      date_format(checks.captured_at - interval weekday(checks.captured_at) day, '%Y-%m-%d') as week,
      count(*) as checks, sum(checks.verdict = 'pass') as passed
    from checks join cameras on cameras.id = checks.camera_id
    where checks.captured_at >= ${p.from} and checks.captured_at < ${p.to} and ${cameraScope(f)}
    group by cameras.site_id, week`)) as unknown as [Record<string, unknown>[]]

  const weeks = weeksOf(p.from, p.to)
  const overall = new Map(weeks.map((w) => [w, { checks: 0, passed: 0 }]))
  const bySite = new Map<number, Map<string, { checks: number; passed: number }>>()
  for (const r of rows) {
    const siteId = num(r.siteId)
    const week = String(r.week)
    const c = num(r.checks)
    const pass = num(r.passed)
    const o = overall.get(week)
    if (o) {
      o.checks += c
      o.passed += pass
    }
    let s = bySite.get(siteId)
    if (!s) bySite.set(siteId, (s = new Map()))
    s.set(week, { checks: c, passed: pass })
  }
  const points = (m: Map<string, { checks: number; passed: number }>): WeekPoint[] =>
    weeks.map((week) => {
      const v = m.get(week) ?? { checks: 0, passed: 0 }
      return { week, ...v, passRate: rate(v.checks, v.passed) }
    })

  const totals = [...bySite.entries()].map(([siteId, m]) => {
    let c = 0
    let pass = 0
    for (const v of m.values()) {
      c += v.checks
      pass += v.passed
    }
    return { siteId, checks: c, passRate: rate(c, pass) }
  })
  // The sites most in need of attention first: lowest pass rate, then the most checks.
  totals.sort((a, b) => (a.passRate ?? 1) - (b.passRate ?? 1) || b.checks - a.checks)
  const chosen = totals.slice(0, f.sites)
  const names = chosen.length
    ? await db
        .select({ id: sites.id, name: sites.name })
        .from(sites)
        .where(
          inArray(
            sites.id,
            chosen.map((c) => c.siteId),
          ),
        )
    : []
  const nameOf = new Map(names.map((n) => [n.id, n.name]))
  return {
    period: { from: p.from.toISOString(), to: p.to.toISOString() },
    weeks,
    overall: points(overall),
    sites: chosen.map((c) => ({
      ...c,
      siteName: nameOf.get(c.siteId) ?? `Site ${c.siteId}`,
      points: points(bySite.get(c.siteId)!),
    })),
    sitesLeftOut: totals.length - chosen.length,
  }
}

export async function mtfDistribution(
  db: Db,
  f: FleetFilter,
  now: Date,
): Promise<MtfDistribution> {
  const p = periodOf(f, now)
  const [rows] = (await db.execute(sql`
    select cameras.camera_model_id as modelId,
      least(floor(checks.median_mtf50_cy_px / ${MTF50_BIN_CY_PX}), ${MTF50_BIN_COUNT - 1}) as bin,
      count(*) as n
    from checks join cameras on cameras.id = checks.camera_id
    where checks.captured_at >= ${p.from} and checks.captured_at < ${p.to}
      and checks.median_mtf50_cy_px is not null and ${cameraScope(f)}
    group by modelId, bin`)) as unknown as [Record<string, unknown>[]]
  const byModel = new Map<number, number[]>()
  for (const r of rows) {
    const id = num(r.modelId)
    let counts = byModel.get(id)
    if (!counts) byModel.set(id, (counts = new Array<number>(MTF50_BIN_COUNT).fill(0)))
    counts[Math.max(0, num(r.bin))] += num(r.n)
  }
  const models = byModel.size
    ? await db
        .select({ id: cameraModels.id, name: cameraModels.name })
        .from(cameraModels)
        .where(inArray(cameraModels.id, [...byModel.keys()]))
    : []
  models.sort((a, b) => a.name.localeCompare(b.name))
  return {
    period: { from: p.from.toISOString(), to: p.to.toISOString() },
    binWidthCyPx: MTF50_BIN_CY_PX,
    binsCyPx: Array.from({ length: MTF50_BIN_COUNT }, (_, i) =>
      Number((i * MTF50_BIN_CY_PX).toFixed(4)),
    ),
    models: models.map((m) => {
      const counts = byModel.get(m.id)!
      return {
        cameraModelId: m.id,
        name: m.name,
        counts,
        total: counts.reduce((a, b) => a + b, 0),
      }
    }),
  }
}
