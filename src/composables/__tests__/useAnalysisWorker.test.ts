import { describe, expect, it } from 'vitest'
import { effectScope, reactive } from 'vue'
import { inProcessWorker } from '@/workers/core/__tests__/inProcessWorker'
import type { AnalysisWorkerApi } from '@/workers/types'
import { encodePngGrey, renderTargetFrame } from '../../../tests/fixtures/edges/render'
import {
  AnalysisCancelled,
  plainRoi,
  useAnalysisWorker,
  type WorkerHandle,
} from '../useAnalysisWorker'

// The page's handle on the worker, with the worker's functions run in-process.

const target = renderTargetFrame({ width: 1280, height: 800, sigmaPx: 2, sheetFraction: 0.62 })
const png = new Blob([new Uint8Array(encodePngGrey(1280, 800, target.codes))], {
  type: 'image/png',
})

function withSpawner(wrap?: (api: AnalysisWorkerApi) => AnalysisWorkerApi) {
  const stats = { loads: 0, terminated: 0, spawned: 0 }
  const spawn = (): WorkerHandle => {
    stats.spawned++
    const h = inProcessWorker(stats)
    return { api: wrap ? wrap(h.api) : h.api, terminate: h.terminate }
  }
  const scope = effectScope()
  const worker = scope.run(() => useAnalysisWorker(spawn))!
  return { worker, stats, scope }
}

describe('the analysis worker handle', () => {
  it('loads a frame, reports progress, finds and measures its edges', async () => {
    const { worker } = withSpawner()
    const info = await worker.loadFrame(png)
    expect(info).toMatchObject({ width: 1280, height: 800 })
    expect(worker.frame.value?.width).toBe(1280)
    expect(worker.fraction.value).toBe(1)
    const found = await worker.findRegions()
    expect(found.length).toBeGreaterThanOrEqual(8)
    const out = await worker.measureRegions(found.map((f, i) => ({ id: String(i), roi: f.roi })))
    expect(out.every((o) => o.ok)).toBe(true)
    expect(worker.busy.value).toBe(false)
  })

  it('cancels a running job at once, throws the worker away, and reloads the frame next time', async () => {
    let release: () => void = () => {}
    const { worker, stats } = withSpawner((api) => ({
      ...api,
      findRegions: (p) => new Promise((resolve) => (release = () => resolve(api.findRegions(p)))),
    }))
    await worker.loadFrame(png)
    const job = worker.findRegions()
    expect(worker.busy.value).toBe(true)
    worker.cancel()
    await expect(job).rejects.toBeInstanceOf(AnalysisCancelled)
    expect(worker.busy.value).toBe(false)
    expect(stats.terminated).toBe(1)
    release()

    const again = worker.measureRegions([{ id: 'a', roi: { x: 331, y: 235, w: 162, h: 100 } }])
    release()
    const [o] = await again
    expect(o.ok).toBe(true)
    expect(stats.spawned).toBe(2)
    expect(stats.loads).toBe(2)
  })

  it('refuses a second job while one runs, and a job before any frame', async () => {
    const { worker } = withSpawner()
    await expect(worker.findRegions()).rejects.toThrow(/No frame is loaded/)
    const load = worker.loadFrame(png)
    await expect(worker.findRegions()).rejects.toThrow(/still busy/)
    await load
  })

  it('sends plain copies of reactive regions (a proxy cannot cross to a worker)', () => {
    const roi = reactive({ x: 1, y: 2, w: 3, h: 4 })
    const copy = plainRoi(roi)
    expect(copy).toEqual({ x: 1, y: 2, w: 3, h: 4 })
    expect(() => structuredClone(copy)).not.toThrow()
    expect(() => structuredClone(roi)).toThrow()
  })
})
