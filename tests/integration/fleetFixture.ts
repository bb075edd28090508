// A small fleet with a known history, for the fleet, report and round tests. The clock is fixed
// (NOW) so every expected count can be worked out by hand from the table below.
//
// camera  site   task       model   active  checks (UTC)                               nextDueAt
// N1      North  recognise  Alpha   yes     05-01 pass 0.305, 06-01 (Sun) fail 0.12    08-30
// N2      North  recognise  Alpha   yes     06-10 pass 0.31                            09-08
// N3      North  identify   Bravo   yes     04-01 marginal 0.19                        05-31 (overdue)
// S1      South  detect     Bravo   yes     2024-12-01 pass 0.28                       05-30 (overdue)
// S2      South  detect     Alpha   yes     none                                       none
// S3      South  detect     Alpha   retired 06-05 fail 0.10                            none
import { randomUUID } from 'node:crypto'
import { eq } from 'drizzle-orm'
import type { Db } from '../../server/db/client'
import { cameraModels, cameras, checks, measurements, sites, tasks } from '../../server/db/schema'
import { TASK_DEFAULTS } from '../../server/db/taskDefaults'
import type { MtfPoint } from '../../shared/schemas/checks'
import type { CheckMode, Verdict } from '../../shared/schemas/enums'
import { createUser } from './helpers/app'
import type { TestUser } from './helpers/app'

export const NOW = new Date('2025-06-15T12:00:00.000Z')
export const now = () => NOW

/** Gaussian blur MTF, exp(-2π²σ²f²), with σ from MTF50·σ = 0.187391 (DOMAIN.md [calc]). */
export function gaussianCurve(mtf50CyPx: number): MtfPoint[] {
  const sigma = 0.187391 / mtf50CyPx
  return Array.from({ length: 26 }, (_, i) => {
    const f = i * 0.02
    return [f, Math.exp(-2 * Math.PI ** 2 * sigma ** 2 * f ** 2)] as MtfPoint
  })
}

interface CheckSpec {
  at: string
  verdict: Verdict
  mtf: number
  mode?: CheckMode
  notes?: string
  targetId?: string
}

interface CameraSpec {
  tag: string
  site: 'north' | 'south'
  task: string
  model: 'alpha' | 'bravo'
  active: boolean
  location: string
  nextDueAt: string | null
  checks: CheckSpec[]
}

export const FIXTURE: CameraSpec[] = [
  {
    tag: 'N1',
    site: 'north',
    task: 'recognise',
    model: 'alpha',
    active: true,
    location: 'Main gate',
    nextDueAt: '2025-08-30T09:00:00Z',
    checks: [
      { at: '2025-05-01T10:00:00Z', verdict: 'pass', mtf: 0.305, targetId: '@T-7' },
      {
        at: '2025-06-01T09:00:00Z',
        verdict: 'fail',
        mtf: 0.12,
        notes: '=HYPERLINK("http://example.test","click")\nsecond line',
      },
    ],
  },
  {
    tag: 'N2',
    site: 'north',
    task: 'recognise',
    model: 'alpha',
    active: true,
    location: '-north mast',
    nextDueAt: '2025-09-08T08:00:00Z',
    checks: [{ at: '2025-06-10T08:00:00Z', verdict: 'pass', mtf: 0.31 }],
  },
  {
    tag: 'N3',
    site: 'north',
    task: 'identify',
    model: 'bravo',
    active: true,
    location: 'Ticket hall',
    nextDueAt: '2025-05-31T00:00:00Z',
    checks: [{ at: '2025-04-01T12:00:00Z', verdict: 'marginal', mtf: 0.19, mode: 'night' }],
  },
  {
    tag: 'S1',
    site: 'south',
    task: 'detect',
    model: 'bravo',
    active: true,
    location: 'Fence east',
    nextDueAt: '2025-05-30T00:00:00Z',
    checks: [{ at: '2024-12-01T12:00:00Z', verdict: 'pass', mtf: 0.28 }],
  },
  {
    tag: 'S2',
    site: 'south',
    task: 'detect',
    model: 'alpha',
    active: true,
    location: 'Fence west',
    nextDueAt: null,
    checks: [],
  },
  {
    tag: 'S3',
    site: 'south',
    task: 'detect',
    model: 'alpha',
    active: false,
    location: 'Old gate',
    nextDueAt: null,
    checks: [{ at: '2025-06-05T12:00:00Z', verdict: 'fail', mtf: 0.1 }],
  },
]

