// Camera inventory import: preview (every row checked, nothing written) and commit (checked
// again inside one transaction; any wrong row and nothing is imported).
import { createHash } from 'node:crypto'
import { inArray } from 'drizzle-orm'
import { CSV_IMPORT_ERRORS } from '../../../shared/schemas/csv'
import type { CsvCommit, CsvPreview } from '../../../shared/schemas/csv'
import type { Db } from '../../db/client'
import { cameras } from '../../db/schema'
import { AppError } from '../../errors'
import { audit } from '../sync/audit'
import { recordChanges, SYNC_ENTITIES } from '../sync/changes'
import { isDuplicateEntry } from '../../db/mysqlErrors'
import type { AuthUser } from '../tokens'
import { ASSET_TAG_KEY } from './cameras'
import { parseCameraCsv } from './csvParse'
import { loadLookups, toPreview, validateRows } from './csvValidate'

const BATCH = 500

export interface UploadedCsv {
  bytes: Uint8Array
  fileName: string
}

function assetTagsOf(parsed: ReturnType<typeof parseCameraCsv>): string[] {
  const at = parsed.columns.indexOf('asset_tag')
  return parsed.rows.map((r) => (r.cells[at] ?? '').trim())
}

export function createCameraImport(db: Db) {
  return {
    async preview(file: UploadedCsv): Promise<CsvPreview> {
      const parsed = parseCameraCsv(file.bytes)
      const lookups = await loadLookups(db, assetTagsOf(parsed))
      return toPreview(parsed.columns, validateRows(parsed, lookups))
    },

    async commit(actor: AuthUser, file: UploadedCsv): Promise<CsvCommit> {
      const parsed = parseCameraCsv(file.bytes)
      try {
        return await db.transaction(async (tx) => {
          const lookups = await loadLookups(tx, assetTagsOf(parsed))
          const rows = validateRows(parsed, lookups)
          const preview = toPreview(parsed.columns, rows)
          if (!preview.valid)
            throw new AppError(
              CSV_IMPORT_ERRORS.invalidRows,
              `${preview.errorRowCount} of ${preview.rowCount} rows have errors; nothing was imported. Fix them and try again.`,
              422,
              preview,
            )
          const inputs = rows.map((r) => r.input!)
          for (let i = 0; i < inputs.length; i += BATCH) {
            await tx
              .insert(cameras)
              .values(inputs.slice(i, i + BATCH).map((c) => ({ ...c, state: 'due' as const })))
          }
          const tags = inputs.map((c) => c.assetTag)
          const ids: number[] = []
          for (let i = 0; i < tags.length; i += 1000) {
            const found = await tx
              .select({ id: cameras.id })
              .from(cameras)
              .where(inArray(cameras.assetTag, tags.slice(i, i + 1000)))
            ids.push(...found.map((f) => f.id))
          }
          ids.sort((a, b) => a - b)
          await audit(tx, {
            actorId: actor.id,
            action: 'camera.import',
            entity: 'camera',
            entityId: null,
            detail: {
              fileName: file.fileName,
              sha256: createHash('sha256').update(file.bytes).digest('hex'),
              imported: ids.length,
              cameraIds: ids.length <= 1000 ? ids : { first: ids[0], last: ids[ids.length - 1] },
              assetTags: tags.slice(0, 100),
            },
          })
          await recordChanges(tx, SYNC_ENTITIES.camera, ids)
          return { imported: ids.length, cameraIds: ids }
        })
      } catch (err) {
        // Someone added one of these asset tags between the check and the insert.
        if (isDuplicateEntry(err, ASSET_TAG_KEY))
          throw new AppError(
            CSV_IMPORT_ERRORS.invalidRows,
            'A camera with one of these asset tags was added meanwhile; nothing was imported. Preview the file again.',
            409,
          )
        throw err
      }
    },
  }
}
