import 'fake-indexeddb/auto'
import { createPinia, setActivePinia } from 'pinia'
import { beforeEach, describe, expect, it } from 'vitest'
import type { CameraChecks } from '@shared/schemas/cameraChecks'
import { http } from '@/api/http'
import type { CheckRecord } from '@/db/checks'
import { db } from '@/db/database'
import { sampleCamera } from '@/db/__tests__/sampleCatalog'
import { SESSION_STORAGE_KEY } from '../auth'
import { mergeHistory, useChecksStore } from '../checks'
import { MemoryStorage } from './memoryStorage'

const IDS = [
  '11111111-1111-4111-8111-111111111111',
  '22222222-2222-4222-8222-222222222222',
  '33333333-3333-4333-8333-333333333333',
]

function serverHistory(cameraId = 1, baselineId: string | null = IDS[0]): CameraChecks {
  return {
    cameraId,
    baseline: baselineId ? { checkId: baselineId, mtf50CyPx: 0.31 } : null,
    checks: [
      {
        id: IDS[1],
        capturedAt: '2025-04-01T09:00:00.000Z',
        mode: 'night',
        verdict: 'marginal',
        medianMtf50CyPx: 0.2,
        pixelDensityPxPerM: 140,
        baselineRatio: 0.65,
        isBaseline: false,
        inspectorName: 'Ines',
      },
      {
        id: IDS[0],
        capturedAt: '2025-01-10T09:00:00.000Z',
        mode: 'day',
        verdict: 'pass',
        medianMtf50CyPx: 0.31,
        pixelDensityPxPerM: 140,
        baselineRatio: null,
        isBaseline: true,
        inspectorName: 'Ines',
      },
    ],
    truncated: false,
  }
}

function localCheck(id: string, overrides: Partial<CheckRecord> = {}): CheckRecord {
  return {
    id,
    cameraId: 1,
    userId: 4,
    roundId: null,
    capturedAt: '2025-05-02T10:00:00.000Z',
    savedAt: '2025-05-02T10:01:00.000Z',
    mode: 'day',
    verdict: 'fail',
    reasons: [],
    thresholds: {} as CheckRecord['thresholds'],
    medianMtf50CyPx: 0.12,
    pixelDensity: null,
    baselineMtf50CyPx: null,
    baselineRatio: null,
    otherModeMtf50CyPx: null,
    targetId: null,
    targetWidthMm: null,
    notes: null,
    exposureNote: null,
    lensNote: null,
    shareFrame: false,
    isBaseline: false,
    frame: { name: 'f.png', mime: 'image/png', bytes: 1, width: 1, height: 1, orientation: 1 },
    representativeId: null,
    ...overrides,
  }
}

let requests: string[] = []
function serve(answer: (url: string) => Response | null) {
  requests = []
  http.configure({
    isOnline: () => true,
    fetch: (async (input: RequestInfo | URL) => {
      const url = String(input)
      requests.push(url)
      const res = answer(url)
      if (res) return res
      throw new TypeError('Failed to fetch')
    }) as typeof fetch,
  })
}
const json = (body: unknown) =>
  new Response(JSON.stringify(body), {
    status: 200,
    headers: { 'Content-Type': 'application/json' },
  })

beforeEach(async () => {
  await Promise.all(db.tables.map((t) => t.clear()))
  globalThis.localStorage = new MemoryStorage()
  localStorage.setItem(
    SESSION_STORAGE_KEY,
    JSON.stringify({
      version: 1,
      user: { id: 4, email: 'ines@sharpfield.test', name: 'Ines', role: 'inspector' },
      token: 't',
      refreshToken: 'r',
      savedAt: '2025-01-01T00:00:00Z',
    }),
  )
  setActivePinia(createPinia())
})

