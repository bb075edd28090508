import 'fake-indexeddb/auto'
import { createPinia, setActivePinia } from 'pinia'
import { beforeAll, beforeEach, describe, expect, it } from 'vitest'
import { effectScope, ref } from 'vue'
import { http } from '@/api/http'
import { validateFrameFile } from '@/composables/useFrameCapture'
import { saveCatalog } from '@/db/catalogCache'
import { loadCheckBundle, type CheckBundle } from '@/db/checkRecords'
import { db } from '@/db/database'
import { sampleCamera, sampleSite, sampleTask } from '@/db/__tests__/sampleCatalog'
import { SESSION_STORAGE_KEY } from '@/stores/auth'
import { setAnalysisWorkerSpawner, useCheckStore } from '@/stores/check'
import { MemoryStorage } from '@/stores/__tests__/memoryStorage'
import type { RestorationPreview } from '@/workers/types'
import { inProcessWorker } from '@/workers/core/__tests__/inProcessWorker'
import { encodePngGrey, renderTargetFrame } from '../../../../tests/fixtures/edges/render'
import { NO_PIXELS_REASON } from '../logic/restorationSource'
import { useSavedRestoration } from '../useSavedRestoration'
import { model } from './samples'

// A saved check opened again on the device where it was made shows the same restoration
// preview as right after the analysis: the worker functions run in-process, IndexedDB is
// fake-indexeddb. The frame is the printed target blurred by a Gaussian of σ = 2.5 px.

const frame = new Blob(
  [
    new Uint8Array(
      encodePngGrey(
        1280,
        800,
        renderTargetFrame({ width: 1280, height: 800, sigmaPx: 2.5, sheetFraction: 0.62 }).codes,
      ),
    ),
  ],
  { type: 'image/png' },
)

function signIn() {
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
  signIn()
  await saveCatalog(
    db,
    { sites: [sampleSite(1, 'North Depot')], cameras: [sampleCamera(1)], tasks: [sampleTask()] },
    4,
  )
  await db.cameraModels.put(model())
})

/** Checks the frame, restores its representative region live, saves; both for comparison. */
async function checkAndSave(): Promise<{ live: RestorationPreview; bundle: CheckBundle }> {
  const store = useCheckStore()
  expect(await store.begin(1)).toBe(true)
  expect(await store.importFrame(await validateFrameFile(frame, 'gate.png'))).toBe(true)
  expect(await store.restore('wiener')).toBe(true)
  const live = store.restoration!
  expect(live).not.toBeNull()
  const id = await store.save()
  return { live, bundle: (await loadCheckBundle(db, id!))! }
}

function savedPreview(bundle: CheckBundle | null) {
  const scope = effectScope()
  const saved = scope.run(() => useSavedRestoration(ref(bundle), () => inProcessWorker()))!
  return { saved, stop: () => scope.stop() }
}

/** How many values differ between two pixel arrays of the same length. */
function differing(a: Uint8ClampedArray, b: Uint8ClampedArray): number {
  expect(a.length).toBe(b.length)
  let n = 0
  for (let i = 0; i < a.length; i++) if (a[i] !== b[i]) n++
  return n
}

describe('the restoration preview of a saved check', () => {
  it('is made again from the kept region crop, pixel for pixel the same as during the check', async () => {
    const { live, bundle } = await checkAndSave()
    const { saved, stop } = savedPreview(bundle)
    expect(saved.source.value).toMatchObject({ available: true, from: 'crop' })
    expect(saved.preview.value).toBeNull()
    expect(await saved.restore('wiener')).toBe(true)
    const p = saved.preview.value!
    expect([p.width, p.height, p.method]).toEqual([live.width, live.height, 'wiener'])
    expect(differing(p.before, live.before)).toBe(0)
    expect(differing(p.after, live.after)).toBe(0)
    expect(p.lost).toEqual(live.lost)
    expect(p.nsr).toBe(live.nsr)
    // The other method works from the same kept pixels.
    expect(await saved.restore('richardson-lucy')).toBe(true)
    expect(saved.preview.value?.method).toBe('richardson-lucy')
    expect(differing(saved.preview.value!.before, live.before)).toBe(0)
    stop()
  })

  it('falls back to the kept frame when the region crop is missing', async () => {
    const { live, bundle } = await checkAndSave()
    const { saved, stop } = savedPreview({ ...bundle, crops: [] })
    expect(saved.source.value).toMatchObject({ available: true, from: 'frame' })
    expect(await saved.restore('wiener')).toBe(true)
    expect(differing(saved.preview.value!.after, live.after)).toBe(0)
    stop()
  })

  it('says it is not available when neither the crop nor the frame is on the device', async () => {
    const { bundle } = await checkAndSave()
    const { saved, stop } = savedPreview({ ...bundle, crops: [], frame: null })
    expect(saved.source.value).toEqual({ available: false, reason: NO_PIXELS_REASON })
    expect(await saved.restore('wiener')).toBe(false)
    expect(saved.preview.value).toBeNull()
    stop()
  })

  it('reports a damaged kept crop in words and shows nothing made up', async () => {
    const { bundle } = await checkAndSave()
    const rep = bundle.check.representativeId!
    const crops = bundle.crops.map((c) =>
      c.id === rep ? { ...c, blob: new Blob([new Uint8Array([1, 2, 3, 4])]) } : c,
    )
    const { saved, stop } = savedPreview({ ...bundle, crops })
    expect(await saved.restore('wiener')).toBe(false)
    expect(saved.error.value).toMatch(/saved region could not be read on this device/)
    expect(saved.preview.value).toBeNull()
    stop()
  })
})
