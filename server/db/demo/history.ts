import type { CameraState, CheckMode } from '../../../shared/schemas/enums'
import type { cameras, checks, measurements } from '../schema'
import type { TaskDefault } from '../taskDefaults'
import type { DEMO_MODELS, DemoCamera } from './fleet'
import { demoMeasurements, judgeDemo, median } from './measure'
import type { Rng } from './random'

// Six months of checks per demo camera, generated from a seeded generator: the same on every run
// (dates are relative to the day the scenario is loaded, so dashboards always look current).

type CheckRow = typeof checks.$inferInsert & { capturedAt: Date; id: string }
type MeasurementRow = typeof measurements.$inferInsert
type CameraUpdate = Partial<typeof cameras.$inferInsert>

export const DAY_MS = 86_400_000

export interface CameraContext {
  id: number
  spec: DemoCamera
  task: TaskDefault
  model: (typeof DEMO_MODELS)[number]
  inspectorId: number
}

export interface DemoFailure {
  cameraId: number
  spec: DemoCamera
  task: TaskDefault
  failed: CheckRow
  /** The passing re-check that closed the order (repaired cameras only). */
  recheck?: CheckRow
}

export interface DemoHistory {
  checks: CheckRow[]
  measurements: MeasurementRow[]
  cameraUpdates: { id: number; set: CameraUpdate & { state: CameraState } }[]
  failures: DemoFailure[]
}

function atWorkingHour(rng: Rng, dayMs: number, hourFrom = 8, hourTo = 15): Date {
  const d = new Date(Math.floor(dayMs / DAY_MS) * DAY_MS)
  d.setUTCHours(rng.int(hourFrom, hourTo), rng.int(0, 59), rng.int(0, 59), 0)
  return d
}

/** Check dates: a commissioning baseline about six months ago, then one check per interval. */
function schedule(rng: Rng, nowMs: number, ctx: CameraContext): number[] {
  const interval = ctx.task.checkIntervalDays * DAY_MS
  const baseline = nowMs - (180 - rng.int(0, 20)) * DAY_MS
  let last: number
  if (ctx.spec.profile === 'failing') last = nowMs - rng.int(2, 12) * DAY_MS
  else if (ctx.spec.profile === 'overdue') last = nowMs - interval - rng.int(5, 30) * DAY_MS
  else last = nowMs - rng.int(1, Math.min(ctx.task.checkIntervalDays - 1, 40)) * DAY_MS
  if (last - baseline < 7 * DAY_MS) return [last]
  const dates: number[] = []
  for (let t = last; t > baseline + interval / 2; t -= interval) dates.push(t)
  return [baseline, ...dates.reverse()]
}

function ratioFor(rng: Rng, ctx: CameraContext, k: number, n: number): number {
  const noise = () => Math.min(1.05, rng.normal(1, 0.03))
  switch (ctx.spec.profile) {
    case 'drifting':
      return 1 - 0.25 * (k / (n - 1)) + rng.normal(0, 0.01)
    case 'failing':
      return k === n - 1 ? rng.between(0.45, 0.55) : noise()
    case 'repaired':
      return k === n - 2 ? rng.between(0.48, 0.56) : noise()
    default:
      return noise()
  }
}