describe('saved checks per camera', () => {
  it('merges this device’s checks with the server’s, newest first, without doubles', () => {
    const items = mergeHistory(
      [
        localCheck(IDS[2]),
        localCheck(IDS[1], { capturedAt: '2025-04-01T09:00:00.000Z', mode: 'night' }),
      ],
      {
        ...serverHistory(),
        fetchedAt: '2025-05-01T00:00:00.000Z',
      },
    )
    expect(items.map((i) => [i.id, i.onDevice, i.onServer, i.inspectorName])).toEqual([
      [IDS[2], true, false, null],
      [IDS[1], true, true, 'Ines'],
      [IDS[0], false, true, 'Ines'],
    ])
  })

  it('downloads the server history when online and shows it again offline', async () => {
    serve((url) => (url.startsWith('/api/cameras/1/checks') ? json(serverHistory()) : null))
    const store = useChecksStore()
    await store.loadCamera(1)
    expect(requests).toEqual(['/api/cameras/1/checks?limit=100'])
    expect(store.history(1).map((h) => h.id)).toEqual([IDS[1], IDS[0]])

    setActivePinia(createPinia())
    serve(() => null)
    const offline = useChecksStore()
    await offline.loadCamera(1)
    expect(offline.history(1).map((h) => h.id)).toEqual([IDS[1], IDS[0]])
    expect(offline.byCamera[1].error).toBeNull()
    expect(await offline.baselineFor(sampleCamera(1, { baselineCheckId: IDS[0] }))).toEqual({
      checkId: IDS[0],
      mtf50CyPx: 0.31,
    })
    expect(offline.latestMtf50(1, 'night')).toBe(0.2)
    expect(offline.latestMtf50(1, 'day')).toBe(0.31)
  })

  it('shows a server refusal as an error and keeps what it had', async () => {
    serve(
      () =>
        new Response(
          JSON.stringify({
            error: { code: 'camera.not_found', message: 'There is no camera with id 1.' },
          }),
          { status: 404, headers: { 'Content-Type': 'application/json' } },
        ),
    )
    const store = useChecksStore()
    await store.loadCamera(1)
    expect(store.byCamera[1].error?.message).toMatch(/no camera with id 1/)
    expect(store.history(1)).toEqual([])
  })

  it('takes a baseline marked on this device before the server’s', async () => {
    serve(() => null)
    await db.checks.put(localCheck(IDS[2], { isBaseline: true, medianMtf50CyPx: 0.27 }))
    const store = useChecksStore()
    await store.loadCamera(1)
    expect(await store.baselineFor(sampleCamera(1, { baselineCheckId: IDS[0] }))).toEqual({
      checkId: IDS[2],
      mtf50CyPx: 0.27,
    })
    expect(await store.baselineFor(sampleCamera(2))).toEqual({ checkId: null, mtf50CyPx: null })
  })

  it('with no history on the device, takes the baseline MTF50 the camera record carries', async () => {
    serve(() => null)
    const camera = sampleCamera(1, { baselineCheckId: IDS[0], baselineMtf50CyPx: 0.31 })
    const store = useChecksStore()
    await store.loadCamera(1)
    expect(await store.baselineFor(camera)).toEqual({ checkId: IDS[0], mtf50CyPx: 0.31 })
    // A newer copy on the device (left by a sync pull) wins over the one on screen.
    await db.cameras.put({ ...camera, baselineMtf50CyPx: 0.29 })
    expect(await store.baselineFor(camera)).toEqual({ checkId: IDS[0], mtf50CyPx: 0.29 })
  })

  it('marks a server check as the baseline on the device and queues it for the server', async () => {
    serve((url) =>
      url.startsWith('/api/cameras/1/checks') ? json(serverHistory(1, IDS[0])) : null,
    )
    const store = useChecksStore()
    await store.loadCamera(1)
    await store.markBaseline(IDS[1], 1, 7)
    const ops = await db.outbox.toArray()
    expect(ops.map((o) => [o.kind, o.payload])).toEqual([
      ['check.markBaseline', { checkId: IDS[1], cameraId: 1, cameraVersion: 7 }],
    ])
    expect(store.history(1).find((h) => h.isBaseline)?.id).toBe(IDS[1])
    expect(await store.baselineFor(sampleCamera(1, { baselineCheckId: IDS[0] }))).toEqual({
      checkId: IDS[1],
      mtf50CyPx: 0.2,
    })
  })

  it('fetches the histories of cameras about to be visited once, skipping fresh ones', async () => {
    serve((url) => {
      const id = Number(url.match(/cameras\/(\d+)/)?.[1])
      return id ? json(serverHistory(id, null)) : null
    })
    const store = useChecksStore()
    expect(await store.prefetch([1, 2, 3])).toBe(3)
    expect(await store.prefetch([1, 2, 3])).toBe(0)
    expect(requests.filter((u) => u.includes('/checks'))).toHaveLength(3)
  })

  it('keeps the newest check of each camera saved here for the rounds list', async () => {
    await db.checks.bulkPut([
      localCheck(IDS[0], { capturedAt: '2025-05-01T10:00:00.000Z', verdict: 'pass' }),
      localCheck(IDS[1], { capturedAt: '2025-05-03T10:00:00.000Z', verdict: 'fail' }),
      localCheck(IDS[2], { cameraId: 2, userId: 9 }),
    ])
    const store = useChecksStore()
    await store.loadLatestLocal()
    expect(store.latestLocal).toEqual({
      1: { checkId: IDS[1], verdict: 'fail', capturedAt: '2025-05-03T10:00:00.000Z' },
    })
  })
})
