// Weekly aggregates behind the fleet charts: checks and results per (week, site) and median
// MTF50 bins per (week, camera model). A recorded check adds itself (check hook, in the check's
// transaction); `rebuildFleetWeeks` recomputes everything from `checks` (after bulk loads, and
// once per database on first use). Weeks start Monday 00:00 UTC.
import { sql } from 'drizzle-orm'
import { MTF50_BIN_COUNT, MTF50_BIN_CY_PX } from '../../../shared/schemas/fleet'
import type { Period } from '../../../shared/schemas/fleet'
import type { Db, DbOrTx } from '../../db/client'
import { fleetAggregateState, fleetWeekModels, fleetWeekSites } from '../../db/schema'
import { onCheckRecorded } from '../checkHooks'
import type { CheckRecordedEvent } from '../checkHooks'

const DAY_MS = 86_400_000
/** TO_DAYS('1970-01-05'), a Monday: week numbers count from it. */
const MONDAY_DAYS = 719_532

/** Monday 00:00 UTC of the week holding `t`, as YYYY-MM-DD. */
export function weekStart(t: Date): string {
  const day = (t.getUTCDay() + 6) % 7 // Monday 0 … Sunday 6
  const d = new Date(Date.UTC(t.getUTCFullYear(), t.getUTCMonth(), t.getUTCDate()) - day * DAY_MS)
  return d.toISOString().slice(0, 10)
}

const addDays = (isoDay: string, days: number) =>
  new Date(Date.parse(`${isoDay}T00:00:00Z`) + days * DAY_MS).toISOString().slice(0, 10)

/** The whole weeks overlapping a period: their starts and the instants they span. */
export function weeksOf(p: Period): { weeks: string[]; from: Date; to: Date } {
  const first = weekStart(p.from)
  const last = weekStart(new Date(p.to.getTime() - 1))
  const weeks: string[] = []
  for (let w = first; w <= last; w = addDays(w, 7)) weeks.push(w)
  return {
    weeks,
    from: new Date(`${first}T00:00:00Z`),
    to: new Date(`${addDays(last, 7)}T00:00:00Z`),
  }
}

/** SQL for the week start (a DATE) of a capture time column. */
export const weekOfSql = (column: unknown) =>
  sql`from_days(${MONDAY_DAYS} + 7 * floor((to_days(${column}) - ${MONDAY_DAYS}) / 7))`

/** SQL for the MTF50 bin of a median MTF50 column. */
export const binOfSql = (column: unknown) =>
  sql`least(floor(${column} / ${MTF50_BIN_CY_PX}), ${MTF50_BIN_COUNT - 1})`

export function mtfBin(mtf50CyPx: number): number {
  return Math.min(Math.floor(mtf50CyPx / MTF50_BIN_CY_PX), MTF50_BIN_COUNT - 1)
}

/** Recomputes both aggregates from every check, in one transaction. */
export async function rebuildFleetWeeks(db: Db, now = new Date()): Promise<void> {
  await db.transaction(async (tx) => {
    await tx.delete(fleetWeekSites)
    await tx.delete(fleetWeekModels)
    await tx.execute(sql`
      insert into fleet_week_sites (week, site_id, checks, passed, marginal, failed)
      select ${weekOfSql(sql`checks.captured_at`)} as wk, cameras.site_id, count(*),
        sum(checks.verdict = 'pass'), sum(checks.verdict = 'marginal'), sum(checks.verdict = 'fail')
      from checks join cameras on cameras.id = checks.camera_id
      group by wk, cameras.site_id`)
    await tx.execute(sql`
      insert into fleet_week_models (week, camera_model_id, mtf_bin, checks)
      select ${weekOfSql(sql`checks.captured_at`)} as wk, cameras.camera_model_id,
        ${binOfSql(sql`checks.median_mtf50_cy_px`)} as bin, count(*)
      from checks join cameras on cameras.id = checks.camera_id
      where checks.median_mtf50_cy_px is not null
      group by wk, cameras.camera_model_id, bin`)
    await tx
      .insert(fleetAggregateState)
      .values({ id: 1, rebuiltAt: now })
      .onDuplicateKeyUpdate({ set: { rebuiltAt: now } })
  })
}

const built = new WeakSet<object>()
const building = new WeakMap<object, Promise<void>>()

/** Builds the aggregates the first time a database is asked for them. */
export async function ensureFleetWeeks(db: Db): Promise<void> {
  if (built.has(db)) return
  let pending = building.get(db)
  if (!pending) {
    pending = (async () => {
      const [state] = await db.select().from(fleetAggregateState).limit(1)
      if (!state) await rebuildFleetWeeks(db)
      built.add(db)
    })().finally(() => building.delete(db))
    building.set(db, pending)
  }
  await pending
}

/** Adds one recorded check to its week's rows (runs in the check's transaction). */
export async function addCheckToWeeks(tx: DbOrTx, e: CheckRecordedEvent): Promise<void> {
  const week = weekStart(e.check.capturedAt)
  const v = e.check.verdict
  await tx
    .insert(fleetWeekSites)
    .values({
      week,
      siteId: e.cameraAfter.siteId,
      checks: 1,
      passed: v === 'pass' ? 1 : 0,
      marginal: v === 'marginal' ? 1 : 0,
      failed: v === 'fail' ? 1 : 0,
    })
    .onDuplicateKeyUpdate({
      set: {
        checks: sql`${fleetWeekSites.checks} + 1`,
        passed: sql`${fleetWeekSites.passed} + values(${fleetWeekSites.passed})`,
        marginal: sql`${fleetWeekSites.marginal} + values(${fleetWeekSites.marginal})`,
        failed: sql`${fleetWeekSites.failed} + values(${fleetWeekSites.failed})`,
      },
    })
  if (e.check.medianMtf50CyPx !== null)
    await tx
      .insert(fleetWeekModels)
      .values({
        week,
        cameraModelId: e.cameraAfter.cameraModelId,
        mtfBin: mtfBin(e.check.medianMtf50CyPx),
        checks: 1,
      })
      .onDuplicateKeyUpdate({ set: { checks: sql`${fleetWeekModels.checks} + 1` } })
}

let registered = false
/** Plugs the aggregates into check recording (once per process). */
export function registerFleetWeeksHook(): void {
  if (registered) return
  registered = true
  onCheckRecorded(addCheckToWeeks)
}