export interface Fleet {
  siteIds: { north: number; south: number }
  modelIds: { alpha: number; bravo: number }
  cameraIds: Record<string, number>
  /** Check ids by camera tag, in the order listed above. */
  checkIds: Record<string, string[]>
  inspector: TestUser
}

export async function seedFleet(db: Db): Promise<Fleet> {
  await db.insert(tasks).values(TASK_DEFAULTS.map((t, i) => ({ ...t, sortOrder: i })))
  const [north] = await db
    .insert(sites)
    .values({ name: 'North Depot', address: '1 Test Road', timeZone: 'Europe/London' })
    .$returningId()
  const [south] = await db.insert(sites).values({ name: 'South Yard' }).$returningId()
  const model = (name: string) => ({
    name,
    sensorWidthPx: 1920,
    sensorHeightPx: 1080,
    pixelPitchUm: 2.9,
    focalLengthMinMm: 2.8,
    focalLengthMaxMm: 12,
    fNumber: 1.6,
  })
  const [alpha] = await db.insert(cameraModels).values(model('Alpha dome')).$returningId()
  const [bravo] = await db.insert(cameraModels).values(model('Bravo bullet')).$returningId()
  const inspector = await createUser(db, 'inspector', { name: 'Ida Inspector' })
  const siteIds = { north: north.id, south: south.id }
  const modelIds = { alpha: alpha.id, bravo: bravo.id }
  const cameraIds: Record<string, number> = {}
  const checkIds: Record<string, string[]> = {}
  for (const spec of FIXTURE) {
    const latest = spec.checks.at(-1)
    const [row] = await db
      .insert(cameras)
      .values({
        assetTag: spec.tag,
        siteId: siteIds[spec.site],
        locationText: spec.location,
        cameraModelId: modelIds[spec.model],
        taskId: spec.task,
        active: spec.active,
        nextDueAt: spec.nextDueAt ? new Date(spec.nextDueAt) : null,
        state:
          latest?.verdict === 'fail'
            ? 'failing'
            : spec.nextDueAt && new Date(spec.nextDueAt) < NOW
              ? 'due'
              : latest
                ? 'ok'
                : 'due',
      })
      .$returningId()
    cameraIds[spec.tag] = row.id
    checkIds[spec.tag] = []
    for (const c of spec.checks) {
      const id = randomUUID()
      checkIds[spec.tag].push(id)
      await db.insert(checks).values({
        id,
        cameraId: row.id,
        inspectorId: inspector.id,
        capturedAt: new Date(c.at),
        mode: c.mode ?? 'day',
        verdict: c.verdict,
        reasons: [{ code: 'sharpness', text: `Median MTF50 ${c.mtf} cycles/pixel.` }],
        medianMtf50CyPx: c.mtf,
        pixelDensityPxPerM: 180,
        baselineRatio: 0.9,
        targetId: c.targetId ?? null,
        notes: c.notes ?? null,
        deviceId: 'fixture',
      })
      await db.insert(measurements).values(
        (['vertical', 'horizontal'] as const).map((orientation, i) => ({
          id: randomUUID(),
          checkId: id,
          roiX: 100 + i * 200,
          roiY: 80,
          roiW: 96,
          roiH: 120,
          orientation,
          angleDeg: i === 0 ? 5.2 : -4.8,
          mtf50CyPx: c.mtf,
          mtf10CyPx: c.mtf * (0.341541 / 0.187391),
          psfModel: 'gaussian' as const,
          sigmaPx: 0.187391 / c.mtf,
          mtfCurve: gaussianCurve(c.mtf),
          warnings: [],
        })),
      )
    }
    if (latest) {
      await db
        .update(cameras)
        .set({
          lastCheckId: checkIds[spec.tag].at(-1),
          lastCheckAt: new Date(latest.at),
          lastVerdict: latest.verdict,
          lastMtf50CyPx: latest.mtf,
        })
        .where(eqId(row.id))
    }
  }
  return { siteIds, modelIds, cameraIds, checkIds, inspector }
}

const eqId = (id: number) => eq(cameras.id, id)
