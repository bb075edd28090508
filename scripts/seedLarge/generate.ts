// Generated rows for the large scale data set: sites, models, cameras with a check history.
// Deterministic (seeded) so two runs make the same fleet.
import { TASK_DEFAULTS } from '../../server/db/taskDefaults'

const DAY_MS = 86_400_000

/** mulberry32: a small seeded generator. */
export function rng(seed: number): () => number {
  let a = seed >>> 0
  return () => {
    a = (a + 0x6d2b79f5) >>> 0
    let t = a
    t = Math.imul(t ^ (t >>> 15), t | 1)
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61)
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296
  }
}

export const MODEL_SPECS = [
  {
    name: 'Scale test dome 2 MP',
    w: 1920,
    h: 1080,
    pitch: 2.9,
    fMin: 2.8,
    fMax: 12,
    n: 1.6,
    sharp: 0.31,
  },
  {
    name: 'Scale test bullet 4 MP',
    w: 2688,
    h: 1520,
    pitch: 2.0,
    fMin: 2.8,
    fMax: 12,
    n: 1.4,
    sharp: 0.3,
  },
  {
    name: 'Scale test plate 2 MP',
    w: 1920,
    h: 1080,
    pitch: 2.9,
    fMin: 5,
    fMax: 50,
    n: 1.6,
    sharp: 0.33,
  },
  {
    name: 'Scale test machine 5 MP',
    w: 2448,
    h: 2048,
    pitch: 3.45,
    fMin: 16,
    fMax: 16,
    n: 2.8,
    sharp: 0.36,
  },
  {
    name: 'Scale test fisheye 5 MP',
    w: 2560,
    h: 1920,
    pitch: 2.0,
    fMin: 1.4,
    fMax: 1.4,
    n: 2,
    sharp: 0.27,
  },
  {
    name: 'Scale test PTZ 2 MP',
    w: 1920,
    h: 1080,
    pitch: 2.9,
    fMin: 4.5,
    fMax: 135,
    n: 1.6,
    sharp: 0.29,
  },
  {
    name: 'Scale test turret 8 MP',
    w: 3840,
    h: 2160,
    pitch: 2.0,
    fMin: 2.8,
    fMax: 8,
    n: 1.8,
    sharp: 0.28,
  },
  {
    name: 'Scale test box 3 MP',
    w: 2048,
    h: 1536,
    pitch: 2.5,
    fMin: 3,
    fMax: 10,
    n: 1.4,
    sharp: 0.3,
  },
] as const

let serial = 0
/**
 * A UUID (version 7 layout) whose leading digits count up, so rows go into the primary-key
 * B-tree in order (random v4 keys make a large load thrash the buffer pool).
 */
export function orderedUuid(random: () => number): string {
  const head = (++serial).toString(16).padStart(12, '0')
  let tail = ''
  for (let i = 0; i < 12; i++) tail += Math.floor(random() * 16).toString(16)
  return `${head.slice(0, 8)}-${head.slice(8, 12)}-7000-8000-${tail}`
}

/** A Gaussian-blur MTF curve, exp(-2π²σ²f²) with σ = 0.187391/MTF50, 0 to 0.5 c/px. */
function curve(mtf50: number): [number, number][] {
  const s = 0.187391 / mtf50
  const out: [number, number][] = []
  for (let i = 0; i <= 10; i++) {
    const f = i * 0.05
    out.push([f, Number(Math.exp(-2 * Math.PI ** 2 * s * s * f * f).toFixed(4))])
  }
  return out
}

export interface CameraRow {
  values: unknown[]
}

export const CAMERA_COLUMNS = [
  'asset_tag',
  'site_id',
  'location_text',
  'camera_model_id',
  'task_id',
  'state',
  'last_check_id',
  'last_check_at',
  'last_verdict',
  'last_mtf50_cy_px',
  'next_due_at',
  'active',
] as const
export const CHECK_COLUMNS = [
  'id',
  'camera_id',
  'inspector_id',
  'captured_at',
  'mode',
  'verdict',
  'reasons',
  'median_mtf50_cy_px',
  'pixel_density_px_per_m',
  'baseline_ratio',
  'device_id',
  'synced_at',
] as const
export const MEASUREMENT_COLUMNS = [
  'id',
  'check_id',
  'roi_x',
  'roi_y',
  'roi_w',
  'roi_h',
  'orientation',
  'angle_deg',
  'mtf50_cy_px',
  'mtf10_cy_px',
  'psf_model',
  'sigma_px',
  'mtf_curve',
  'warnings',
] as const

