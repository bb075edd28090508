// One user action on a work order, inside a transaction: lock the row, check the version the user
// saw, ask the transition table, write the change with its history, change feed and notices.
import { eq } from 'drizzle-orm'
import type { WorkOrderAction } from '../../../shared/workOrders/transitions'
import { TRANSITIONS, decide } from '../../../shared/workOrders/transitions'
import { WORK_ORDER_ERRORS } from '../../../shared/schemas/workOrders'
import type { DbOrTx } from '../../db/client'
import { users } from '../../db/schema'
import { AppError } from '../../errors'
import type { AuthUser } from '../tokens'
import { noticeAssigned, noticeReassigned, noticeRecheckDue } from './notices'
import { loadDetail, loadJoined, lockOrder, toSummary } from './repository'
import type { OrderRow } from './repository'
import { changeOrder, setCameraRepairState } from './writes'

export interface ActionInput {
  action: WorkOrderAction
  version: number
  assigneeId?: number
  reason?: string
  note?: string
  /** Set by the photo upload (action add_photo). */
  photoId?: string
}

export interface ActionContext {
  tx: DbOrTx
  actor: AuthUser
  now: Date
  publicUrl: string
  /**
   * `strict` (the HTTP API): a version other than the current one is refused with 409.
   * `merge` (offline updates through sync): an older version is accepted when the table still
   * allows the action on the order as it is now; real conflicts are still refused.
   */
  versions: 'strict' | 'merge'
}

const HISTORY_ACTION: Record<WorkOrderAction, string> = {
  assign: 'assigned',
  reassign: 'reassigned',
  start: 'started',
  request_recheck: 'recheck_requested',
  comment: 'comment',
  add_photo: 'photo',
  cancel: 'cancelled',
  close: 'closed',
}

async function staleError(tx: DbOrTx, id: number, now: Date): Promise<AppError> {
  const current = await loadDetail(tx, id, now)
  return new AppError(
    WORK_ORDER_ERRORS.stale,
    `Someone changed work order #${id} while you were looking at it (now version ${current.version}). Look at the current order and try again.`,
    409,
    { current },
  )
}

async function checkAssignee(tx: DbOrTx, row: OrderRow, assigneeId: number): Promise<void> {
  const [u] = await tx
    .select({ role: users.role, active: users.active, name: users.name })
    .from(users)
    .where(eq(users.id, assigneeId))
  if (!u || u.role !== 'maintenance' || !u.active)
    throw new AppError(
      WORK_ORDER_ERRORS.badAssignee,
      'Work orders can only be assigned to an active maintenance user.',
      400,
      { fields: { assigneeId: ['Choose an active maintenance user.'] } },
    )
  if (row.assigneeId === assigneeId)
    throw new AppError(WORK_ORDER_ERRORS.badAssignee, `The order is already assigned to ${u.name}.`, 400, {
      fields: { assigneeId: ['Choose someone else.'] },
    })
}

/** Applies the action; returns the order's new version. Throws AppError for every refusal. */
export async function applyAction(c: ActionContext, orderId: number, input: ActionInput): Promise<number> {
  const { tx, actor, now } = c
  const row = await lockOrder(tx, orderId)
  // Someone else's order: say so before anything about it (its version, its status) leaks.
  if (actor.role === 'maintenance' && row.assigneeId !== actor.id)
    throw new AppError(WORK_ORDER_ERRORS.notAllowed, 'This work order is not assigned to you.', 403)
  if (input.version !== row.version && c.versions === 'strict') throw await staleError(tx, orderId, now)

  const decision = decide(input.action, row, actor)
  if (!decision.ok) {
    if (decision.why === 'status') {
      if (input.version !== row.version) throw await staleError(tx, orderId, now)
      throw new AppError(WORK_ORDER_ERRORS.invalidTransition, decision.message, 409)
    }
    throw new AppError(WORK_ORDER_ERRORS.notAllowed, decision.message, 403)
  }
  const needs = TRANSITIONS[input.action].needs
  if (needs.assignee) await checkAssignee(tx, row, input.assigneeId as number)

  const assignsTo = needs.assignee ? (input.assigneeId as number) : row.assigneeId
  const terminal = decision.to === 'cancelled' || decision.to === 'closed'
  const version = await changeOrder(
    tx,
    row,
    {
      status: decision.to,
      assigneeId: assignsTo,
      ...(terminal ? { closedAt: now } : {}),
    },
    {
      actorId: actor.id,
      action: HISTORY_ACTION[input.action],
      fromStatus: row.status,
      toStatus: decision.to,
      fromAssigneeId: needs.assignee ? row.assigneeId : null,
      toAssigneeId: needs.assignee ? assignsTo : null,
      reason: input.reason ?? null,
      note: input.note ?? null,
      photoId: input.photoId ?? null,
    },
    now,
  )
  if (decision.to !== row.status) await setCameraRepairState(tx, row.cameraId, decision.to, now)

  const notice = { tx, now, publicUrl: c.publicUrl }
  const summary = toSummary(await loadJoined(tx, orderId))
  if (input.action === 'assign')
    await noticeAssigned(notice, summary, version, { assigneeId: assignsTo as number, byId: actor.id })
  if (input.action === 'reassign')
    await noticeReassigned(notice, summary, version, {
      fromId: row.assigneeId,
      toId: assignsTo as number,
      byId: actor.id,
      reason: input.reason as string,
    })
  if (input.action === 'request_recheck')
    await noticeRecheckDue(notice, { ...summary, cameraId: row.cameraId }, version, {
      assigneeId: row.assigneeId,
      note: input.note ?? null,
    })
  return version
}
