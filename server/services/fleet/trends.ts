// Chart series over the whole weeks overlapping the period, counting checks (retired cameras
// included: their checks are history): share of passing checks per week, overall and by
// site, and the spread of checks' median MTF50 by camera model. Unfiltered (or narrowed only
// by what the aggregates hold) they read the weekly aggregates (weeks.ts); otherwise the checks.
import { and, eq, gte, inArray, lte, sql } from 'drizzle-orm'
import type { SQL } from 'drizzle-orm'
import { MTF50_BIN_COUNT, MTF50_BIN_CY_PX } from '../../../shared/schemas/fleet'
import type {
  FleetFilter,
  MtfDistribution,
  PassRateTrend,
  WeekPoint,
} from '../../../shared/schemas/fleet'
import type { Db } from '../../db/client'
import { cameraModels, cameras, fleetWeekModels, fleetWeekSites, sites } from '../../db/schema'
import { num, periodOf } from './scope'
import { binOfSql, ensureFleetWeeks, weekOfSql, weeksOf } from './weeks'

export type TrendSource = 'auto' | 'aggregates' | 'checks'

type Raw = Record<string, unknown>
const rate = (checks: number, passed: number) => (checks > 0 ? passed / checks : null)
const day = (v: unknown) =>
  v instanceof Date ? v.toISOString().slice(0, 10) : String(v).slice(0, 10)

/** Camera filters without the "in service" rule (for history). */
function historyScope(f: FleetFilter): SQL {
  const where: SQL[] = [sql`1 = 1`]
  if (f.siteId !== undefined) where.push(eq(cameras.siteId, f.siteId))
  if (f.taskId !== undefined) where.push(eq(cameras.taskId, f.taskId))
  if (f.cameraModelId !== undefined) where.push(eq(cameras.cameraModelId, f.cameraModelId))
  return and(...where) as SQL
}

async function siteWeekRows(
  db: Db,
  f: FleetFilter,
  span: ReturnType<typeof weeksOf>,
  source: TrendSource,
) {
  const useAggregates =
    source === 'aggregates' ||
    (source === 'auto' && f.taskId === undefined && f.cameraModelId === undefined)
  if (useAggregates) {
    await ensureFleetWeeks(db)
    const rows = await db
      .select()
      .from(fleetWeekSites)
      .where(
        and(
          gte(fleetWeekSites.week, span.weeks[0]),
          lte(fleetWeekSites.week, span.weeks[span.weeks.length - 1]),
          f.siteId !== undefined ? eq(fleetWeekSites.siteId, f.siteId) : undefined,
        ),
      )
    return rows.map((r) => ({
      siteId: r.siteId,
      week: day(r.week),
      checks: r.checks,
      passed: r.passed,
    }))
  }
  const [rows] = (await db.execute(sql`
    select cameras.site_id as siteId, ${weekOfSql(sql`checks.captured_at`)} as week,
      count(*) as checks, sum(checks.verdict = 'pass') as passed
    from checks join cameras on cameras.id = checks.camera_id
    where checks.captured_at >= ${span.from} and checks.captured_at < ${span.to} and ${historyScope(f)}
    group by siteId, week`)) as unknown as [Raw[]]
  return rows.map((r) => ({
    siteId: num(r.siteId),
    week: day(r.week),
    checks: num(r.checks),
    passed: num(r.passed),
  }))
}

export async function passRateTrend(
  db: Db,
  f: FleetFilter & { sites: number },
  now: Date,
  source: TrendSource = 'auto',
): Promise<PassRateTrend> {
  const p = periodOf(f, now)
  const span = weeksOf(p)
  const rows = await siteWeekRows(db, f, span, source)
  const overall = new Map(span.weeks.map((w) => [w, { checks: 0, passed: 0 }]))
  const bySite = new Map<number, Map<string, { checks: number; passed: number }>>()
  for (const r of rows) {
    const o = overall.get(r.week)
    if (o) {
      o.checks += r.checks
      o.passed += r.passed
    }
    let s = bySite.get(r.siteId)
    if (!s) bySite.set(r.siteId, (s = new Map()))
    s.set(r.week, { checks: r.checks, passed: r.passed })
  }
  const points = (m: Map<string, { checks: number; passed: number }>): WeekPoint[] =>
    span.weeks.map((week) => {
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
  totals.sort(
    (a, b) => (a.passRate ?? 1) - (b.passRate ?? 1) || b.checks - a.checks || a.siteId - b.siteId,
  )
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
    weeks: span.weeks,
    overall: points(overall),
    sites: chosen.map((c) => ({
      ...c,
      siteName: nameOf.get(c.siteId) ?? `Site ${c.siteId}`,
      points: points(bySite.get(c.siteId)!),
    })),
    sitesLeftOut: totals.length - chosen.length,
  }
}

async function modelBinRows(
  db: Db,
  f: FleetFilter,
  span: ReturnType<typeof weeksOf>,
  source: TrendSource,
) {
  const useAggregates =
    source === 'aggregates' ||
    (source === 'auto' && f.siteId === undefined && f.taskId === undefined)
  if (useAggregates) {
    await ensureFleetWeeks(db)
    const rows = await db
      .select({
        modelId: fleetWeekModels.cameraModelId,
        bin: fleetWeekModels.mtfBin,
        n: sql<number>`sum(${fleetWeekModels.checks})`,
      })
      .from(fleetWeekModels)
      .where(
        and(
          gte(fleetWeekModels.week, span.weeks[0]),
          lte(fleetWeekModels.week, span.weeks[span.weeks.length - 1]),
          f.cameraModelId !== undefined
            ? eq(fleetWeekModels.cameraModelId, f.cameraModelId)
            : undefined,
        ),
      )
      .groupBy(fleetWeekModels.cameraModelId, fleetWeekModels.mtfBin)
    return rows.map((r) => ({ modelId: r.modelId, bin: r.bin, n: num(r.n) }))
  }
  const [rows] = (await db.execute(sql`
    select cameras.camera_model_id as modelId, ${binOfSql(sql`checks.median_mtf50_cy_px`)} as bin, count(*) as n
    from checks join cameras on cameras.id = checks.camera_id
    where checks.captured_at >= ${span.from} and checks.captured_at < ${span.to}
      and checks.median_mtf50_cy_px is not null and ${historyScope(f)}
    group by modelId, bin`)) as unknown as [Raw[]]
  return rows.map((r) => ({ modelId: num(r.modelId), bin: num(r.bin), n: num(r.n) }))
}

export async function mtfDistribution(
  db: Db,
  f: FleetFilter,
  now: Date,
  source: TrendSource = 'auto',
): Promise<MtfDistribution> {
  const p = periodOf(f, now)
  const span = weeksOf(p)
  const byModel = new Map<number, number[]>()
  for (const r of await modelBinRows(db, f, span, source)) {
    let counts = byModel.get(r.modelId)
    if (!counts) byModel.set(r.modelId, (counts = new Array<number>(MTF50_BIN_COUNT).fill(0)))
    counts[Math.max(0, r.bin)] += r.n
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
      return { cameraModelId: m.id, name: m.name, counts, total: counts.reduce((a, b) => a + b, 0) }
    }),
  }
}