export interface Batch {
  cameras: unknown[][]
  checks: unknown[][]
  measurements: unknown[][]
}

/**
 * Cameras `first`…`first + count − 1` with their checks: each camera gets `perCamera`
 * measurements spread over 2 to 5 checks, one task interval apart, the newest recent.
 */
export function cameraBatch(opts: {
  first: number
  count: number
  /** Cameras in the whole data set (to spread them evenly over the sites). */
  total: number
  firstCameraId: number
  perCamera: number
  siteIds: number[]
  modelIds: number[]
  inspectorIds: number[]
  now: Date
  random: () => number
}): Batch {
  const { random: r, now } = opts
  const out: Batch = { cameras: [], checks: [], measurements: [] }
  for (let i = 0; i < opts.count; i++) {
    const n = opts.first + i
    const cameraId = opts.firstCameraId + i
    const task = TASK_DEFAULTS[Math.floor(r() * TASK_DEFAULTS.length)]
    const modelIndex = Math.floor(r() * MODEL_SPECS.length)
    const sharp = MODEL_SPECS[modelIndex].sharp
    const siteId = opts.siteIds[Math.floor((n * opts.siteIds.length) / opts.total)]
    const nChecks = 2 + Math.floor(r() * 4)
    // Split perCamera measurements over the checks (at least one each).
    const per = Array.from({ length: nChecks }, () => 1)
    for (let k = nChecks; k < opts.perCamera; k++) per[Math.floor(r() * nChecks)]++
    // Checks recur at the task's interval; the newest is at most 1.12 intervals old, so about
    // one camera in ten is overdue, as in a fleet that is mostly kept up.
    const intervalMs = task.checkIntervalDays * DAY_MS
    const lastAt = now.getTime() - 3_600_000 - r() * intervalMs * 1.12
    let last: { id: string; at: Date; verdict: string; mtf: number } | null = null
    let lastDay: Date | null = null
    for (let k = 0; k < nChecks; k++) {
      const back = nChecks - 1 - k
      const at = new Date(lastAt - back * intervalMs * (0.9 + r() * 0.2))
      const roll = r()
      const verdict = roll < 0.06 ? 'fail' : roll < 0.15 ? 'marginal' : 'pass'
      const mtf = Number(
        (verdict === 'fail'
          ? sharp * (0.35 + r() * 0.3)
          : verdict === 'marginal'
            ? task.minMtf50CyPx * (0.9 + r() * 0.1)
            : sharp * (0.85 + r() * 0.2)
        ).toFixed(4),
      )
      const mode = back > 0 && r() < 0.15 ? 'night' : 'day'
      const id = orderedUuid(r)
      out.checks.push([
        id,
        cameraId,
        opts.inspectorIds[Math.floor(r() * opts.inspectorIds.length)],
        at,
        mode,
        verdict,
        JSON.stringify([{ code: 'sharpness', text: `Median MTF50 ${mtf} cycles/pixel.` }]),
        mtf,
        Math.round(task.requiredPxPerM * (1 + r())),
        Number((0.7 + r() * 0.4).toFixed(3)),
        'scale-seed',
        at,
      ])
      for (let e = 0; e < per[k]; e++) {
        const m = Number((mtf * (0.96 + r() * 0.08)).toFixed(4))
        out.measurements.push([
          orderedUuid(r),
          id,
          100 + e * 150,
          200,
          96,
          128,
          e % 2 ? 'horizontal' : 'vertical',
          Number((4 + r() * 3).toFixed(2)) * (e % 3 === 2 ? -1 : 1),
          m,
          Number((m * 1.8226).toFixed(4)),
          'gaussian',
          Number((0.187391 / m).toFixed(4)),
          JSON.stringify(curve(m)),
          '[]',
        ])
      }
      last = { id, at, verdict, mtf }
      if (mode === 'day') lastDay = at
    }
    const nextDueAt = new Date((lastDay ?? last!.at).getTime() + task.checkIntervalDays * DAY_MS)
    const state = last!.verdict === 'fail' ? 'failing' : nextDueAt < now ? 'due' : 'ok'
    out.cameras.push([
      `SCALE-${String(n + 1).padStart(6, '0')}`,
      siteId,
      `Pole ${(n % 40) + 1}, bay ${(n % 7) + 1}`,
      opts.modelIds[modelIndex],
      task.id,
      state,
      last!.id,
      last!.at,
      last!.verdict,
      last!.mtf,
      nextDueAt,
      r() < 0.01 ? 0 : 1,
    ])
  }
  return out
}
