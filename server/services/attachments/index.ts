import { asc, eq } from 'drizzle-orm'
import type { Attachment, AttachmentUploadFields } from '../../../shared/schemas/checks'
import type { Db } from '../../db/client'
import { attachments } from '../../db/schema'
import { AppError } from '../../errors'
import type { ObjectStorage } from '../../storage'
import type { AuthUser } from '../tokens'
import { purgeExpiredAttachments } from './purge'
import { checkForFiles, toAttachment } from './rows'
import { uploadAttachment } from './upload'

export interface AttachmentServiceDeps {
  db: Db
  storage: ObjectStorage
  now: () => Date
  frameRetentionDays: number
  /** Largest file accepted, bytes (UPLOAD_MAX_MB). */
  maxBytes: number
}

/** Region crops and (shared) frames of checks: upload with re-measurement, list, download, retention. */
export function createAttachmentService(deps: AttachmentServiceDeps) {
  return {
    maxBytes: deps.maxBytes,

    upload(
      user: AuthUser,
      checkId: string,
      fields: AttachmentUploadFields,
      bytes: Uint8Array | undefined,
    ) {
      return uploadAttachment(deps, user, checkId, fields, bytes)
    },

    async list(user: AuthUser, checkId: string): Promise<Attachment[]> {
      await checkForFiles(deps.db, user, checkId)
      const rows = await deps.db
        .select()
        .from(attachments)
        .where(eq(attachments.checkId, checkId))
        .orderBy(asc(attachments.createdAt), asc(attachments.id))
      return rows.map(toAttachment)
    },

    async content(user: AuthUser, id: string): Promise<{ mime: string; bytes: Uint8Array }> {
      const [row] = await deps.db.select().from(attachments).where(eq(attachments.id, id))
      if (!row) throw new AppError('attachment.not_found', 'There is no such attachment.', 404)
      await checkForFiles(deps.db, user, row.checkId)
      const bytes = await deps.storage.get(row.storageKey)
      if (!bytes) {
        throw new AppError(
          'attachment.missing',
          'The file of this attachment is missing from the store.',
          410,
        )
      }
      return { mime: row.mime, bytes }
    },

    purgeExpired(now = deps.now()): Promise<number> {
      return purgeExpiredAttachments(deps.db, deps.storage, now)
    },
  }
}

export type AttachmentService = ReturnType<typeof createAttachmentService>
