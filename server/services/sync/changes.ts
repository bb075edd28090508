import type { ChangeAction } from '../../../shared/schemas/enums'
import type { DbOrTx } from '../../db/client'
import { changes } from '../../db/schema'

/** Entity names in the `changes` feed that devices pull (see pull/sources.ts). */
export const SYNC_ENTITIES = {
  site: 'site',
  camera: 'camera',
  task: 'task',
  cameraModel: 'camera_model',
  round: 'round',
  workOrder: 'work_order',
} as const
export type SyncEntity = (typeof SYNC_ENTITIES)[keyof typeof SYNC_ENTITIES]

/**
 * Appends rows to the change feed for entities written in this transaction. Call it as the last
 * write before the transaction commits: `seq` is taken at insert time, and pull leaves out rows
 * younger than SYNC_SETTLE_MS, so keeping the insert close to the commit keeps the cursor safe.
 */
export async function recordChanges(
  tx: DbOrTx,
  entity: SyncEntity,
  ids: readonly (string | number)[],
  action: ChangeAction = 'upsert',
): Promise<void> {
  const unique = [...new Set(ids.map(String))]
  if (unique.length === 0) return
  await tx.insert(changes).values(unique.map((entityId) => ({ entity, entityId, action })))
}
