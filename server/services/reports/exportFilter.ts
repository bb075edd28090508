// The rows an export covers: checks in the period of cameras matching the filters (retired
// cameras included: their history is still history).
import { and, eq, gte, lt, or, isNull, sql } from 'drizzle-orm'
import type { SQL } from 'drizzle-orm'
import type { ExportQuery } from '../../../shared/schemas/reports'
import { cameras, checks } from '../../db/schema'
import { periodOf } from '../fleet/scope'
import type { Period } from '../../../shared/schemas/fleet'

export function exportConditions(q: ExportQuery, now: Date): { where: SQL; period: Period } {
  const period = periodOf(q, now)
  const where: SQL[] = [gte(checks.capturedAt, period.from), lt(checks.capturedAt, period.to)]
  if (q.siteId !== undefined) where.push(eq(cameras.siteId, q.siteId))
  if (q.taskId !== undefined) where.push(eq(cameras.taskId, q.taskId))
  if (q.cameraModelId !== undefined) where.push(eq(cameras.cameraModelId, q.cameraModelId))
  if (q.cameraId !== undefined) where.push(eq(checks.cameraId, q.cameraId))
  if (q.state !== undefined) where.push(eq(cameras.state, q.state))
  if (q.verdict !== undefined) where.push(eq(checks.verdict, q.verdict))
  if (q.overdue === true) where.push(lt(cameras.nextDueAt, now))
  if (q.overdue === false)
    where.push(or(isNull(cameras.nextDueAt), gte(cameras.nextDueAt, now)) as SQL)
  return { where: and(...where) as SQL, period }
}

/** Keyset condition: rows after (capturedAt, id) in export order. */
export function after(last: { capturedAt: Date; id: string } | null): SQL | undefined {
  if (!last) return undefined
  return sql`(${checks.capturedAt} > ${last.capturedAt} or (${checks.capturedAt} = ${last.capturedAt} and ${checks.id} > ${last.id}))`
}

export function fileDate(d: Date): string {
  return d.toISOString().slice(0, 10)
}
