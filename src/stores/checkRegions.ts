// The regions of the check in progress: measuring them in the worker one job at a time, turning
// them on and off, adjusting, drawing and removing them. Used by the check store.
import type { Ref } from 'vue'
import type { Roi } from '@shared/analysis'
import type { RegionState } from '@/components/check/logic/regionRules'
import type { AnalysisWorker } from '@/composables/useAnalysisWorker'
import type { CheckPhase } from './check'

export interface RegionEditHooks {
  /** Runs a job as a phase of the check (progress, error message). */
  run(what: CheckPhase, job: () => Promise<void>): Promise<boolean>
  /** Something measured changed (the restoration preview is then out of date). */
  changed(): void
}

export function useRegionEdits(
  regions: Ref<RegionState[]>,
  worker: AnalysisWorker,
  hooks: RegionEditHooks,
) {
  // One worker job at a time; later requests wait their turn.
  let chain: Promise<unknown> = Promise.resolve()
  function queue<T>(job: () => Promise<T>): Promise<T> {
    const next = chain.then(job, job)
    chain = next.catch(() => undefined)
    return next
  }

  function newRegion(
    roi: Roi,
    source: RegionState['source'],
    orientation?: RegionState['orientation'],
  ): RegionState {
    return {
      id: crypto.randomUUID(),
      roi,
      ...(orientation ? { orientation } : {}),
      source,
      enabled: true,
      status: 'measuring',
      measurement: null,
      profile: null,
      error: null,
    }
  }

  async function measure(ids: string[]): Promise<void> {
    const wanted = regions.value.filter((r) => ids.includes(r.id))
    wanted.forEach((r) => (r.status = 'measuring'))
    const outcomes = await queue(() =>
      worker.measureRegions(wanted.map(({ id, roi, orientation }) => ({ id, roi, orientation }))),
    )
    for (const o of outcomes) {
      const r = regions.value.find((x) => x.id === o.id)
      if (!r) continue
      r.roi = o.roi
      r.status = o.ok ? 'measured' : 'failed'
      r.measurement = o.ok ? o.measurement : null
      r.profile = o.ok ? o.profile : null
      r.error = o.ok ? null : o.error
      if (o.ok) r.orientation = o.measurement.orientation
    }
    hooks.changed()
  }

  /** After a cancel: forget waiting jobs; regions being measured keep what they had. */
  function stop(): void {
    chain = Promise.resolve()
    regions.value.forEach((r) => {
      if (r.status === 'measuring') r.status = r.measurement ? 'measured' : 'pending'
    })
  }

  function toggle(id: string): void {
    const r = regions.value.find((x) => x.id === id)
    if (r) r.enabled = !r.enabled
  }

  function adjust(id: string, roi: Roi): Promise<boolean> {
    const r = regions.value.find((x) => x.id === id)
    if (!r) return Promise.resolve(false)
    r.roi = roi
    r.enabled = true
    return hooks.run('measuring', () => measure([id]))
  }

  function add(roi: Roi): Promise<boolean> {
    const r = newRegion(roi, 'manual')
    regions.value.push(r)
    return hooks.run('measuring', () => measure([r.id]))
  }

  function remove(id: string): void {
    regions.value = regions.value.filter((r) => r.id !== id)
    hooks.changed()
  }

  return { queue, newRegion, measure, stop, toggle, adjust, add, remove }
}
