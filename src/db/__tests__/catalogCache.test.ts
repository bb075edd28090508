import 'fake-indexeddb/auto'
import { afterEach, describe, expect, it } from 'vitest'
import { clearCatalog, loadCachedCamera, loadCatalog, saveCatalog } from '../catalogCache'
import { SharpfieldDb } from '../database'
import { sampleCamera, sampleSite, sampleTask } from './sampleCatalog'

let n = 0
const opened: SharpfieldDb[] = []
function freshDb(): SharpfieldDb {
  const db = new SharpfieldDb(`catalog-test-${++n}`)
  opened.push(db)
  return db
}

afterEach(async () => {
  for (const db of opened.splice(0)) await db.delete()
})

describe('catalogue cache in IndexedDB', () => {
  it('reads back what was saved, sites by name and cameras by asset tag, with time and user', async () => {
    const db = freshDb()
    const at = new Date('2025-05-02T10:00:00.000Z')
    await saveCatalog(
      db,
      {
        sites: [sampleSite(2, 'South Yard'), sampleSite(1, 'North Depot')],
        cameras: [
          sampleCamera(3),
          sampleCamera(1),
          sampleCamera(2, { state: 'failing', siteId: 2 }),
        ],
        tasks: [sampleTask()],
      },
      7,
      at,
    )
    const cached = await loadCatalog(db)
    expect(cached.sites.map((s) => s.name)).toEqual(['North Depot', 'South Yard'])
    expect(cached.cameras.map((c) => c.assetTag)).toEqual(['CAM-001', 'CAM-002', 'CAM-003'])
    expect(cached.cameras[1]).toEqual(sampleCamera(2, { state: 'failing', siteId: 2 }))
    expect(cached.tasks).toEqual([sampleTask()])
    expect(cached.refreshedAt).toBe(at.toISOString())
    expect(cached.userId).toBe(7)
    expect(cached.skipped).toBe(0)
  })

  it('an empty device reports no data and no refresh time', async () => {
    const cached = await loadCatalog(freshDb())
    expect(cached).toEqual({
      sites: [],
      cameras: [],
      tasks: [],
      refreshedAt: null,
      userId: null,
      skipped: 0,
    })
  })

  it('saving again replaces the whole snapshot: removed cameras disappear', async () => {
    const db = freshDb()
    await saveCatalog(
      db,
      { sites: [sampleSite(1, 'A')], cameras: [sampleCamera(1), sampleCamera(2)], tasks: [] },
      1,
    )
    await saveCatalog(
      db,
      { sites: [sampleSite(1, 'A')], cameras: [sampleCamera(2, { state: 'due' })], tasks: [] },
      1,
    )
    const cached = await loadCatalog(db)
    expect(cached.cameras).toEqual([sampleCamera(2, { state: 'due' })])
  })

  it('skips and counts records that no longer match the schema (written by an older version)', async () => {
    const db = freshDb()
    await saveCatalog(db, { sites: [], cameras: [sampleCamera(1)], tasks: [] }, 1)
    // An old record without the fields the current app needs.
    await db.cameras.put({ id: 9, assetTag: 'OLD-9' } as never)
    const cached = await loadCatalog(db)
    expect(cached.cameras.map((c) => c.id)).toEqual([1])
    expect(cached.skipped).toBe(1)
    expect(await loadCachedCamera(db, 9)).toBeNull()
    expect(await loadCachedCamera(db, 1)).toEqual(sampleCamera(1))
  })

  it('clearing removes cameras, sites, tasks and the refresh time', async () => {
    const db = freshDb()
    await saveCatalog(
      db,
      { sites: [sampleSite(1, 'A')], cameras: [sampleCamera(1)], tasks: [sampleTask()] },
      1,
    )
    await clearCatalog(db)
    expect(await loadCatalog(db)).toEqual({
      sites: [],
      cameras: [],
      tasks: [],
      refreshedAt: null,
      userId: null,
      skipped: 0,
    })
  })
})
