import 'fake-indexeddb/auto'
import { createPinia, setActivePinia } from 'pinia'
import { beforeAll, beforeEach, describe, expect, it } from 'vitest'
import { effectScope, ref } from 'vue'
import { ApiError } from '@/api/errors'
import { http } from '@/api/http'
import { useRestoration } from '@/components/check/useSavedRestoration'
import { model } from '@/components/check/__tests__/samples'
import { validateFrameFile } from '@/composables/useFrameCapture'
import { saveCatalog } from '@/db/catalogCache'
import { loadCheckBundle, toCheckCreatePayload, type CheckBundle } from '@/db/checkRecords'
import { db } from '@/db/database'
import { sampleCamera, sampleSite, sampleTask } from '@/db/__tests__/sampleCatalog'
import { SESSION_STORAGE_KEY } from '@/stores/auth'
import { setAnalysisWorkerSpawner, useCheckStore } from '@/stores/check'
import { MemoryStorage } from '@/stores/__tests__/memoryStorage'
import type { RestorationPreview } from '@/workers/types'
import { inProcessWorker } from '@/workers/core/__tests__/inProcessWorker'
import { encodePngGrey, renderTargetFrame } from '../../../../tests/fixtures/edges/render'
import { uploadedRestoration, uploadedSourceOf } from '../uploadedRestoration'
import { attachment, checkDetail, detailMeasurement } from './samples'

// A supervisor's screen makes the restoration preview of a check from the region crop the
// inspector uploaded and the kernel the device sent: the same preview, pixel for pixel, as the
// device shows from the crop it kept. The check is made with the app's own check store on the
// printed target blurred by a Gaussian of σ = 2.5 px; the worker functions run in-process.

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
  await saveCatalog(
    db,
    { sites: [sampleSite(1, 'North Depot')], cameras: [sampleCamera(1)], tasks: [sampleTask()] },
    4,
  )
  await db.cameraModels.put(model())
})

/** Checks the frame on the "device", restores its representative region live, saves. */
async function checkAndSave(): Promise<{ live: RestorationPreview; bundle: CheckBundle }> {
  const store = useCheckStore()
  expect(await store.begin(1)).toBe(true)
  expect(await store.importFrame(await validateFrameFile(frame, 'gate.png'))).toBe(true)
  expect(await store.restore('wiener')).toBe(true)
  const live = store.restoration!
  const id = await store.save()
  return { live, bundle: (await loadCheckBundle(db, id!))! }
}

/** The check as the server gives it back after the sync, and the list of its uploaded crops. */
function onServer(bundle: CheckBundle) {
  const payload = toCheckCreatePayload(bundle.check, bundle.measurements)
  const measurements = payload.measurements.map((m) =>
    detailMeasurement({
      id: m.id,
      roi: m.roi,
      orientation: m.orientation,
      angleDeg: m.angleDeg,
      mtf50CyPx: m.mtf50CyPx,
      noise: m.noise ?? null,
      psf: m.psf
        ? {
            model: m.psf.model,
            sigmaPx: m.psf.sigmaPx ?? null,
            radiusPx: m.psf.radiusPx ?? null,
            rmsResidual: m.psf.rmsResidual ?? null,
          }
        : null,
    }),
  )
  const detail = checkDetail(measurements, {
    id: payload.id,
    medianMtf50CyPx: payload.medianMtf50CyPx,
  })
  const crops = bundle.crops.map((c) => ({
    blob: c.blob,
    row: attachment(
      measurements.find((m) => m.id === c.id)!,
      { checkId: payload.id },
    ),
  }))
  return { detail, crops }
}

function differing(a: Uint8ClampedArray, b: Uint8ClampedArray): number {
  expect(a.length).toBe(b.length)
  let n = 0
  for (let i = 0; i < a.length; i++) if (a[i] !== b[i]) n++
  return n
}

describe('the restoration preview of a check seen in the fleet', () => {
  it('is made from the uploaded crop, pixel for pixel the same as on the device', async () => {
    const { live, bundle } = await checkAndSave()
    const { detail, crops } = onServer(bundle)
    const r = uploadedRestoration(
      detail,
      crops.map((c) => c.row),
    )
    if (r.kind !== 'edges') throw new Error(`expected edges, got ${r.kind}`)
    // The supervisor's screen restores the region the device restored, out of several.
    expect(r.edges.length).toBeGreaterThan(1)
    expect(r.representative.measurementId).toBe(bundle.check.representativeId)
    const fetched: string[] = []
    const fetchCrop = async (id: string) => {
      fetched.push(id)
      return crops.find((c) => c.row.id === id)!.blob
    }
    const scope = effectScope()
    const shown = scope.run(() =>
      useRestoration(ref(uploadedSourceOf(r.representative, fetchCrop)), () => inProcessWorker()),
    )!
    expect(await shown.restore('wiener')).toBe(true)
    const p = shown.preview.value!
    expect([p.width, p.height, p.method]).toEqual([live.width, live.height, 'wiener'])
    expect(differing(p.before, live.before)).toBe(0)
    expect(differing(p.after, live.after)).toBe(0)
    expect(p.lost).toEqual(live.lost)
    expect(p.nsr).toBe(live.nsr)
    // The other method works from the same fetched pixels: the crop is fetched once.
    expect(await shown.restore('richardson-lucy')).toBe(true)
    expect(shown.preview.value?.method).toBe('richardson-lucy')
    expect(fetched).toEqual([r.representative.crop.id])
    scope.stop()
  })

  it('says in words when the crop cannot be fetched, and works once it can', async () => {
    const { bundle } = await checkAndSave()
    const { detail, crops } = onServer(bundle)
    const r = uploadedRestoration(
      detail,
      crops.map((c) => c.row),
    )
    if (r.kind !== 'edges') throw new Error(`expected edges, got ${r.kind}`)
    let calls = 0
    const fetchCrop = async (id: string) => {
      if (++calls === 1) {
        throw new ApiError(
          'attachment.missing',
          'The file of this attachment is missing from the store.',
          410,
        )
      }
      return crops.find((c) => c.row.id === id)!.blob
    }
    const scope = effectScope()
    const shown = scope.run(() =>
      useRestoration(ref(uploadedSourceOf(r.representative, fetchCrop)), () => inProcessWorker()),
    )!
    expect(await shown.restore('wiener')).toBe(false)
    expect(shown.error.value).toBe(
      'The uploaded region could not be fetched from the server: The file of this attachment is missing from the store.',
    )
    expect(shown.preview.value).toBeNull()
    expect(await shown.restore('wiener')).toBe(true)
    expect(shown.error.value).toBeNull()
    expect(shown.preview.value?.method).toBe('wiener')
    scope.stop()
  })

  it('reports a crop that is not an image in words and shows nothing made up', async () => {
    const { bundle } = await checkAndSave()
    const { detail, crops } = onServer(bundle)
    const r = uploadedRestoration(
      detail,
      crops.map((c) => c.row),
    )
    if (r.kind !== 'edges') throw new Error(`expected edges, got ${r.kind}`)
    const scope = effectScope()
    const junk = async () => new Blob([new Uint8Array([1, 2, 3, 4])])
    const shown = scope.run(() =>
      useRestoration(ref(uploadedSourceOf(r.representative, junk)), () => inProcessWorker()),
    )!
    expect(await shown.restore('wiener')).toBe(false)
    expect(shown.error.value).toMatch(/^The uploaded region could not be read on this device: /)
    expect(shown.preview.value).toBeNull()
    scope.stop()
  })
})
