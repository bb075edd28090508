// The restoration preview of a saved check, on the device where it was made: the kept pixels
// of its representative region go into an analysis worker of its own and are restored with the
// measured kernel, exactly as during the check. The worker goes away with the page.
import { computed, ref, shallowRef, watch, type Ref } from 'vue'
import {
  AnalysisCancelled,
  spawnAnalysisWorker,
  useAnalysisWorker,
  type WorkerHandle,
} from '@/composables/useAnalysisWorker'
import type { CheckBundle } from '@/db/checkRecords'
import type { RestorationPreview } from '@/workers/types'
import { restorationRequestOf, restorationSourceOf } from './logic/restorationSource'

export function useSavedRestoration(
  bundle: Ref<CheckBundle | null>,
  spawn: () => WorkerHandle = spawnAnalysisWorker,
) {
  const worker = useAnalysisWorker(spawn)
  const source = computed(() => (bundle.value ? restorationSourceOf(bundle.value) : null))
  const preview = shallowRef<RestorationPreview | null>(null)
  const error = ref<string | null>(null)
  const busy = ref(false)
  let loaded: Blob | null = null

  watch(source, () => {
    preview.value = null
    error.value = null
    loaded = null
  })

  async function restore(method: RestorationPreview['method']): Promise<boolean> {
    const s = source.value
    if (!s?.available || busy.value) return false
    busy.value = true
    error.value = null
    try {
      if (loaded !== s.image) {
        try {
          await worker.loadFrame(s.image)
        } catch (e) {
          if (e instanceof AnalysisCancelled) throw e
          throw new Error(
            `The saved ${s.from === 'crop' ? 'region' : 'frame'} could not be read on this device: ${(e as Error).message}`,
          )
        }
        loaded = s.image
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
