// The restoration preview of a saved check: the kept pixels of one measured region go into an
// analysis worker of its own and are restored with the measured kernel, exactly as during the
// check. On the device where the check was made the pixels are its kept crop (or frame); on a
// supervisor's screen they are the region crop the inspector uploaded. The worker goes away
// with the page.
import { computed, ref, shallowRef, watch, type Ref } from 'vue'
import {
  AnalysisCancelled,
  spawnAnalysisWorker,
  useAnalysisWorker,
  type WorkerHandle,
} from '@/composables/useAnalysisWorker'
import type { CheckBundle } from '@/db/checkRecords'
import type { RestorationPreview } from '@/workers/types'
import {
  restorationRequestOf,
  restorationSourceOf,
  type RestorationSource,
} from './logic/restorationSource'

const PIXELS_NAMED: Record<Extract<RestorationSource, { available: true }>['from'], string> = {
  crop: 'saved region',
  frame: 'saved frame',
  upload: 'uploaded region',
}

/** Restores the pixels of `source` on request; a new source clears the last preview. */
export function useRestoration(
  source: Ref<RestorationSource | null>,
  spawn: () => WorkerHandle = spawnAnalysisWorker,
) {
  const worker = useAnalysisWorker(spawn)
  const preview = shallowRef<RestorationPreview | null>(null)
  const error = ref<string | null>(null)
  const busy = ref(false)
  let loaded: RestorationSource | null = null

  watch(source, () => {
    preview.value = null
    error.value = null
    loaded = null
  })

  async function load(s: Extract<RestorationSource, { available: true }>): Promise<void> {
    let image: Blob
    try {
      image = typeof s.image === 'function' ? await s.image() : s.image
    } catch (e) {
      throw new Error(
        `The ${PIXELS_NAMED[s.from]} could not be fetched from the server: ${(e as Error).message}`,
      )
    }
    try {
      await worker.loadFrame(image)
    } catch (e) {
      if (e instanceof AnalysisCancelled) throw e
      throw new Error(
        `The ${PIXELS_NAMED[s.from]} could not be read on this device: ${(e as Error).message}`,
      )
    }
  }

  async function restore(method: RestorationPreview['method']): Promise<boolean> {
    const s = source.value
    if (!s?.available || busy.value) return false
    busy.value = true
    error.value = null
    try {
      if (loaded !== s) {
        await load(s)
        loaded = s
      }
      preview.value = await worker.restorePreview(
        restorationRequestOf(s.measurement, s.roi, method),
      )
      return true
    } catch (e) {
      if (!(e instanceof AnalysisCancelled)) error.value = (e as Error).message
      return false
    } finally {
      busy.value = false
    }
  }

  return { source, preview, error, busy, restore }
}

/** The preview of a check saved on this device, from the pixels it kept. */
export function useSavedRestoration(
  bundle: Ref<CheckBundle | null>,
  spawn: () => WorkerHandle = spawnAnalysisWorker,
) {
  return useRestoration(
    computed(() => (bundle.value ? restorationSourceOf(bundle.value) : null)),
    spawn,
  )
}
