// The check in progress: frame → regions → result → save. It owns the analysis worker, so the
// frame stays loaded while the inspector moves between steps.
import { defineStore } from 'pinia'
import { computed, ref, shallowRef } from 'vue'
import type { CheckMode } from '@shared/schemas/enums'
import { buildReport, type CheckContext } from '@/components/check/logic/report'
import { lineLengthPx, type ScaleMeasure } from '@/components/check/logic/density'
import type { RegionState } from '@/components/check/logic/regionRules'
import { buildBundle } from '@/components/check/logic/bundle'
import { restorationRequestOf } from '@/components/check/logic/restorationSource'
import {
  AnalysisCancelled,
  spawnAnalysisWorker,
  useAnalysisWorker,
  type WorkerHandle,
} from '@/composables/useAnalysisWorker'
import type { AcceptedFrame } from '@/composables/useFrameCapture'
import type { ScaleLine } from '@/composables/useRegionEditor'
import type { RestorationPreview } from '@/workers/types'
import { useAuthStore } from './auth'
import { useCamerasStore } from './cameras'
import { useRegionEdits } from './checkRegions'
import { useChecksStore } from './checks'

export type CheckStep = 'frame' | 'regions' | 'result'
export type CheckPhase = 'idle' | 'analysing' | 'measuring' | 'restoring' | 'saving'

let spawner: () => WorkerHandle = spawnAnalysisWorker
/** Tests run the worker's functions in-process. */
export function setAnalysisWorkerSpawner(spawn: () => WorkerHandle): void {
  spawner = spawn
}

