// The page's handle on the analysis worker: one job at a time, progress as refs, cancel by
// terminating the worker (the engine's loops cannot be interrupted). After a cancel the next
// job starts a fresh worker and loads the last frame into it again.
import { proxy, wrap, type Remote } from 'comlink'
import { onScopeDispose, ref, shallowRef } from 'vue'
import type {
  AnalysisStage,
  AnalysisWorkerApi,
  FrameInfo,
  RegionRequest,
  RestorationRequest,
  Roi,
} from '@/workers/types'

export interface WorkerHandle {
  api: Remote<AnalysisWorkerApi> | AnalysisWorkerApi
  terminate(): void
}

export function spawnAnalysisWorker(): WorkerHandle {
  const worker = new Worker(new URL('../workers/analysis.worker.ts', import.meta.url), {
    type: 'module',
    name: 'analysis',
  })
  return { api: wrap<AnalysisWorkerApi>(worker), terminate: () => worker.terminate() }
}

/** Thrown into a job's caller when the user cancelled it. */
export class AnalysisCancelled extends Error {
  constructor() {
    super('The analysis was cancelled.')
    this.name = 'AnalysisCancelled'
  }
}

/** A copy without Vue's reactive proxy: proxies cannot cross to a worker. */
export function plainRoi(roi: Roi): Roi {
  return { x: roi.x, y: roi.y, w: roi.w, h: roi.h }
}

export const STAGE_LABEL: Record<AnalysisStage, string> = {
  decode: 'Reading the image',
  luminance: 'Preparing the frame',
  edges: 'Looking for slanted edges',
  measure: 'Measuring the edges',
  done: 'Done',
}

export function useAnalysisWorker(spawn: () => WorkerHandle = spawnAnalysisWorker) {
  let handle: WorkerHandle | null = null
  let loadedFile: Blob | null = null
  let frameInWorker = false
  let cancelCurrent: (() => void) | null = null

  const busy = ref(false)
  const stage = ref<AnalysisStage | null>(null)
  const fraction = ref(0)
  const frame = shallowRef<FrameInfo | null>(null)

  const onProgress = proxy((f: number, s: AnalysisStage) => {
    fraction.value = Math.max(0, Math.min(1, f))
    stage.value = s
  })

  function current(): WorkerHandle {
    handle ??= spawn()
    return handle
  }

  /** Runs one job; a cancel rejects it with AnalysisCancelled at once. */
  async function run<T>(job: (api: WorkerHandle['api']) => Promise<T>): Promise<T> {
    if (busy.value) throw new Error('The analysis is still busy with the previous step.')
    busy.value = true
    fraction.value = 0
    try {
      const cancelled = new Promise<never>((_, reject) => {
        cancelCurrent = () => reject(new AnalysisCancelled())
      })
      return await Promise.race([job(current().api), cancelled])
    } finally {
      cancelCurrent = null
      busy.value = false
      stage.value = null
    }
  }

  async function ensureFrame(api: WorkerHandle['api']): Promise<void> {
    if (frameInWorker) return
    if (!loadedFile) throw new Error('No frame is loaded: import or take a photo first.')
    await api.loadFrame(loadedFile, onProgress)
    frameInWorker = true
  }

  async function loadFrame(file: Blob): Promise<FrameInfo> {
    loadedFile = null
    frameInWorker = false
    frame.value = null
    const info = await run((api) => api.loadFrame(file, onProgress))
    loadedFile = file
    frameInWorker = true
    frame.value = info
    return info
  }

  const withFrame = <T>(job: (api: WorkerHandle['api']) => Promise<T>) =>
    run(async (api) => {
      await ensureFrame(api)
      return job(api)
    })

  /** Stops the running job (if any) and throws the worker away. */
  function cancel(): void {
    handle?.terminate()
    handle = null
    frameInWorker = false
    cancelCurrent?.()
  }

  function dispose(): void {
    cancel()
    loadedFile = null
    frame.value = null
  }
  onScopeDispose(dispose)

  return {
    busy,
    stage,
    fraction,
    frame,
    loadFrame,
    findRegions: () => withFrame((api) => api.findRegions(onProgress)),
    measureRegions: (regions: RegionRequest[]) => {
      const plain = regions.map((r) => ({
        id: r.id,
        roi: plainRoi(r.roi),
        ...(r.orientation ? { orientation: r.orientation } : {}),
      }))
      return withFrame((api) => api.measureRegions(plain, onProgress))
    },
    restorePreview: (request: RestorationRequest) => {
      const plain = { ...request, roi: plainRoi(request.roi) }
      return withFrame((api) => api.restorePreview(plain))
    },
    cropPng: (roi: Roi) => {
      const plain = plainRoi(roi)
      return withFrame((api) => api.cropPng(plain))
    },
    cancel,
    dispose,
  }
}

export type AnalysisWorker = ReturnType<typeof useAnalysisWorker>
