// Fleet counts for a period: overall, by site and by task. A camera's result for the period is
// its latest check in the period. Two ways to find it:
// - `latest`: the period reaches the present, so the latest check in it is the camera's latest
//   check, which the camera row keeps (last_check_at / last_verdict): one pass over cameras;
// - `history`: any other period: the newest check per camera in the period from `checks`.
import { asc, inArray, sql } from 'drizzle-orm'
import type { SQL } from 'drizzle-orm'
import type { FleetFilter, FleetSummary, Period } from '../../../shared/schemas/fleet'
import type { Db } from '../../db/client'
import { cameras, sites, tasks } from '../../db/schema'
import { tallyBy, withRate, emptyTally, addInto } from './counts'
import type { GroupRow } from './counts'
import { cameraScope, num, periodOf } from './scope'

export type SummaryStrategy = 'auto' | 'latest' | 'history'

type Raw = Record<string, unknown>

async function rowsFromLatest(db: Db, p: Period, scope: SQL, now: Date): Promise<GroupRow[]> {
  const inPeriod = sql`(${cameras.lastCheckAt} >= ${p.from} and ${cameras.lastCheckAt} < ${p.to})`
  const rows = (await db
    .select({
      siteId: cameras.siteId,
      taskId: cameras.taskId,
      cameras: sql`count(*)`,
      checked: sql`sum(${inPeriod})`,
      passed: sql`sum(${inPeriod} and ${cameras.lastVerdict} = 'pass')`,
      marginal: sql`sum(${inPeriod} and ${cameras.lastVerdict} = 'marginal')`,
      failing: sql`sum(${inPeriod} and ${cameras.lastVerdict} = 'fail')`,
      overdue: sql`sum(${cameras.nextDueAt} < ${now})`,
    })
    .from(cameras)
    .where(scope)
    .groupBy(cameras.siteId, cameras.taskId)) as Raw[]
  return rows.map(toGroupRow)
}

async function rowsFromHistory(db: Db, p: Period, scope: SQL, now: Date): Promise<GroupRow[]> {
  const base = (await db
    .select({
      siteId: cameras.siteId,
      taskId: cameras.taskId,
      cameras: sql`count(*)`,
      overdue: sql`sum(${cameras.nextDueAt} < ${now})`,
    })
    .from(cameras)
    .where(scope)
    .groupBy(cameras.siteId, cameras.taskId)) as Raw[]
  const [verdictRows] = (await db.execute(sql`
    select cameras.site_id as siteId, cameras.task_id as taskId, count(*) as checked,
      sum(l.verdict = 'pass') as passed, sum(l.verdict = 'marginal') as marginal,
      sum(l.verdict = 'fail') as failing
    from (
      select camera_id, verdict,
        row_number() over (partition by camera_id order by captured_at desc, id desc) as rn
      from checks where captured_at >= ${p.from} and captured_at < ${p.to}
    ) l
    join cameras on cameras.id = l.camera_id
    where l.rn = 1 and ${scope}
    group by cameras.site_id, cameras.task_id`)) as unknown as [Raw[]]
  const verdicts = new Map(verdictRows.map((r) => [`${num(r.siteId)}|${String(r.taskId)}`, r]))
  return base.map((b) => {
    const v = verdicts.get(`${num(b.siteId)}|${String(b.taskId)}`) ?? {}
    return toGroupRow({ ...b, ...v, cameras: b.cameras, overdue: b.overdue })
  })
}

function toGroupRow(r: Raw): GroupRow {
  return {
    siteId: num(r.siteId),
    taskId: String(r.taskId),
    cameras: num(r.cameras),
    checked: num(r.checked),
    passed: num(r.passed),
    marginal: num(r.marginal),
    failing: num(r.failing),
    overdue: num(r.overdue),
  }
}

export async function fleetSummary(
  db: Db,
  f: FleetFilter,
  now: Date,
  strategy: SummaryStrategy = 'auto',
): Promise<FleetSummary> {
  const p = periodOf(f, now)
  const scope = cameraScope(f)
  const useLatest =
    strategy === 'latest' || (strategy === 'auto' && p.to.getTime() >= now.getTime())
  const rows = useLatest
    ? await rowsFromLatest(db, p, scope, now)
    : await rowsFromHistory(db, p, scope, now)

  const overall = emptyTally()
  for (const r of rows) addInto(overall, r)
  const bySite = tallyBy(rows, (r) => r.siteId)
  const byTask = tallyBy(rows, (r) => r.taskId)

  const siteIds = [...bySite.keys()]
  const siteRows = siteIds.length
    ? await db
        .select({ id: sites.id, name: sites.name })
        .from(sites)
        .where(inArray(sites.id, siteIds))
        .orderBy(asc(sites.name))
    : []
  const taskRows = await db
    .select({ id: tasks.id, name: tasks.name })
    .from(tasks)
    .orderBy(asc(tasks.sortOrder), asc(tasks.name))

  return {
    period: { from: p.from.toISOString(), to: p.to.toISOString() },
    overall: withRate(overall),
    bySite: siteRows.map((s) => ({
      siteId: s.id,
      siteName: s.name,
      ...withRate(bySite.get(s.id) ?? emptyTally()),
    })),
    byTask: taskRows
      .filter((t) => byTask.has(t.id))
      .map((t) => ({ taskId: t.id, taskName: t.name, ...withRate(byTask.get(t.id)!) })),
  }
}