export const useCheckStore = defineStore('check', () => {
  const auth = useAuthStore()
  const cameras = useCamerasStore()
  const checks = useChecksStore()
  const worker = useAnalysisWorker(() => spawner())

  const checkId = ref<string>('')
  const cameraId = ref<number | null>(null)
  const roundId = ref<number | null>(null)
  const base = shallowRef<Omit<CheckContext, 'otherModeMtf50CyPx'> | null>(null)
  const dayNightMtf50 = ref<{ day: number | null; night: number | null }>({
    day: null,
    night: null,
  })
  const step = ref<CheckStep>('frame')
  const phase = ref<CheckPhase>('idle')
  const error = ref<string | null>(null)
  const mode = ref<CheckMode>('day')
  const notes = ref('')
  const exposureNote = ref('')
  const lensNote = ref('')
  const targetId = ref('')
  const targetWidthMm = ref<number | null>(null)
  const frame = shallowRef<AcceptedFrame | null>(null)
  const capturedAt = ref<string | null>(null)
  const regions = ref<RegionState[]>([])
  const scaleLine = ref<ScaleLine | null>(null)
  const scalePrintedMm = ref<number | null>(null)
  const shareFrame = ref(false)
  const markAsBaseline = ref(false)
  const restoration = shallowRef<RestorationPreview | null>(null)
  const restorationError = ref<string | null>(null)

  const context = computed<CheckContext | null>(() =>
    base.value
      ? {
          ...base.value,
          otherModeMtf50CyPx:
            mode.value === 'night' ? dayNightMtf50.value.day : dayNightMtf50.value.night,
        }
      : null,
  )
  const scale = computed<ScaleMeasure | null>(() =>
    scaleLine.value && scalePrintedMm.value
      ? { lengthPx: lineLengthPx(scaleLine.value), printedMm: scalePrintedMm.value }
      : null,
  )
  const report = computed(() =>
    context.value && regions.value.some((r) => r.status === 'measured')
      ? buildReport(regions.value, mode.value, context.value, scale.value)
      : null,
  )
  const canMarkBaseline = computed(() => {
    if (auth.role === 'supervisor') return true
    const camera = base.value?.camera
    return (
      auth.role === 'inspector' &&
      !!camera &&
      !camera.baselineCheckId &&
      !base.value?.baselineMtf50CyPx
    )
  })
  const saveBlocker = computed(() => {
    if (!report.value && !regions.value.some((r) => r.status === 'failed')) {
      return 'Measure at least one edge first.'
    }
    if (!report.value || report.value.verdict.verdict === 'inconclusive') {
      return 'No edge could be measured, so there is no verdict to save. Adjust or draw a region, or retake the frame.'
    }
    return null
  })

  function resetFrame(): void {
    frame.value = null
    capturedAt.value = null
    regions.value = []
    scaleLine.value = null
    restoration.value = null
    restorationError.value = null
    error.value = null
  }

  async function begin(id: number, round: number | null = null): Promise<boolean> {
    worker.cancel()
    resetFrame()
    checkId.value = crypto.randomUUID()
    cameraId.value = id
    roundId.value = round
    step.value = 'frame'
    phase.value = 'idle'
    notes.value = exposureNote.value = lensNote.value = ''
    shareFrame.value = markAsBaseline.value = false
    base.value = null
    await cameras.loadCached()
    const camera = cameras.cameraById.get(id)
    if (!camera) {
      error.value = 'This camera is not on this device. Connect once to download the camera list.'
      return false
    }
    await Promise.all([checks.loadModels(), checks.loadCamera(id)])
    const baseline = await checks.baselineFor(camera)
    base.value = {
      camera,
      task: cameras.taskById.get(camera.taskId) ?? null,
      model: checks.modelFor(camera),
      baselineMtf50CyPx: baseline.mtf50CyPx,
    }
    dayNightMtf50.value = {
      day: checks.latestMtf50(id, 'day'),
      night: checks.latestMtf50(id, 'night'),
    }
    return true
  }

  const edits = useRegionEdits(regions, worker, {
    run: (what, job) => run(what, job),
    changed: () => (restoration.value = null),
  })
  const { queue, newRegion, measure } = edits

  async function run(what: CheckPhase, job: () => Promise<void>): Promise<boolean> {
    phase.value = what
    error.value = null
    try {
      await job()
      return true
    } catch (e) {
      if (!(e instanceof AnalysisCancelled)) error.value = (e as Error).message
      return false
    } finally {
      phase.value = 'idle'
    }
  }

  /** Loads the frame, finds its edges and measures them; then the regions step. */
  function importFrame(accepted: AcceptedFrame): Promise<boolean> {
    resetFrame()
    return run('analysing', async () => {
      await queue(() => worker.loadFrame(accepted.file))
      frame.value = accepted
      capturedAt.value = new Date().toISOString()
      const found = await queue(() => worker.findRegions())
      regions.value = found.map((f) => newRegion(f.roi, 'found', f.orientation))
      if (regions.value.length) await measure(regions.value.map((r) => r.id))
      step.value = 'regions'
    })
  }

  function cancel(): void {
    worker.cancel()
    edits.stop()
  }

  function restore(method: RestorationPreview['method']): Promise<boolean> {
    const rep = regions.value.find((r) => r.id === report.value?.representativeId)
    const m = rep?.measurement
    if (!m) return Promise.resolve(false)
    restorationError.value = null
    return run('restoring', async () => {
      try {
        restoration.value = await queue(() =>
          worker.restorePreview(restorationRequestOf(m, m.roi, method)),
        )
      } catch (e) {
        if (e instanceof AnalysisCancelled) throw e
        restorationError.value = (e as Error).message
      }
    })
  }

  /** Saves to the device and queues it for the server; returns the check's id. */
  async function save(): Promise<string | null> {
    const r = report.value
    const ctx = context.value
    if (saveBlocker.value || !r || !ctx || !frame.value || !auth.user || !capturedAt.value)
      return null
    let savedId: string | null = null
    await run('saving', async () => {
      const bundle = await buildBundle({
        id: checkId.value,
        userId: auth.user!.id,
        roundId: roundId.value,
        capturedAt: capturedAt.value!,
        mode: mode.value,
        report: r,
        regions: regions.value,
        frame: frame.value!,
        frameSize: worker.frame.value,
        notes: { notes: notes.value, exposureNote: exposureNote.value, lensNote: lensNote.value },
        target: { id: targetId.value, widthMm: targetWidthMm.value },
        shareFrame: shareFrame.value,
        isBaseline: markAsBaseline.value && canMarkBaseline.value,
        cameraId: ctx.camera.id,
        otherModeMtf50CyPx: ctx.otherModeMtf50CyPx,
        crop: (roi) => queue(() => worker.cropPng(roi)),
      })
      try {
        await checks.saveCheck(bundle, ctx.camera.version)
      } catch (e) {
        throw new Error(
          `The check could not be saved on this device (${(e as Error).message}). Nothing is lost yet: try Save again.`,
        )
      }
      savedId = bundle.check.id
    })
    if (savedId) {
      // A next check of the same camera must not overwrite this one.
      checkId.value = crypto.randomUUID()
      worker.dispose()
      resetFrame()
      step.value = 'frame'
    }
    return savedId
  }

  return {
    checkId,
    cameraId,
    context,
    step,
    phase,
    error,
    mode,
    notes,
    exposureNote,
    lensNote,
    targetId,
    targetWidthMm,
    frame,
    regions,
    scaleLine,
    scalePrintedMm,
    shareFrame,
    markAsBaseline,
    restoration,
    restorationError,
    report,
    canMarkBaseline,
    saveBlocker,
    progress: worker.fraction,
    stage: worker.stage,
    frameInfo: worker.frame,
    begin,
    importFrame,
    cancel,
    toggleRegion: edits.toggle,
    adjustRegion: edits.adjust,
    addRegion: edits.add,
    removeRegion: edits.remove,
    restore,
    save,
    resetFrame,
  }
})
