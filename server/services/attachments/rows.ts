import { and, eq } from 'drizzle-orm'
import type { Attachment } from '../../../shared/schemas/checks'
import type { DbOrTx } from '../../db/client'
import { attachments, checks } from '../../db/schema'
import { AppError } from '../../errors'
import type { AuthUser } from '../tokens'

export type AttachmentRow = typeof attachments.$inferSelect

export function toAttachment(r: AttachmentRow): Attachment {
  return {
    id: r.id,
    checkId: r.checkId,
    measurementId: r.measurementId,
    kind: r.kind,
    sha256: r.sha256,
    bytes: r.bytes,
    mime: r.mime,
    width: r.width,
    height: r.height,
    deleteAfter: r.deleteAfter ? r.deleteAfter.toISOString() : null,
    createdAt: r.createdAt.toISOString(),
  }
}

/**
 * The check an upload or download is about, when the user may touch its files: supervisors and
 * admins any check, an inspector only their own. 404 when it is not on the server (yet).
 */
export async function checkForFiles(db: DbOrTx, user: AuthUser, checkId: string) {
  const [check] = await db.select().from(checks).where(eq(checks.id, checkId))
  if (!check) {
    throw new AppError(
      'check.not_found',
      'The check is not on the server yet; its files upload after the check itself has synced.',
      404,
    )
  }
  const mayTouch =
    user.role === 'supervisor' || user.role === 'admin' || check.inspectorId === user.id
  if (!mayTouch) {
    throw new AppError(
      'auth.forbidden',
      'Only the check’s inspector or a supervisor may do this.',
      403,
    )
  }
  return check
}

export async function findByHash(db: DbOrTx, checkId: string, sha256: string) {
  const [row] = await db
    .select()
    .from(attachments)
    .where(and(eq(attachments.checkId, checkId), eq(attachments.sha256, sha256)))
  return row
}
