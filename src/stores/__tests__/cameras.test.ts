import 'fake-indexeddb/auto'
import { createPinia, setActivePinia } from 'pinia'
import { beforeEach, describe, expect, it } from 'vitest'
import type { Camera } from '@shared/schemas/cameras'
import { http } from '@/api/http'
import { loadCatalog, saveCatalog } from '@/db/catalogCache'
import { db, META_KEYS } from '@/db/database'
import { sampleCamera, sampleSite, sampleTask } from '@/db/__tests__/sampleCatalog'
import { SESSION_STORAGE_KEY } from '../auth'
import { useCamerasStore } from '../cameras'
import { MemoryStorage } from './memoryStorage'

const USER = { id: 4, email: 'inspector@sharpfield.test', name: 'Ines', role: 'inspector' }

function json(body: unknown): Response {
  return new Response(JSON.stringify(body), {
    status: 200,
    headers: { 'Content-Type': 'application/json' },
  })
}

/** Serves two sites, the given cameras and one task; counts the requests. */
function serveCatalog(
  cameras = [sampleCamera(1), sampleCamera(2, { siteId: 2, siteName: 'South Yard' })],
) {
  const urls: string[] = []
  http.configure({
    isOnline: () => true,
    fetch: (async (input: RequestInfo | URL) => {
      const url = String(input)
      urls.push(url)
      if (url.startsWith('/api/sites'))
        return json({ items: [sampleSite(1, 'North Depot'), sampleSite(2, 'South Yard')] })
      if (url.startsWith('/api/cameras'))
        return json({ items: cameras, total: cameras.length, limit: 500, offset: 0 })
      if (url.startsWith('/api/tasks')) return json({ items: [sampleTask()] })
      return new Response(null, { status: 404 })
    }) as typeof fetch,
  })
  return urls
}

function signedInAs(userId: number) {
  globalThis.localStorage = new MemoryStorage()
  localStorage.setItem(
    SESSION_STORAGE_KEY,
    JSON.stringify({
      version: 1,
      user: { ...USER, id: userId },
      token: 't',
      refreshToken: 'r',
      savedAt: '2025-01-01T00:00:00Z',
    }),
  )
  setActivePinia(createPinia())
}

beforeEach(async () => {
  await Promise.all([db.sites.clear(), db.cameras.clear(), db.tasks.clear(), db.meta.clear()])
})

describe('cameras store', () => {
  it('loads from the server when online and saves the download on the device', async () => {
    signedInAs(4)
    const urls = serveCatalog()
    const store = useCamerasStore()
    await store.load()
    expect(urls).toEqual([
      '/api/sites',
      '/api/cameras?limit=500&offset=0&sort=assetTag',
      '/api/tasks',
    ])
    expect(store.cameras.map((c) => c.assetTag)).toEqual(['CAM-001', 'CAM-002'])
    expect(store.refreshedAt).not.toBeNull()
    const cached = await loadCatalog(db)
    expect(cached.cameras).toEqual(store.cameras)
    expect(cached.userId).toBe(4)
  })

  it("keeps each camera's baseline MTF50 through a refresh, on screen and on the device", async () => {
    signedInAs(4)
    // What a sync pull left on the device: camera 1 with its baseline's MTF50.
    await saveCatalog(
      db,
      {
        sites: [sampleSite(1, 'North Depot')],
        cameras: [sampleCamera(1, { baselineCheckId: 'b-1', baselineMtf50CyPx: 0.31 })],
        tasks: [],
      },
      4,
    )
    serveCatalog([
      sampleCamera(1, { baselineCheckId: 'b-1', baselineMtf50CyPx: 0.31 }),
      sampleCamera(2),
    ])
    const store = useCamerasStore()
    await store.load()
    expect(store.cameraById.get(1)?.baselineMtf50CyPx).toBe(0.31)
    expect(store.cameraById.get(2)?.baselineMtf50CyPx).toBeNull()
    expect((await db.cameras.get(1))?.baselineMtf50CyPx).toBe(0.31)

    // Next session, offline: the saved copy still has it.
    signedInAs(4)
    http.configure({
      fetch: (async () => {
        throw new TypeError('Failed to fetch')
      }) as typeof fetch,
    })
    const later = useCamerasStore()
    await later.load()
    expect(later.cameraById.get(1)?.baselineMtf50CyPx).toBe(0.31)
  })

  it('reads a camera saved before records carried the baseline MTF50 as unknown, not dropped', async () => {
    signedInAs(4)
    const { baselineMtf50CyPx: _dropped, ...older } = sampleCamera(3, { baselineCheckId: 'b-3' })
    await db.cameras.put(older as Camera)
    await db.meta.put({ key: META_KEYS.catalogUserId, value: '4' })
    http.configure({
      fetch: (async () => {
        throw new TypeError('Failed to fetch')
      }) as typeof fetch,
    })
    const store = useCamerasStore()
    await store.load()
    expect(store.cameras.map((c) => [c.id, c.baselineMtf50CyPx])).toEqual([[3, null]])
  })

  it('when the server cannot be reached it shows the saved copy, with no error', async () => {
    signedInAs(4)
    await saveCatalog(
      db,
      { sites: [sampleSite(1, 'North Depot')], cameras: [sampleCamera(7)], tasks: [] },
      4,
    )
    http.configure({
      fetch: (async () => {
        throw new TypeError('Failed to fetch')
      }) as typeof fetch,
    })
    const store = useCamerasStore()
    await store.load()
    expect(store.cameras.map((c) => c.id)).toEqual([7])
    expect(store.error).toBeNull()
    expect(store.loaded).toBe(true)
  })

  it("never shows another user's saved copy", async () => {
    await saveCatalog(db, { sites: [], cameras: [sampleCamera(9)], tasks: [] }, 99)
    signedInAs(4)
    http.configure({
      fetch: (async () => {
        throw new TypeError('Failed to fetch')
      }) as typeof fetch,
    })
    const store = useCamerasStore()
    await store.load()
    expect(store.cameras).toEqual([])
    expect((await loadCatalog(db)).cameras).toEqual([])
  })
})
