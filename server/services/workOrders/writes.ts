// The low-level writes every work-order change makes: bump the version, append history, record a
// change for sync pull. Used by the actions, the check hook and manual creation.
import { and, eq, sql } from 'drizzle-orm'
import type { WorkOrderStatus } from '../../../shared/schemas/enums'
import type { DbOrTx } from '../../db/client'
import { cameras, workOrderHistory, workOrders } from '../../db/schema'
import { SYNC_ENTITIES, recordChanges } from '../sync/changes'
import type { OrderRow } from './repository'

export type HistoryInsert = Omit<typeof workOrderHistory.$inferInsert, 'id' | 'workOrderId'>

/** The change-feed row devices pull (written last in the transaction, see sync/changes.ts). */
export async function recordChange(tx: DbOrTx, entity: 'work_order' | 'camera', id: number) {
  await recordChanges(tx, entity === 'camera' ? SYNC_ENTITIES.camera : SYNC_ENTITIES.workOrder, [id])
}

export async function appendHistory(tx: DbOrTx, workOrderId: number, entry: HistoryInsert) {
  await tx.insert(workOrderHistory).values({ ...entry, workOrderId })
}

/**
 * Applies `set` to the order (holding its row lock), bumps its version, appends the history entry
 * and records the change. Returns the new version.
 */
export async function changeOrder(
  tx: DbOrTx,
  row: OrderRow,
  set: Partial<Pick<OrderRow, 'status' | 'assigneeId' | 'closedAt' | 'closedByCheckId'>>,
  entry: HistoryInsert,
  now: Date,
): Promise<number> {
  const version = row.version + 1
  const result = await tx
    .update(workOrders)
    .set({ ...set, version, updatedAt: now })
    .where(and(eq(workOrders.id, row.id), eq(workOrders.version, row.version)))
  const affected = (result as unknown as [{ affectedRows: number }])[0]?.affectedRows
  if (affected !== 1) throw new Error(`work order ${row.id} changed under its row lock`)
  await appendHistory(tx, row.id, { at: now, ...entry })
  await recordChange(tx, 'work_order', row.id)
  return version
}

/** The camera's state follows the repair: in repair while work is under way. */
export async function setCameraRepairState(
  tx: DbOrTx,
  cameraId: number,
  to: WorkOrderStatus,
  now: Date,
): Promise<void> {
  const target =
    to === 'in_progress'
      ? { from: sql`${cameras.state} <> 'in_repair'`, state: 'in_repair' as const }
      : to === 'cancelled'
        ? { from: sql`${cameras.state} = 'in_repair'`, state: 'failing' as const }
        : null
  if (!target) return
  const result = await tx
    .update(cameras)
    .set({ state: target.state, version: sql`${cameras.version} + 1`, updatedAt: now })
    .where(and(eq(cameras.id, cameraId), target.from))
  const affected = (result as unknown as [{ affectedRows: number }])[0]?.affectedRows
  if (affected) await recordChange(tx, 'camera', cameraId)
}
