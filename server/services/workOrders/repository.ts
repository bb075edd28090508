// Reading work orders: the joined rows, their API shape, history and photos. Plain functions on
// a database handle or an open transaction.
import { and, asc, desc, eq, inArray } from 'drizzle-orm'
import type { SQL } from 'drizzle-orm'
import { alias } from 'drizzle-orm/mysql-core'
import type {
  WorkOrder,
  WorkOrderDetail,
  WorkOrderHistoryEntry,
  WorkOrderPhoto,
} from '../../../shared/schemas/workOrders'
import { WORK_ORDER_ERRORS } from '../../../shared/schemas/workOrders'
import { isTerminal } from '../../../shared/workOrders/transitions'
import type { DbOrTx } from '../../db/client'
import {
  cameras,
  sites,
  tasks,
  users,
  workOrderHistory,
  workOrderPhotos,
  workOrders,
} from '../../db/schema'
import { AppError } from '../../errors'
import type { OrderSummary } from '../../mail/templates/workOrderMails'

export type OrderRow = typeof workOrders.$inferSelect

const assignee = alias(users, 'assignee')

export const orderColumns = {
  o: workOrders,
  assetTag: cameras.assetTag,
  siteId: cameras.siteId,
  siteName: sites.name,
  locationText: cameras.locationText,
  taskName: tasks.name,
  assigneeName: assignee.name,
}

export interface JoinedRow {
  o: OrderRow
  assetTag: string
  siteId: number
  siteName: string
  locationText: string
  taskName: string
  assigneeName: string | null
}

/** Orders joined with camera, site, task and assignee, filtered by `where`. */
export function selectOrders(db: DbOrTx, where?: SQL) {
  return db
    .select(orderColumns)
    .from(workOrders)
    .innerJoin(cameras, eq(cameras.id, workOrders.cameraId))
    .innerJoin(sites, eq(sites.id, cameras.siteId))
    .innerJoin(tasks, eq(tasks.id, cameras.taskId))
    .leftJoin(assignee, eq(assignee.id, workOrders.assigneeId))
    .where(where)
}

const iso = (d: Date | null) => (d ? d.toISOString() : null)

export function isOverdue(o: Pick<OrderRow, 'dueAt' | 'status'>, now: Date): boolean {
  return o.dueAt !== null && o.dueAt.getTime() < now.getTime() && !isTerminal(o.status)
}

export function toWorkOrder(r: JoinedRow, now: Date): WorkOrder {
  const o = r.o
  return {
    id: o.id,
    cameraId: o.cameraId,
    assetTag: r.assetTag,
    siteId: r.siteId,
    siteName: r.siteName,
    locationText: r.locationText,
    title: o.title,
    description: o.description,
    priority: o.priority,
    status: o.status,
    assigneeId: o.assigneeId,
    assigneeName: r.assigneeName,
    dueAt: iso(o.dueAt),
    overdue: isOverdue(o, now),
    openedByCheckId: o.openedByCheckId,
    closedByCheckId: o.closedByCheckId,
    closedAt: iso(o.closedAt),
    createdAt: o.createdAt.toISOString(),
    updatedAt: o.updatedAt.toISOString(),
    version: o.version,
  }
}

export function toSummary(r: JoinedRow): OrderSummary {
  return {
    id: r.o.id,
    title: r.o.title,
    assetTag: r.assetTag,
    siteName: r.siteName,
    locationText: r.locationText,
    priority: r.o.priority,
    status: r.o.status,
    dueAt: r.o.dueAt,
  }
}

export function notFound(id: number): AppError {
  return new AppError(WORK_ORDER_ERRORS.notFound, `There is no work order with id ${id}.`, 404)
}

export async function loadJoined(db: DbOrTx, id: number): Promise<JoinedRow> {
  const [row] = await selectOrders(db, eq(workOrders.id, id)).limit(1)
  if (!row) throw notFound(id)
  return row
}

/** Locks the order's row for the rest of the transaction. */
export async function lockOrder(tx: DbOrTx, id: number): Promise<OrderRow> {
  const [row] = await tx.select().from(workOrders).where(eq(workOrders.id, id)).for('update')
  if (!row) throw notFound(id)
  return row
}

const actor = alias(users, 'actor')
const fromUser = alias(users, 'from_user')
const toUser = alias(users, 'to_user')

export async function loadHistory(db: DbOrTx, id: number): Promise<WorkOrderHistoryEntry[]> {
  const rows = await db
    .select({
      h: workOrderHistory,
      actorName: actor.name,
      fromName: fromUser.name,
      toName: toUser.name,
    })
    .from(workOrderHistory)
    .leftJoin(actor, eq(actor.id, workOrderHistory.actorId))
    .leftJoin(fromUser, eq(fromUser.id, workOrderHistory.fromAssigneeId))
    .leftJoin(toUser, eq(toUser.id, workOrderHistory.toAssigneeId))
    .where(eq(workOrderHistory.workOrderId, id))
    .orderBy(asc(workOrderHistory.at), asc(workOrderHistory.id))
  return rows.map(({ h, actorName, fromName, toName }) => ({
    id: h.id,
    at: h.at.toISOString(),
    actorId: h.actorId,
    actorName,
    action: h.action,
    fromStatus: h.fromStatus,
    toStatus: h.toStatus,
    fromAssigneeId: h.fromAssigneeId,
    fromAssigneeName: fromName,
    toAssigneeId: h.toAssigneeId,
    toAssigneeName: toName,
    checkId: h.checkId,
    reason: h.reason,
    note: h.note,
    photoId: h.photoId,
  }))
}

export async function loadPhotos(db: DbOrTx, id: number): Promise<WorkOrderPhoto[]> {
  const rows = await db
    .select()
    .from(workOrderPhotos)
    .where(eq(workOrderPhotos.workOrderId, id))
    .orderBy(asc(workOrderPhotos.createdAt))
  return rows.map((p) => ({
    id: p.id,
    mime: p.mime === 'image/png' ? 'image/png' : 'image/jpeg',
    width: p.width,
    height: p.height,
    bytes: p.bytes,
    uploadedBy: p.uploadedBy,
    createdAt: p.createdAt.toISOString(),
  }))
}

export async function loadDetail(db: DbOrTx, id: number, now: Date): Promise<WorkOrderDetail> {
  const row = await loadJoined(db, id)
  const [history, photos] = [await loadHistory(db, id), await loadPhotos(db, id)]
  return { ...toWorkOrder(row, now), taskName: row.taskName, history, photos }
}

export interface UserInfo {
  id: number
  name: string
  email: string
  role: string
  active: boolean
}

export async function usersByIds(db: DbOrTx, ids: (number | null | undefined)[]) {
  const wanted = [...new Set(ids.filter((x): x is number => typeof x === 'number'))]
  const map = new Map<number, UserInfo>()
  if (!wanted.length) return map
  const rows = await db
    .select({ id: users.id, name: users.name, email: users.email, role: users.role, active: users.active })
    .from(users)
    .where(inArray(users.id, wanted))
  for (const r of rows) map.set(r.id, r)
  return map
}

/** Active users of a role, by name. */
export async function activeUsersOfRole(db: DbOrTx, role: 'inspector' | 'supervisor' | 'maintenance') {
  return db
    .select({ id: users.id, name: users.name, email: users.email, role: users.role, active: users.active })
    .from(users)
    .where(and(eq(users.role, role), eq(users.active, true)))
    .orderBy(asc(users.name), desc(users.id))
}