export function buildHistory(rng: Rng, now: Date, cams: readonly CameraContext[]): DemoHistory {
  const nowMs = now.getTime()
  const out: DemoHistory = { checks: [], measurements: [], cameraUpdates: [], failures: [] }

  for (const ctx of cams) {
    const dates = schedule(rng, nowMs, ctx)
    const frame = { widthPx: ctx.model.sensorWidthPx, heightPx: ctx.model.sensorHeightPx }
    const designPd =
      (ctx.spec.focalLengthMm * 1e-3) / (ctx.model.pixelPitchUm * 1e-6 * ctx.spec.distanceM)
    const baselineTarget = ctx.model.sharpMtf50 * rng.between(0.95, 1.06)
    let baselineMtf50: number | null = null
    const camChecks: CheckRow[] = []

    const addCheck = (at: Date, target: number, mode: CheckMode, dayMtf50?: number): CheckRow => {
      const id = rng.uuid()
      const rows = demoMeasurements(rng, id, target, frame)
      const mtf50 = Number(median(rows.map((r) => r.mtf50CyPx)).toFixed(4))
      const pd = Number((designPd * rng.normal(1, 0.02)).toFixed(1))
      const isBaseline = baselineMtf50 === null
      const { verdict, reasons } = judgeDemo({
        mtf50CyPx: mtf50,
        minMtf50CyPx: ctx.task.minMtf50CyPx,
        marginalBand: 0.1,
        baselineMtf50CyPx: baselineMtf50,
        pixelDensityPxPerM: pd,
        requiredPxPerM: ctx.task.requiredPxPerM,
        mode,
        dayMtf50CyPx: dayMtf50,
      })
      const check: CheckRow = {
        id,
        cameraId: ctx.id,
        inspectorId: ctx.inspectorId,
        capturedAt: at,
        mode,
        verdict,
        reasons,
        medianMtf50CyPx: mtf50,
        pixelDensityPxPerM: pd,
        baselineRatio: baselineMtf50 ? Number((mtf50 / baselineMtf50).toFixed(3)) : 1,
        targetId: 'SF-A3-0042',
        notes: isBaseline
          ? 'Commissioning baseline.'
          : verdict === 'fail'
            ? 'Picture visibly soft on the monitor.'
            : null,
        isBaseline,
        deviceId: `demo-phone-${ctx.inspectorId}`,
        createdAt: at,
        syncedAt: new Date(at.getTime() + rng.int(5, 240) * 60_000),
      }
      if (isBaseline) baselineMtf50 = mtf50
      out.checks.push(check)
      out.measurements.push(...rows)
      camChecks.push(check)
      return check
    }

    dates.forEach((dayMs, k) => {
      const target = k === 0 ? baselineTarget : baselineTarget * ratioFor(rng, ctx, k, dates.length)
      const day = addCheck(atWorkingHour(rng, dayMs), target, 'day')
      if (ctx.spec.profile === 'ir_shift' && k >= dates.length - 2) {
        const night = atWorkingHour(rng, dayMs, 20, 22)
        addCheck(
          night,
          (day.medianMtf50CyPx ?? target) * rng.between(0.66, 0.74),
          'night',
          day.medianMtf50CyPx ?? undefined,
        )
      }
      if (ctx.spec.profile === 'repaired' && k === dates.length - 2) {
        const recheck = addCheck(
          atWorkingHour(rng, dayMs + 6 * DAY_MS),
          baselineTarget * rng.between(0.97, 1.02),
          'day',
        )
        out.failures.push({
          cameraId: ctx.id,
          spec: ctx.spec,
          task: ctx.task,
          failed: day,
          recheck,
        })
      }
    })

    const last = camChecks[camChecks.length - 1]
    const lastDay = [...camChecks].reverse().find((c) => c.mode === 'day') ?? last
    if (ctx.spec.profile === 'failing') {
      out.failures.push({ cameraId: ctx.id, spec: ctx.spec, task: ctx.task, failed: last })
    }
    const nextDueAt = new Date(lastDay.capturedAt.getTime() + ctx.task.checkIntervalDays * DAY_MS)
    const state: CameraState =
      last.verdict === 'fail' ? 'failing' : nextDueAt.getTime() < nowMs ? 'due' : 'ok'
    out.cameraUpdates.push({
      id: ctx.id,
      set: {
        baselineCheckId: camChecks[0].id,
        lastCheckId: last.id,
        lastCheckAt: last.capturedAt,
        lastVerdict: last.verdict,
        lastMtf50CyPx: last.medianMtf50CyPx,
        nextDueAt,
        state,
      },
    })
  }
  return out
}
