import 'fake-indexeddb/auto'
import { createPinia, setActivePinia } from 'pinia'
import { afterEach, beforeEach, describe, expect, it } from 'vitest'
import { http } from '@/api/http'
import { db } from '@/db/database'
import { enqueue } from '@/db/outbox'
import { SESSION_STORAGE_KEY } from '../auth'
import { useSyncStore } from '../sync'
import { MemoryStorage } from './memoryStorage'

const USER = {
  id: 4,
  email: 'inspector@sharpfield.test',
  name: 'Ines Pector',
  role: 'inspector' as const,
}

function json(status: number, body: unknown): Response {
  return new Response(JSON.stringify(body), {
    status,
    headers: { 'Content-Type': 'application/json' },
  })
}

const emptyPull = (cursor: number) => ({
  cursor,
  hasMore: false,
  full: cursor === 0,
  serverTime: new Date().toISOString(),
  sites: [],
  cameras: [],
  tasks: [],
  cameraModels: [],
  rounds: [],
  workOrders: [],
  removed: { sites: [], cameras: [], tasks: [], cameraModels: [], rounds: [], workOrders: [] },
})

/** A scripted server on the app's http instance; `reject` lists op ids to refuse. */
function serve(reject: Set<string> = new Set()) {
  const pushed: string[][] = []
  http.configure({
    isOnline: () => true,
    fetch: (async (input: RequestInfo | URL, init?: RequestInit) => {
      const url = String(input)
      if (url.startsWith('/api/sync/push')) {
        const body = JSON.parse(String(init?.body)) as { ops: { id: string }[] }
        pushed.push(body.ops.map((o) => o.id))
        return json(200, {
          serverTime: new Date().toISOString(),
          results: body.ops.map((o) =>
            reject.has(o.id)
              ? {
                  id: o.id,
                  status: 'rejected',
                  code: 'camera.not_found',
                  reason: 'There is no camera with id 1 on the server.',
                }
              : { id: o.id, status: 'applied' },
          ),
        })
      }
      if (url.startsWith('/api/sync/pull')) return json(200, emptyPull(5))
      return json(404, { error: { code: 'request.not_found', message: 'no' } })
    }) as typeof fetch,
  })
  return pushed
}

async function until(cond: () => boolean): Promise<void> {
  for (let i = 0; i < 200 && !cond(); i++) await new Promise((r) => setTimeout(r, 10))
  expect(cond()).toBe(true)
}

beforeEach(async () => {
  globalThis.localStorage = new MemoryStorage()
  globalThis.localStorage.setItem(
    SESSION_STORAGE_KEY,
    JSON.stringify({
      version: 1,
      user: USER,
      token: 't',
      refreshToken: 'r',
      savedAt: new Date().toISOString(),
    }),
  )
  await db.delete()
  await db.open()
  setActivePinia(createPinia())
})
afterEach(() => useSyncStore().stop())

describe('sync store', () => {
  it('counts what a save queued, sends it with syncNow, and records the time', async () => {
    const pushed = serve()
    const sync = useSyncStore()
    sync.start()
    const op = await enqueue('check.create', { id: crypto.randomUUID(), cameraId: 1 })
    expect(op.userId).toBe(USER.id)
    await until(() => sync.pendingCount === 1)
    await sync.syncNow()
    await until(() => sync.pendingCount === 0)
    expect(pushed.flat()).toContain(op.id)
    expect(sync.lastSyncAt).not.toBeNull()
    expect(sync.error).toBeNull()
  })

  it('lists a refused operation with the server’s reason and sends it again on request', async () => {
    const refuse = new Set<string>()
    const pushed = serve(refuse)
    const sync = useSyncStore()
    sync.start()
    const op = await enqueue('check.create', { id: crypto.randomUUID(), cameraId: 1 })
    refuse.add(op.id)
    await sync.syncNow()
    await until(() => sync.rejected.length === 1)
    expect(sync.rejected[0].lastError).toBe('There is no camera with id 1 on the server.')
    expect(sync.pendingCount).toBe(0)
    refuse.clear()
    await sync.retry(op.id)
    await until(() => sync.rejected.length === 0 && sync.pendingCount === 0)
    expect(pushed.flat().filter((id) => id === op.id)).toHaveLength(2)
  })
})
