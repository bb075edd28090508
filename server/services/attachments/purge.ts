import { and, asc, eq, isNotNull, lt } from 'drizzle-orm'
import type { Db } from '../../db/client'
import { attachments } from '../../db/schema'
import type { ObjectStorage } from '../../storage'
import { audit } from '../sync/audit'

/**
 * Retention: deletes attachments whose `deleteAfter` has passed (full frames, FRAME_RETENTION_DAYS
 * after upload) — the file first, then the row, so a failure leaves the row to retry next time.
 * Returns how many were deleted.
 */
export async function purgeExpiredAttachments(
  db: Db,
  storage: ObjectStorage,
  now: Date,
  batch = 200,
): Promise<number> {
  const due = await db
    .select({ id: attachments.id, key: attachments.storageKey, checkId: attachments.checkId })
    .from(attachments)
    .where(and(isNotNull(attachments.deleteAfter), lt(attachments.deleteAfter, now)))
    .orderBy(asc(attachments.deleteAfter))
    .limit(batch)
  for (const a of due) {
    await storage.delete(a.key)
    await db.transaction(async (tx) => {
      await tx.delete(attachments).where(eq(attachments.id, a.id))
      await audit(tx, {
        actorId: null,
        action: 'attachment.expired',
        entity: 'check',
        entityId: a.checkId,
        detail: { attachmentId: a.id },
      })
    })
  }
  return due.length
}
