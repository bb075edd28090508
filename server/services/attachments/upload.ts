import { createHash, randomUUID } from 'node:crypto'
import { and, eq } from 'drizzle-orm'
import type {
  AttachmentUploadFields,
  AttachmentUploadResponse,
  Remeasure,
} from '../../../shared/schemas/checks'
import type { Db } from '../../db/client'
import { attachments, measurements } from '../../db/schema'
import { AppError } from '../../errors'
import type { ObjectStorage } from '../../storage'
import { audit } from '../sync/audit'
import { isDuplicateEntry } from '../../db/mysqlErrors'
import type { AuthUser } from '../tokens'
import { decodeImage, inspectImage, UPLOAD_ERRORS } from './image'
import { remeasure } from './remeasure'
import { checkForFiles, findByHash, toAttachment } from './rows'
import type { AttachmentRow } from './rows'

const DAY_MS = 86_400_000

export interface UploadDeps {
  db: Db
  storage: ObjectStorage
  now: () => Date
  frameRetentionDays: number
}

type MeasurementRow = typeof measurements.$inferSelect

function storedRemeasure(rows: MeasurementRow[]): Remeasure[] {
  return rows
    .filter((m) => m.serverMtf50CyPx !== null || m.disagreement)
    .map((m) => ({
      measurementId: m.id,
      deviceMtf50CyPx: m.mtf50CyPx,
      serverMtf50CyPx: m.serverMtf50CyPx,
      relativeDifference:
        m.serverMtf50CyPx !== null && m.mtf50CyPx > 0
          ? Math.abs(m.serverMtf50CyPx - m.mtf50CyPx) / m.mtf50CyPx
          : null,
      disagreement: m.disagreement,
    }))
}

/**
 * POST /api/checks/:id/attachments. Order matters: who may upload → the check's own rules
 * (frames only when shared) → magic bytes and header size (before decoding) → same bytes already
 * stored? → decode → re-measure → write the file → one transaction for the row and the server's
 * measurements. A failing store answers 507/503 and leaves the database untouched.
 */
export async function uploadAttachment(
  deps: UploadDeps,
  user: AuthUser,
  checkId: string,
  fields: AttachmentUploadFields,
  bytes: Uint8Array | undefined,
): Promise<{ status: 200 | 201; body: AttachmentUploadResponse }> {
  const check = await checkForFiles(deps.db, user, checkId)
  if (fields.kind === 'frame' && !check.shareFrame) {
    throw new AppError(
      UPLOAD_ERRORS.frameNotShared,
      'The inspector did not choose to share the full frame of this check, so it is not accepted.',
      422,
    )
  }
  if (!bytes)
    throw new AppError(UPLOAD_ERRORS.noFile, 'Attach the image as the multipart field "file".', 400)
  const inspected = inspectImage(bytes)
  const all = await deps.db.select().from(measurements).where(eq(measurements.checkId, checkId))
  let target: MeasurementRow | undefined
  if (fields.kind === 'roi') {
    target = all.find((m) => m.id === fields.measurementId)
    if (!target) {
      throw new AppError(
        'measurement.not_found',
        'This check has no measurement with that id.',
        404,
      )
    }
    const { width, height } = inspected.header
    if (width !== target.roiW || height !== target.roiH) {
      throw new AppError(
        UPLOAD_ERRORS.roiMismatch,
        `The crop is ${width} × ${height} px but the measured region is ${target.roiW} × ${target.roiH} px.`,
        422,
      )
    }
  }
  const sha256 = createHash('sha256').update(bytes).digest('hex')
  const known = await findByHash(deps.db, checkId, sha256)
  if (known) return duplicateAnswer(deps, known)

  const raw = decodeImage(bytes, inspected)
  const results: Remeasure[] = []
  if (target) {
    results.push(
      remeasure(raw, { x: 0, y: 0, w: raw.width, h: raw.height }, target, fields.encoding),
    )
  } else {
    // A full frame: re-measure the regions no crop has re-measured yet.
    for (const m of all) {
      const inside = m.roiX + m.roiW <= raw.width && m.roiY + m.roiH <= raw.height
      if (!inside || m.serverMtf50CyPx !== null) continue
      results.push(
        remeasure(raw, { x: m.roiX, y: m.roiY, w: m.roiW, h: m.roiH }, m, fields.encoding),
      )
    }
  }

  const key = `checks/${checkId}/${fields.kind}-${sha256}.${inspected.ext}`
  await deps.storage.put(key, bytes, { contentType: inspected.mime })
  const now = deps.now()
  const row: AttachmentRow = {
    id: randomUUID(),
    checkId,
    measurementId: target?.id ?? null,
    kind: fields.kind,
    storageKey: key,
    sha256,
    bytes: bytes.length,
    mime: inspected.mime,
    width: inspected.header.width,
    height: inspected.header.height,
    deleteAfter:
      fields.kind === 'frame' ? new Date(now.getTime() + deps.frameRetentionDays * DAY_MS) : null,
    createdAt: now,
  }
  try {
    await deps.db.transaction(async (tx) => {
      await tx.insert(attachments).values(row)
      for (const r of results) {
        await tx
          .update(measurements)
          .set({ serverMtf50CyPx: r.serverMtf50CyPx, disagreement: r.disagreement })
          .where(and(eq(measurements.id, r.measurementId), eq(measurements.checkId, checkId)))
      }
      const disagreeing = results.filter((r) => r.disagreement)
      if (disagreeing.length) {
        await audit(tx, {
          actorId: user.id,
          action: 'check.disagreement',
          entity: 'check',
          entityId: checkId,
          detail: { attachmentId: row.id, remeasure: disagreeing },
        })
      }
    })
  } catch (err) {
    if (!isDuplicateEntry(err)) throw err
    const raced = await findByHash(deps.db, checkId, sha256)
    if (raced) return duplicateAnswer(deps, raced)
    throw err
  }
  return {
    status: 201,
    body: { attachment: toAttachment(row), duplicate: false, remeasure: results },
  }
}

async function duplicateAnswer(
  deps: UploadDeps,
  row: AttachmentRow,
): Promise<{ status: 200; body: AttachmentUploadResponse }> {
  const cond = row.measurementId
    ? and(eq(measurements.checkId, row.checkId), eq(measurements.id, row.measurementId))
    : eq(measurements.checkId, row.checkId)
  const rows = await deps.db.select().from(measurements).where(cond)
  return {
    status: 200,
    body: { attachment: toAttachment(row), duplicate: true, remeasure: storedRemeasure(rows) },
  }
}
