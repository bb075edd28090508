// Saved checks per camera: this device's own (IndexedDB, first) merged with the server's history
// (fetched when online and kept for offline use), the camera's baseline, and the camera models
// the lens-based numbers need. Saving and marking a baseline go through the sync outbox.
import { defineStore } from 'pinia'
import { ref } from 'vue'
import type { Camera } from '@shared/schemas/cameras'
import type { CameraModel } from '@shared/schemas/catalog'
import type { CheckMode, Verdict } from '@shared/schemas/enums'
import { fetchCameraChecks, fetchCameraModels } from '@/api/cameraChecks'
import { ApiError, errorMessage } from '@/api/errors'
import { useOnline } from '@/composables/useOnline'
import {
  checkTables,
  localChecksOf,
  putCheckBundle,
  setLocalBaseline,
  toCheckCreatePayload,
  type CheckBundle,
} from '@/db/checkRecords'
import { loadCachedCamera } from '@/db/catalogCache'
import type { CameraHistoryRecord, CheckRecord } from '@/db/checks'
import { db } from '@/db/database'
import { enqueue, outboxTables } from '@/db/outbox'
import { useAuthStore, type StoreError } from './auth'

/** One row of a camera's history: saved on this device, on the server, or both. */
export interface HistoryItem {
  id: string
  cameraId: number
  capturedAt: string
  mode: CheckMode
  verdict: Verdict
  medianMtf50CyPx: number | null
  pixelDensityPxPerM: number | null
  baselineRatio: number | null
  isBaseline: boolean
  inspectorName: string | null
  /** Saved on this device (it can be opened in full here). */
  onDevice: boolean
  /** Known to be on the server. */
  onServer: boolean
}

/** The newest check of a camera saved on this device. */
export interface LocalResult {
  checkId: string
  verdict: Verdict
  capturedAt: string
  /** Still in the outbox (filled in by the screen from the sync queue). */
  waiting: boolean
}

interface CameraChecksState {
  local: CheckRecord[]
  server: CameraHistoryRecord | null
  loading: boolean
  error: StoreError | null
}

export function mergeHistory(
  local: readonly CheckRecord[],
  server: CameraHistoryRecord | null,
  myName: string | null = null,
): HistoryItem[] {
  const items = new Map<string, HistoryItem>()
  for (const s of server?.checks ?? []) {
    items.set(s.id, { ...s, cameraId: server!.cameraId, onDevice: false, onServer: true })
  }
  for (const c of local) {
    const there = items.get(c.id)
    items.set(c.id, {
      id: c.id,
      cameraId: c.cameraId,
      capturedAt: c.capturedAt,
      mode: c.mode,
      verdict: c.verdict,
      medianMtf50CyPx: c.medianMtf50CyPx,
      pixelDensityPxPerM: c.pixelDensity?.pxPerM ?? null,
      baselineRatio: c.baselineRatio,
      isBaseline: c.isBaseline || (there?.isBaseline ?? false),
      inspectorName: there?.inspectorName ?? myName,
      onDevice: true,
      onServer: Boolean(there),
    })
  }
  return [...items.values()].sort((a, b) => b.capturedAt.localeCompare(a.capturedAt))
}

