// GET /api/work-orders: filters, paging, and the rule that maintenance sees only its own orders.
import { and, asc, count, desc, eq, gte, inArray, isNull, lt, or, sql } from 'drizzle-orm'
import type { SQL } from 'drizzle-orm'
import type { WorkOrderList, WorkOrderListQuery } from '../../../shared/schemas/workOrders'
import { ACTIVE_STATUSES } from '../../../shared/workOrders/transitions'
import type { Db } from '../../db/client'
import { cameras, workOrders } from '../../db/schema'
import type { AuthUser } from '../tokens'
import { selectOrders, toWorkOrder } from './repository'

export async function listOrders(
  db: Db,
  user: AuthUser,
  q: WorkOrderListQuery,
  now: Date,
): Promise<WorkOrderList> {
  const where: SQL[] = []
  const assigneeId = user.role === 'maintenance' ? user.id : q.assigneeId
  if (assigneeId !== undefined) where.push(eq(workOrders.assigneeId, assigneeId))
  if (q.status === 'active') where.push(inArray(workOrders.status, [...ACTIVE_STATUSES]))
  else if (q.status !== undefined) where.push(eq(workOrders.status, q.status))
  if (q.siteId !== undefined) where.push(eq(cameras.siteId, q.siteId))
  if (q.cameraId !== undefined) where.push(eq(workOrders.cameraId, q.cameraId))
  if (q.overdue === true)
    where.push(and(lt(workOrders.dueAt, now), inArray(workOrders.status, [...ACTIVE_STATUSES])) as SQL)
  if (q.overdue === false)
    where.push(
      or(
        isNull(workOrders.dueAt),
        gte(workOrders.dueAt, now),
        inArray(workOrders.status, ['closed', 'cancelled']),
      ) as SQL,
    )
  const cond = where.length ? and(...where) : undefined
  // Work still to do first, the most pressing due date first; finished orders last, newest first.
  const finished = sql`(${workOrders.status} in ('closed', 'cancelled'))`
  const rows = await selectOrders(db, cond)
    .orderBy(
      asc(finished),
      asc(sql`(${workOrders.dueAt} is null)`),
      sql`case when ${finished} then null else ${workOrders.dueAt} end asc`,
      desc(workOrders.updatedAt),
      desc(workOrders.id),
    )
    .limit(q.limit)
    .offset(q.offset)
  const [{ total }] = await db
    .select({ total: count() })
    .from(workOrders)
    .innerJoin(cameras, eq(cameras.id, workOrders.cameraId))
    .where(cond)
  return {
    items: rows.map((r) => toWorkOrder(r, now)),
    total: Number(total),
    limit: q.limit,
    offset: q.offset,
  }
}
