// Files that upload after their check is accepted: each measured region's crop, and the full
// frame only when the inspector chose to share it. The bytes stay where the check flow saved
// them (crops, frames); this queue only remembers what is left to send and how it went.
import { backoffMs } from './backoff'
import type { SharpfieldDb } from './database'
import type { UploadRecord } from './syncTables'

export type { UploadRecord } from './syncTables'

/** Queues the crops (and the shared frame) of an accepted check; queuing twice keeps one record. */
export async function queueUploadsForCheck(
  db: SharpfieldDb,
  checkId: string,
  userId: number,
  now = new Date(),
): Promise<number> {
  const [crops, frame] = await Promise.all([
    db.crops.where('checkId').equals(checkId).toArray(),
    db.frames.get(checkId),
  ])
  const base = {
    userId,
    checkId,
    status: 'pending' as const,
    attempts: 0,
    nextAttemptAt: 0,
    lastError: null,
    createdAt: now.toISOString(),
  }
  const records: UploadRecord[] = crops.map((c) => ({
    ...base,
    id: `${checkId}/roi/${c.id}`,
    kind: 'roi',
    measurementId: c.id,
    source: 'crop',
    sourceId: c.id,
    encoding: c.encoding,
  }))
  if (frame?.share) {
    records.push({
      ...base,
      id: `${checkId}/frame/${checkId}`,
      kind: 'frame',
      measurementId: null,
      source: 'frame',
      sourceId: checkId,
      encoding: 'srgb',
    })
  }
  const known = new Set((await db.uploads.bulkGet(records.map((r) => r.id))).map((r) => r?.id))
  const fresh = records.filter((r) => !known.has(r.id))
  if (fresh.length) await db.uploads.bulkAdd(fresh)
  return fresh.length
}

/** Uploads to try now, oldest first; `force` ignores back-off. */
export async function dueUploads(
  db: SharpfieldDb,
  userId: number,
  nowMs: number,
  options: { limit?: number; force?: boolean } = {},
): Promise<UploadRecord[]> {
  const { limit = 20, force = false } = options
  const pending = await db.uploads
    .where('[userId+status]')
    .equals([userId, 'pending'])
    .sortBy('createdAt')
  return pending.filter((u) => force || u.nextAttemptAt <= nowMs).slice(0, limit)
}

/** The bytes of a queued upload, or null when they are no longer on the device. */
export async function uploadBlob(
  db: SharpfieldDb,
  u: UploadRecord,
): Promise<{ blob: Blob; name: string } | null> {
  if (u.source === 'crop') {
    const crop = await db.crops.get(u.sourceId)
    return crop ? { blob: crop.blob, name: `${u.sourceId}.png` } : null
  }
  const frame = await db.frames.get(u.sourceId)
  if (!frame) return null
  return { blob: frame.blob, name: frame.mime === 'image/jpeg' ? 'frame.jpg' : 'frame.png' }
}

export async function uploadDone(db: SharpfieldDb, id: string): Promise<void> {
  await db.uploads.delete(id)
}

/** A failed upload: retried with back-off, or kept as rejected (with the reason) when final. */
export async function uploadFailed(
  db: SharpfieldDb,
  u: UploadRecord,
  error: string,
  options: { final: boolean; nowMs: number; random?: () => number },
): Promise<void> {
  const attempts = u.attempts + 1
  await db.uploads.update(
    u.id,
    options.final
      ? { status: 'rejected', attempts, lastError: error }
      : {
          status: 'pending',
          attempts,
          lastError: error,
          nextAttemptAt: options.nowMs + backoffMs(attempts, (options.random ?? Math.random)()),
        },
  )
}

export async function retryRejectedUploads(db: SharpfieldDb, userId: number): Promise<number> {
  return db.uploads
    .where('[userId+status]')
    .equals([userId, 'rejected'])
    .modify({ status: 'pending', nextAttemptAt: 0 })
}
