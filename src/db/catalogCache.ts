// Read and write the cached catalogue (sites, cameras, tasks) as one consistent snapshot.
// Records are checked against the API schemas on the way out, so a record written by an older
// app version that no longer fits is dropped (and counted) instead of breaking a screen.
import { cameraSchema, type Camera } from '@shared/schemas/cameras'
import { taskSchema, type Task } from '@shared/schemas/catalog'
import { siteSchema, type Site } from '@shared/schemas/sites'
import type { ZodType } from 'zod'
import { META_KEYS, type SharpfieldDb } from './database'

export interface Catalog {
  sites: Site[]
  cameras: Camera[]
  tasks: Task[]
}

export interface CachedCatalog extends Catalog {
  /** When the snapshot was downloaded; null when nothing was ever saved. */
  refreshedAt: string | null
  /** Which user downloaded it. */
  userId: number | null
  /** Records that no longer match the current schema and were skipped. */
  skipped: number
}

/**
 * A saved camera. Copies saved before records carried the baseline's MTF50 read it as unknown
 * (null) instead of being dropped, so an update never empties an offline device's list.
 */
const savedCameraSchema = cameraSchema.extend({
  baselineMtf50CyPx: cameraSchema.shape.baselineMtf50CyPx.default(null),
})

function keepValid<T>(rows: unknown[], schema: ZodType<T>): { valid: T[]; skipped: number } {
  const valid: T[] = []
  for (const row of rows) {
    const parsed = schema.safeParse(row)
    if (parsed.success) valid.push(parsed.data)
  }
  return { valid, skipped: rows.length - valid.length }
}

/** Replaces the whole snapshot in one transaction: readers never see half of it. */
export async function saveCatalog(
  db: SharpfieldDb,
  catalog: Catalog,
  userId: number,
  at = new Date(),
): Promise<void> {
  await db.transaction('rw', [db.sites, db.cameras, db.tasks, db.meta], async () => {
    await Promise.all([db.sites.clear(), db.cameras.clear(), db.tasks.clear()])
    await db.sites.bulkPut(catalog.sites)
    await db.cameras.bulkPut(catalog.cameras)
    await db.tasks.bulkPut(catalog.tasks)
    await db.meta.bulkPut([
      { key: META_KEYS.catalogRefreshedAt, value: at.toISOString() },
      { key: META_KEYS.catalogUserId, value: String(userId) },
    ])
  })
}

export async function loadCatalog(db: SharpfieldDb): Promise<CachedCatalog> {
  return db.transaction('r', [db.sites, db.cameras, db.tasks, db.meta], async () => {
    const [sites, cameras, tasks, refreshed, user] = await Promise.all([
      db.sites.orderBy('name').toArray(),
      db.cameras.orderBy('assetTag').toArray(),
      db.tasks.toArray(),
      db.meta.get(META_KEYS.catalogRefreshedAt),
      db.meta.get(META_KEYS.catalogUserId),
    ])
    const s = keepValid(sites, siteSchema)
    const c = keepValid(cameras, savedCameraSchema)
    const t = keepValid(tasks, taskSchema)
    return {
      sites: s.valid,
      cameras: c.valid,
      tasks: t.valid,
      refreshedAt: refreshed?.value ?? null,
      userId: user ? Number(user.value) : null,
      skipped: s.skipped + c.skipped + t.skipped,
    }
  })
}

export async function loadCachedCamera(db: SharpfieldDb, id: number): Promise<Camera | null> {
  const row = await db.cameras.get(id)
  const parsed = savedCameraSchema.safeParse(row)
  return parsed.success ? parsed.data : null
}

export async function clearCatalog(db: SharpfieldDb): Promise<void> {
  await db.transaction('rw', [db.sites, db.cameras, db.tasks, db.meta], async () => {
    await Promise.all([db.sites.clear(), db.cameras.clear(), db.tasks.clear()])
    await db.meta.bulkDelete([META_KEYS.catalogRefreshedAt, META_KEYS.catalogUserId])
  })
}
