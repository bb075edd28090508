import 'fake-indexeddb/auto'
import { createPinia, setActivePinia } from 'pinia'
import { beforeEach, describe, expect, it } from 'vitest'
import type { WorkOrderDetail } from '@shared/schemas/workOrders'
import { http } from '@/api/http'
import { db } from '@/db/database'
import { listOutbox } from '@/db/outbox'
import { SESSION_STORAGE_KEY, useAuthStore } from '../auth'
import { WORK_ORDER_CACHE_KEY, useWorkOrdersStore } from '../workOrders'
import { MemoryStorage } from './memoryStorage'

const USER = { id: 7, email: 'maintenance@sharpfield.test', name: 'Piet Alvarez', role: 'maintenance' as const }

function order(over: Partial<WorkOrderDetail> = {}): WorkOrderDetail {
  return {
    id: 3,
    cameraId: 9,
    assetTag: 'QG-3',
    siteId: 1,
    siteName: 'Quarry Gate',
    locationText: 'Pole 3',
    title: 'Soft image on QG-3',
    description: null,
    priority: 'high',
    status: 'assigned',
    assigneeId: 7,
    assigneeName: 'Piet Alvarez',
    dueAt: '2031-06-12T10:00:00.000Z',
    overdue: false,
    openedByCheckId: null,
    closedByCheckId: null,
    closedAt: null,
    createdAt: '2031-06-09T10:00:00.000Z',
    updatedAt: '2031-06-09T10:00:00.000Z',
    version: 2,
    taskName: 'Identify',
    history: [],
    photos: [],
    ...over,
  }
}

function json(status: number, body: unknown): Response {
  return new Response(JSON.stringify(body), { status, headers: { 'Content-Type': 'application/json' } })
}

function serve(handler: (url: string, body: unknown) => Response | Promise<Response>, online = () => true) {
  const seen: { url: string; body: unknown }[] = []
  http.configure({
    isOnline: online,
    fetch: (async (input: RequestInfo | URL, init?: RequestInit) => {
      const body = init?.body ? JSON.parse(String(init.body)) : undefined
      seen.push({ url: String(input), body })
      return handler(String(input), body)
    }) as typeof fetch,
  })
  return seen
}

beforeEach(() => {
  globalThis.localStorage = new MemoryStorage()
  globalThis.localStorage.setItem(
    SESSION_STORAGE_KEY,
    JSON.stringify({ version: 1, user: USER, token: 't', refreshToken: 'r', savedAt: new Date().toISOString() }),
  )
  setActivePinia(createPinia())
  useAuthStore()
})

describe('work orders store', () => {
  it('sends an action with the version it holds and keeps the answer', async () => {
    const seen = serve((url) =>
      url.endsWith('/actions') ? json(200, order({ status: 'in_progress', version: 3 })) : json(200, order()),
    )
    const store = useWorkOrdersStore()
    await store.loadOne(3)
    expect(await store.act(3, { action: 'start' })).toBe('done')
    expect(seen[1]).toEqual({ url: '/api/work-orders/3/actions', body: { action: 'start', version: 2 } })
    expect(store.details[3]).toMatchObject({ status: 'in_progress', version: 3 })
  })

  it('on a 409 shows the order as the server has it now, with the reason', async () => {
    const current = order({ status: 'assigned', assigneeId: 8, assigneeName: 'Mina Sorensen', version: 4 })
    serve((url) =>
      url.endsWith('/actions')
        ? json(409, { error: { code: 'work_order.stale', message: 'Someone changed work order #3.', details: { current } } })
        : json(200, order()),
    )
    const store = useWorkOrdersStore()
    await store.loadOne(3)
    expect(await store.act(3, { action: 'start' })).toBe('stale')
    expect(store.details[3]).toMatchObject({ assigneeName: 'Mina Sorensen', version: 4 })
    expect(store.error).toEqual({ code: 'work_order.stale', message: 'Someone changed work order #3.' })
  })

  it('offline it shows the orders saved on this device, and only the same user’s', async () => {
    serve(() => json(200, { items: [order()], total: 1, limit: 500, offset: 0 }))
    await useWorkOrdersStore().load()
    expect(JSON.parse(localStorage.getItem(WORK_ORDER_CACHE_KEY)!).items).toHaveLength(1)

    setActivePinia(createPinia())
    useAuthStore()
    serve(() => Promise.reject(new TypeError('Failed to fetch')), () => false)
    const store = useWorkOrdersStore()
    await store.load()
    expect(store.items.map((o) => o.id)).toEqual([3])
    expect(store.fromCache).toBe(true)
    expect(store.error).toBeNull()
  })

  it('with no connection it queues the action for sync and shows it at once', async () => {
    let reachable = true
    serve(
      (url) => {
        if (!reachable) throw new TypeError('Failed to fetch')
        return url.includes('/work-orders/3') ? json(200, order()) : json(404, {})
      },
      () => reachable,
    )
    const store = useWorkOrdersStore()
    await store.loadOne(3)
    reachable = false
    expect(await store.act(3, { action: 'request_recheck', note: 'Done at 14:00.' })).toBe('queued')
    const queued = (await listOutbox(db, USER.id)).filter((o) => o.kind === 'workOrder.action')
    expect(queued.map((o) => o.payload)).toEqual([
      { action: 'request_recheck', note: 'Done at 14:00.', version: 2, workOrderId: 3 },
    ])
    expect(store.queued).toBe(1)
    expect(store.details[3]).toMatchObject({ status: 'awaiting_recheck', version: 3 })
    expect(store.details[3].history.at(-1)).toMatchObject({ note: 'Done at 14:00.', actorName: 'Piet Alvarez (waiting to sync)' })
  })
})
