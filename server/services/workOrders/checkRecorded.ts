// What a recorded check does to work orders, inside the check's own transaction:
// - a failing check opens an order for its camera, or adds to the one already open;
// - while the order awaits a re-check, a passing check closes it (and records which check did),
//   any other verdict sends it back to its assignee;
// - a check taken before the re-check was asked for (an old check synced late) only adds history.
import { and, desc, eq, gt, inArray } from 'drizzle-orm'
import type { Verdict } from '../../../shared/schemas/enums'
import type { VerdictReason } from '../../../shared/schemas/checks'
import { ACTIVE_STATUSES } from '../../../shared/workOrders/transitions'
import type { DbOrTx } from '../../db/client'
import { cameras, checks, tasks, workOrderHistory, workOrders } from '../../db/schema'
import { noticeClosed, noticeReturned } from './notices'
import { loadJoined, toSummary } from './repository'
import type { OrderRow } from './repository'
import { appendHistory, changeOrder, recordChange } from './writes'

export interface RecordedCheck {
  id: string
  cameraId: number
  inspectorId: number
  verdict: Verdict
  capturedAt: Date
  reasons: readonly VerdictReason[]
}

export interface HookContext {
  now: Date
  publicUrl: string
}

export type CheckOutcome =
  { kind: 'none' } | { kind: 'opened' | 'added' | 'closed' | 'returned'; workOrderId: number }

const DAY_MS = 86_400_000

export function reasonsText(reasons: readonly VerdictReason[]): string {
  return reasons.map((r) => r.text).join(' ') || 'The check did not pass.'
}

/** The camera's open order, locked; the caller already holds the camera's row lock. */
async function lockedOpenOrder(tx: DbOrTx, cameraId: number): Promise<OrderRow | undefined> {
  const [open] = await tx
    .select()
    .from(workOrders)
    .where(and(eq(workOrders.cameraId, cameraId), inArray(workOrders.status, [...ACTIVE_STATUSES])))
    .for('update')
  return open
}

/** Locks the camera (serialising work orders per camera) and returns its open order, if any. */
async function lockOpenOrder(tx: DbOrTx, cameraId: number) {
  const [camera] = await tx
    .select({
      id: cameras.id,
      assetTag: cameras.assetTag,
      locationText: cameras.locationText,
      taskId: cameras.taskId,
    })
    .from(cameras)
    .where(eq(cameras.id, cameraId))
    .for('update')
  if (!camera) throw new Error(`check for unknown camera ${cameraId}`)
  return { camera, open: await lockedOpenOrder(tx, cameraId) }
}

/** Opens an order for the camera (or returns the open one): priority and due date from its task. */
export async function openOrder(
  tx: DbOrTx,
  p: {
    cameraId: number
    now: Date
    actorId: number | null
    createdBy: number | null
    checkId: string | null
    title?: string
    description?: string | null
    priority?: OrderRow['priority']
    dueAt?: Date
    note: string
  },
): Promise<{ created: boolean; order: OrderRow }> {
  const { camera, open } = await lockOpenOrder(tx, p.cameraId)
  if (open) return { created: false, order: open }
  const [task] = await tx.select().from(tasks).where(eq(tasks.id, camera.taskId))
  const [ins] = await tx
    .insert(workOrders)
    .values({
      cameraId: p.cameraId,
      openedByCheckId: p.checkId,
      priority: p.priority ?? task.workOrderPriority,
      dueAt: p.dueAt ?? new Date(p.now.getTime() + task.workOrderDueDays * DAY_MS),
      status: 'open',
      title:
        p.title ??
        `Soft image on ${camera.assetTag}${camera.locationText ? ` (${camera.locationText})` : ''}`,
      description: p.description ?? null,
      createdBy: p.createdBy,
      createdAt: p.now,
      updatedAt: p.now,
    })
    .$returningId()
  await appendHistory(tx, ins.id, {
    at: p.now,
    actorId: p.actorId,
    action: 'opened',
    toStatus: 'open',
    checkId: p.checkId,
    note: p.note,
  })
  await recordChange(tx, 'work_order', ins.id)
  const [order] = await tx.select().from(workOrders).where(eq(workOrders.id, ins.id))
  return { created: true, order }
}

