import type { DbOrTx } from '../../db/client'
import { auditLog } from '../../db/schema'

export interface AuditEntry {
  actorId: number | null
  action: string
  entity: string
  entityId?: string | number | null
  detail?: Record<string, unknown>
}

/** Appends one row to the audit log (in the caller's transaction when given one). */
export async function audit(tx: DbOrTx, entry: AuditEntry): Promise<void> {
  await tx.insert(auditLog).values({
    actorId: entry.actorId,
    action: entry.action,
    entity: entry.entity,
    entityId:
      entry.entityId === undefined || entry.entityId === null ? null : String(entry.entityId),
    detail: entry.detail ?? null,
  })
}
