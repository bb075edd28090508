import 'fake-indexeddb/auto'
import { createPinia, setActivePinia } from 'pinia'
import { beforeAll, beforeEach, describe, expect, it } from 'vitest'
import { checkCreatePayloadSchema } from '@shared/schemas/checks'
import { http } from '@/api/http'
import { model } from '@/components/check/__tests__/samples'
import { validateFrameFile } from '@/composables/useFrameCapture'
import { saveCatalog } from '@/db/catalogCache'
import { loadCheckBundle } from '@/db/checkRecords'
import { db } from '@/db/database'
import { sampleCamera, sampleSite, sampleTask } from '@/db/__tests__/sampleCatalog'
import { inProcessWorker } from '@/workers/core/__tests__/inProcessWorker'
import { encodePngGrey, renderTargetFrame } from '../../../tests/fixtures/edges/render'
import { SESSION_STORAGE_KEY } from '../auth'
import { setAnalysisWorkerSpawner, useCheckStore } from '../check'
import { useChecksStore } from '../checks'
import { MemoryStorage } from './memoryStorage'

// A whole check with no network: the worker's functions run in-process, IndexedDB is
// fake-indexeddb, the server cannot be reached. The frame is the printed target blurred by a
// Gaussian of σ = 2.5 px: MTF50 = 0.187391 / 2.5 = 0.0750 c/p [calc, DOMAIN.md], below the
// camera's 0.20 c/p minimum, so the check fails.

const SIGMA = 2.5
const target = renderTargetFrame({ width: 1280, height: 800, sigmaPx: SIGMA, sheetFraction: 0.62 })
const blurred = new Blob([new Uint8Array(encodePngGrey(1280, 800, target.codes))], {
  type: 'image/png',
})
const blank = new Blob([
  new Uint8Array(encodePngGrey(320, 240, new Uint8Array(320 * 240).fill(140))),
])

function signedIn(role = 'inspector') {
  globalThis.localStorage = new MemoryStorage()
  localStorage.setItem(
    SESSION_STORAGE_KEY,
    JSON.stringify({
      version: 1,
      user: { id: 4, email: 'ines@sharpfield.test', name: 'Ines', role },
      token: 't',
      refreshToken: 'r',
      savedAt: '2025-01-01T00:00:00Z',
    }),
  )
  setActivePinia(createPinia())
}

beforeAll(() => {
  setAnalysisWorkerSpawner(() => inProcessWorker())
  http.configure({
    isOnline: () => false,
    fetch: (async () => {
      throw new TypeError('Failed to fetch')
    }) as typeof fetch,
  })
})

beforeEach(async () => {
  await Promise.all(db.tables.map((t) => t.clear()))
  signedIn()
  await saveCatalog(
    db,
    { sites: [sampleSite(1, 'North Depot')], cameras: [sampleCamera(1)], tasks: [sampleTask()] },
    4,
  )
  await db.cameraModels.put(model())
})

describe('the check in progress', () => {
  it('finds and measures the edges, takes an adjusted region, fails the soft camera and saves it for sync', async () => {
    const store = useCheckStore()
    expect(await store.begin(1)).toBe(true)
    expect(store.context?.camera.assetTag).toBe('CAM-001')
    expect(await store.importFrame(await validateFrameFile(blurred, 'gate.png'))).toBe(true)
    expect(store.step).toBe('regions')
    expect(store.regions.length).toBeGreaterThanOrEqual(8)
    expect(store.regions.every((r) => r.status === 'measured')).toBe(true)

    // Adjust region 1 (shrink it by a quarter): it is measured again and still counts.
    const first = store.regions[0]
    const roi = { ...first.roi, w: Math.round(first.roi.w * 0.75) }
    expect(await store.adjustRegion(first.id, roi)).toBe(true)
    expect(store.regions[0].roi).toEqual(roi)
    expect(store.regions[0].status).toBe('measured')
    store.toggleRegion(store.regions[1].id)
    const used = store.regions.length - 1

    const report = store.report!
    expect(report.verdict.verdict).toBe('fail')
    expect(report.validCount).toBe(used)
    expect(Math.abs(report.medianMtf50CyPx! - 0.187391 / SIGMA) / (0.187391 / SIGMA)).toBeLessThan(
      0.03,
    )
    expect(report.density?.pxPerM).toBeCloseTo(137.93, 2)

    expect(store.canMarkBaseline).toBe(true)
    store.markAsBaseline = true
    store.notes = 'Dome clean; focus ring loose'
    const id = await store.save()
    expect(id).toMatch(/^[0-9a-f-]{36}$/)
    expect(store.step).toBe('frame')

    const bundle = (await loadCheckBundle(db, id!))!
    expect(bundle.check).toMatchObject({
      cameraId: 1,
      userId: 4,
      verdict: 'fail',
      isBaseline: true,
      shareFrame: false,
    })
    expect(bundle.measurements).toHaveLength(used + 1)
    expect(bundle.crops).toHaveLength(used)
    expect(bundle.frame?.share).toBe(false)

    const ops = await db.outbox.orderBy('seq').toArray()
    expect(ops.map((o) => [o.kind, o.refId, o.status])).toEqual([
      ['check.create', id, 'pending'],
      ['check.markBaseline', id, 'pending'],
    ])
    const payload = checkCreatePayloadSchema.parse(ops[0].payload)
    expect(payload.measurements).toHaveLength(used)
    expect(payload.notes).toBe('Dome clean; focus ring loose')

    expect(
      useChecksStore()
        .history(1)
        .map((h) => [h.id, h.onDevice, h.isBaseline]),
    ).toEqual([[id, true, true]])
  })

  it('shows a saved check after a reload (a new session of the stores)', async () => {
    const store = useCheckStore()
    await store.begin(1)
    await store.importFrame(await validateFrameFile(blurred, 'gate.png'))
    const id = await store.save()

    setActivePinia(createPinia())
    const checks = useChecksStore()
    await checks.loadCamera(1)
    expect(checks.history(1).map((h) => h.id)).toEqual([id])
    expect(checks.history(1)[0]).toMatchObject({ verdict: 'fail', onDevice: true, onServer: false })
  })

  it('finds no edge in a blank frame, says so, and will not save an inconclusive check', async () => {
    const store = useCheckStore()
    await store.begin(1)
    expect(await store.importFrame(await validateFrameFile(blank, 'blank.png'))).toBe(true)
    expect(store.step).toBe('regions')
    expect(store.regions).toEqual([])
    expect(store.saveBlocker).toMatch(/Measure at least one edge/)
    // A hand-drawn region on the blank frame fails alone, with the engine's reason.
    expect(await store.addRegion({ x: 10, y: 10, w: 100, h: 100 })).toBe(true)
    expect(store.regions[0]).toMatchObject({ source: 'manual', status: 'failed' })
    expect(store.regions[0].error).toMatch(/No usable edge/)
    expect(store.saveBlocker).toMatch(/no verdict to save/)
    expect(await store.save()).toBeNull()
    expect(await db.checks.count()).toBe(0)
    expect(await db.outbox.count()).toBe(0)
  })

  it('refuses a camera that is not on the device', async () => {
    const store = useCheckStore()
    expect(await store.begin(99)).toBe(false)
    expect(store.error).toMatch(/not on this device/)
  })
})