export const useChecksStore = defineStore('checks', () => {
  const auth = useAuthStore()
  const { online } = useOnline()
  const byCamera = ref<Record<number, CameraChecksState>>({})
  const models = ref<CameraModel[]>([])
  const latestLocal = ref<Record<number, Omit<LocalResult, 'waiting'>>>({})

  /** The newest check per camera saved on this device by the signed-in user. */
  async function loadLatestLocal(): Promise<void> {
    const userId = auth.user?.id
    const all = userId === undefined ? [] : await db.checks.orderBy('capturedAt').toArray()
    const map: Record<number, Omit<LocalResult, 'waiting'>> = {}
    for (const c of all) {
      if (c.userId !== userId) continue
      map[c.cameraId] = { checkId: c.id, verdict: c.verdict, capturedAt: c.capturedAt }
    }
    latestLocal.value = map
  }

  function stateOf(cameraId: number): CameraChecksState {
    byCamera.value[cameraId] ??= { local: [], server: null, loading: false, error: null }
    return byCamera.value[cameraId]
  }

  async function readLocal(cameraId: number): Promise<void> {
    const userId = auth.user?.id
    const [local, server] = await Promise.all([
      userId === undefined ? Promise.resolve([]) : localChecksOf(db, cameraId, userId),
      db.cameraHistory.get(cameraId),
    ])
    const s = stateOf(cameraId)
    s.local = local
    s.server = server ?? s.server
  }

  /** The device's copy at once; the server's when online. */
  async function loadCamera(cameraId: number): Promise<void> {
    await readLocal(cameraId)
    if (!online.value || !auth.user) return
    const s = stateOf(cameraId)
    s.loading = true
    s.error = null
    try {
      const answer = await fetchCameraChecks(cameraId)
      const record: CameraHistoryRecord = { ...answer, fetchedAt: new Date().toISOString() }
      await db.cameraHistory.put(record)
      s.server = record
    } catch (e) {
      if (!(e instanceof ApiError && e.isConnectivity)) {
        s.error = { code: e instanceof ApiError ? e.code : 'unknown', message: errorMessage(e) }
      }
    } finally {
      s.loading = false
    }
  }

  let prefetching = false
  /**
   * Downloads the server history (and so the baseline) of cameras the inspector is about to
   * visit, one at a time in the background, so an offline check can compare with the baseline.
   * Histories fetched within `maxAgeMs` are skipped.
   */
  async function prefetch(cameraIds: number[], maxAgeMs = 6 * 3_600_000): Promise<number> {
    if (prefetching || !online.value || !auth.user) return 0
    prefetching = true
    let fetched = 0
    try {
      const cached = await db.cameraHistory.bulkGet(cameraIds)
      const now = Date.now()
      const stale = cameraIds.filter(
        (_, i) => !cached[i] || now - Date.parse(cached[i]!.fetchedAt) > maxAgeMs,
      )
      for (const id of stale) {
        if (!online.value || !auth.user) break
        await loadCamera(id)
        fetched++
      }
    } finally {
      prefetching = false
    }
    return fetched
  }

  function history(cameraId: number): HistoryItem[] {
    const s = byCamera.value[cameraId]
    return s ? mergeHistory(s.local, s.server, auth.user?.name ?? null) : []
  }

  /**
   * The baseline's MTF50: a check marked here (waiting to sync), else the check the history
   * flags, else the camera's baseline check, else the value a pulled camera record carries.
   */
  async function baselineFor(
    camera: Camera,
  ): Promise<{ checkId: string | null; mtf50CyPx: number | null }> {
    const s = stateOf(camera.id)
    const items = history(camera.id)
    const marked = s.local.find((c) => c.isBaseline)
    if (marked) return { checkId: marked.id, mtf50CyPx: marked.medianMtf50CyPx }
    const flagged = items.find((i) => i.isBaseline && i.medianMtf50CyPx !== null)
    if (flagged) return { checkId: flagged.id, mtf50CyPx: flagged.medianMtf50CyPx }
    const id = camera.baselineCheckId ?? s.server?.baseline?.checkId ?? null
    const known = items.find((i) => i.id === id)?.medianMtf50CyPx ?? s.server?.baseline?.mtf50CyPx
    if (known != null) return { checkId: id, mtf50CyPx: known }
    // A camera record (listed or pulled) carries its baseline's MTF50; the device's copy is the
    // newest a sync pull left.
    const saved = await loadCachedCamera(db, camera.id)
    return { checkId: id, mtf50CyPx: saved?.baselineMtf50CyPx ?? camera.baselineMtf50CyPx ?? null }
  }

  /** Median MTF50 of the newest check in a mode. */
  function latestMtf50(cameraId: number, mode: CheckMode): number | null {
    return (
      history(cameraId).find((i) => i.mode === mode && i.medianMtf50CyPx !== null)
        ?.medianMtf50CyPx ?? null
    )
  }

  async function loadModels(): Promise<void> {
    models.value = await db.cameraModels.toArray()
    if (!online.value || !auth.user) return
    try {
      const list = await fetchCameraModels()
      await db.transaction('rw', db.cameraModels, async () => {
        await db.cameraModels.clear()
        await db.cameraModels.bulkPut(list)
      })
      models.value = list
    } catch {
      // Offline or refused: the saved copy stays.
    }
  }

  function modelFor(camera: Camera): CameraModel | null {
    return models.value.find((m) => m.id === camera.cameraModelId) ?? null
  }

  /** Saves a check and queues it (and its baseline mark) for the server, in one transaction. */
  async function saveCheck(bundle: CheckBundle, cameraVersion?: number): Promise<void> {
    const payload = toCheckCreatePayload(bundle.check, bundle.measurements, cameraVersion)
    const tables = [...new Set([...checkTables(db), ...outboxTables(db)])]
    await db.transaction('rw', tables, async () => {
      if (bundle.check.isBaseline) {
        await db.checks
          .where('cameraId')
          .equals(bundle.check.cameraId)
          .modify((c) => {
            c.isBaseline = false
          })
      }
      await putCheckBundle(db, bundle)
      await enqueue('check.create', payload)
      if (bundle.check.isBaseline) {
        await enqueue('check.markBaseline', {
          checkId: bundle.check.id,
          cameraId: bundle.check.cameraId,
          ...(cameraVersion ? { cameraVersion } : {}),
        })
      }
    })
    await readLocal(bundle.check.cameraId)
    latestLocal.value = {
      ...latestLocal.value,
      [bundle.check.cameraId]: {
        checkId: bundle.check.id,
        verdict: bundle.check.verdict,
        capturedAt: bundle.check.capturedAt,
      },
    }
  }

  /** Makes a saved check the camera's baseline (supervisor; inspector at commissioning). */
  async function markBaseline(checkId: string, cameraId: number, cameraVersion?: number) {
    const tables = [...new Set([db.checks, db.cameraHistory, ...outboxTables(db)])]
    await db.transaction('rw', tables, async () => {
      await setLocalBaseline(db, checkId, cameraId)
      // The server's history as cached here shows the new baseline at once too.
      const cached = await db.cameraHistory.get(cameraId)
      if (cached) {
        const chosen = cached.checks.find((c) => c.id === checkId)
        await db.cameraHistory.put({
          ...cached,
          baseline: chosen ? { checkId, mtf50CyPx: chosen.medianMtf50CyPx } : cached.baseline,
          checks: cached.checks.map((c) => ({ ...c, isBaseline: c.id === checkId })),
        })
      }
      await enqueue('check.markBaseline', {
        checkId,
        cameraId,
        ...(cameraVersion ? { cameraVersion } : {}),
      })
    })
    await readLocal(cameraId)
  }

  return {
    byCamera,
    models,
    latestLocal,
    loadLatestLocal,
    loadCamera,
    prefetch,
    history,
    baselineFor,
    latestMtf50,
    loadModels,
    modelFor,
    saveCheck,
    markBaseline,
  }
})
