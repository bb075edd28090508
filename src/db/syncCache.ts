// Applies what GET /api/sync/pull returns to the device's copy (sites, cameras, tasks, camera
// models, rounds, work orders) and keeps the cursor, per user. A full download replaces the
// copy; an incremental one updates and removes records. One transaction per page.
import type { PullResponse } from '@shared/schemas/sync'
import { META_KEYS, type SharpfieldDb } from './database'

export const SYNC_META_KEYS = {
  /** `{ userId, cursor }` of the last applied pull. */
  cursor: 'syncCursor',
  /** This device's id for pushes (random, made once). */
  deviceId: 'syncDeviceId',
  /** ISO time of the last sync that reached the server. */
  lastSyncAt: 'syncLastAt',
} as const

function cacheTables(db: SharpfieldDb) {
  return [db.sites, db.cameras, db.tasks, db.cameraModels, db.rounds, db.workOrders, db.meta]
}

/**
 * The cursor to pull from: 0 (a full download) unless the device holds this user's data —
 * signing out clears the copy (and its user id), so the next user starts from scratch.
 */
export async function readCursor(db: SharpfieldDb, userId: number): Promise<number> {
  const [cursor, owner] = await db.meta.bulkGet([SYNC_META_KEYS.cursor, META_KEYS.catalogUserId])
  if (!cursor || !owner || Number(owner.value) !== userId) return 0
  try {
    const parsed = JSON.parse(cursor.value) as { userId?: unknown; cursor?: unknown }
    return parsed.userId === userId && typeof parsed.cursor === 'number' ? parsed.cursor : 0
  } catch {
    return 0
  }
}

export async function applyPull(
  db: SharpfieldDb,
  page: PullResponse,
  userId: number,
  now = new Date(),
): Promise<void> {
  await db.transaction('rw', cacheTables(db), async () => {
    if (page.full) {
      await Promise.all([
        db.sites.clear(),
        db.cameras.clear(),
        db.tasks.clear(),
        db.cameraModels.clear(),
        db.rounds.clear(),
        db.workOrders.clear(),
      ])
    } else {
      const r = page.removed
      await Promise.all([
        db.sites.bulkDelete(r.sites),
        db.cameras.bulkDelete(r.cameras),
        db.tasks.bulkDelete(r.tasks),
        db.cameraModels.bulkDelete(r.cameraModels),
        db.rounds.bulkDelete(r.rounds),
        db.workOrders.bulkDelete(r.workOrders),
      ])
    }
    await db.sites.bulkPut(page.sites)
    await db.cameras.bulkPut(page.cameras)
    await db.tasks.bulkPut(page.tasks)
    await db.cameraModels.bulkPut(page.cameraModels)
    await db.rounds.bulkPut(page.rounds)
    await db.workOrders.bulkPut(page.workOrders)
    await db.meta.bulkPut([
      { key: SYNC_META_KEYS.cursor, value: JSON.stringify({ userId, cursor: page.cursor }) },
      { key: META_KEYS.catalogUserId, value: String(userId) },
      { key: META_KEYS.catalogRefreshedAt, value: now.toISOString() },
    ])
  })
}

/** This device's id (made once, kept in the database). */
export async function deviceId(db: SharpfieldDb): Promise<string> {
  const known = await db.meta.get(SYNC_META_KEYS.deviceId)
  if (known) return known.value
  const id = `web-${crypto.randomUUID()}`
  await db.meta.put({ key: SYNC_META_KEYS.deviceId, value: id })
  return id
}