/** When the order last went to awaiting_recheck (null if it never did). */
async function recheckRequestedAt(tx: DbOrTx, orderId: number): Promise<Date | null> {
  const [row] = await tx
    .select({ at: workOrderHistory.at })
    .from(workOrderHistory)
    .where(
      and(
        eq(workOrderHistory.workOrderId, orderId),
        eq(workOrderHistory.toStatus, 'awaiting_recheck'),
      ),
    )
    .orderBy(desc(workOrderHistory.id))
    .limit(1)
  return row?.at ?? null
}

async function alreadyRecorded(tx: DbOrTx, orderId: number, checkId: string): Promise<boolean> {
  const [row] = await tx
    .select({ id: workOrderHistory.id })
    .from(workOrderHistory)
    .where(and(eq(workOrderHistory.workOrderId, orderId), eq(workOrderHistory.checkId, checkId)))
    .limit(1)
  return Boolean(row)
}

/** A later passing check of the camera exists: an old failure synced late opens nothing. */
async function passedSince(tx: DbOrTx, check: RecordedCheck): Promise<boolean> {
  const [row] = await tx
    .select({ id: checks.id })
    .from(checks)
    .where(
      and(
        eq(checks.cameraId, check.cameraId),
        eq(checks.verdict, 'pass'),
        gt(checks.capturedAt, check.capturedAt),
      ),
    )
    .limit(1)
  return Boolean(row)
}

/**
 * Runs inside recordCheck's transaction, which has locked the camera row (checks.ts lockCamera):
 * that lock serialises this camera's checks and orders, so only the open order is locked here.
 */
export async function handleCheckForWorkOrders(
  tx: DbOrTx,
  check: RecordedCheck,
  ctx: HookContext,
): Promise<CheckOutcome> {
  const { now } = ctx
  const open = await lockedOpenOrder(tx, check.cameraId)
  const why = reasonsText(check.reasons)

  if (!open) {
    if (check.verdict !== 'fail' || (await passedSince(tx, check))) return { kind: 'none' }
    const { order } = await openOrder(tx, {
      cameraId: check.cameraId,
      now,
      actorId: check.inspectorId,
      createdBy: null,
      checkId: check.id,
      description: why,
      note: `Opened by a failing check. ${why}`,
    })
    return { kind: 'opened', workOrderId: order.id }
  }
  if (await alreadyRecorded(tx, open.id, check.id)) return { kind: 'none' }

  const requestedAt =
    open.status === 'awaiting_recheck' ? await recheckRequestedAt(tx, open.id) : null
  const isRecheck = requestedAt !== null && check.capturedAt.getTime() >= requestedAt.getTime()
  const notice = { tx, now, publicUrl: ctx.publicUrl }

  if (isRecheck && check.verdict === 'pass') {
    const version = await changeOrder(
      tx,
      open,
      { status: 'closed', closedAt: now, closedByCheckId: check.id },
      {
        actorId: check.inspectorId,
        action: 'closed',
        fromStatus: open.status,
        toStatus: 'closed',
        checkId: check.id,
        note: 'Closed by a passing re-check.',
      },
      now,
    )
    await noticeClosed(notice, toSummary(await loadJoined(tx, open.id)), version, {
      checkId: check.id,
      inspectorId: check.inspectorId,
    })
    return { kind: 'closed', workOrderId: open.id }
  }
  if (isRecheck) {
    const version = await changeOrder(
      tx,
      open,
      { status: 'assigned' },
      {
        actorId: check.inspectorId,
        action: 'recheck_failed',
        fromStatus: open.status,
        toStatus: 'assigned',
        checkId: check.id,
        note: `The re-check was ${check.verdict === 'fail' ? 'a fail' : 'marginal'}: back to the assignee. ${why}`,
      },
      now,
    )
    await noticeReturned(notice, toSummary(await loadJoined(tx, open.id)), version, {
      assigneeId: open.assigneeId,
      inspectorId: check.inspectorId,
      reasons: why,
    })
    return { kind: 'returned', workOrderId: open.id }
  }
  // Any other check of a camera with an open order: kept in the order's history.
  const words = {
    pass: 'A passing check',
    marginal: 'A marginal check',
    fail: 'Another failing check',
  }
  await changeOrder(
    tx,
    open,
    {},
    {
      actorId: check.inspectorId,
      action: `check_${check.verdict}`,
      checkId: check.id,
      note: `${words[check.verdict]} was recorded.${check.verdict === 'pass' ? '' : ` ${why}`}`,
    },
    now,
  )
  return { kind: 'added', workOrderId: open.id }
}
