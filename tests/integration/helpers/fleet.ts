import { randomUUID } from 'node:crypto'
import type { Db } from '../../../server/db/client'
import {
  cameraModels,
  cameras,
  roundCameras,
  rounds,
  sites,
  tasks,
} from '../../../server/db/schema'
import { TASK_DEFAULTS } from '../../../server/db/taskDefaults'
import { recordChanges, SYNC_ENTITIES } from '../../../server/services/sync/changes'
import type { CheckCreatePayload } from '../../../shared/schemas/checks'

// A small invented fleet for sync tests: the default tasks, one site, one camera model and
// `cameraCount` cameras, each written to the change feed like the demo loader does.

export interface TestFleet {
  siteId: number
  modelId: number
  cameraIds: number[]
}

let fleetCounter = 0

export async function createFleet(db: Db, cameraCount = 3): Promise<TestFleet> {
  const n = ++fleetCounter
  const existing = await db.select({ id: tasks.id }).from(tasks)
  if (existing.length === 0) {
    await db.insert(tasks).values(TASK_DEFAULTS.map((t, i) => ({ ...t, sortOrder: i })))
    await recordChanges(
      db,
      SYNC_ENTITIES.task,
      TASK_DEFAULTS.map((t) => t.id),
    )
  }
  const [site] = await db
    .insert(sites)
    .values({ name: `Harrow Quay ${n}-${Date.now()}`, address: '2 Quay Road', timeZone: 'UTC' })
    .$returningId()
  const [model] = await db
    .insert(cameraModels)
    .values({
      name: `Osprey T${n}-${Date.now()}`,
      sensorWidthPx: 1920,
      sensorHeightPx: 1080,
      pixelPitchUm: 2.9,
      focalLengthMinMm: 2.8,
      focalLengthMaxMm: 12,
      fNumber: 1.6,
    })
    .$returningId()
  const cameraIds: number[] = []
  for (let i = 0; i < cameraCount; i++) {
    const [cam] = await db
      .insert(cameras)
      .values({
        assetTag: `HQ${n}-${String(i + 1).padStart(3, '0')}-${randomUUID().slice(0, 4)}`,
        siteId: site.id,
        locationText: `Pole ${i + 1}`,
        cameraModelId: model.id,
        taskId: 'identify',
      })
      .$returningId()
    cameraIds.push(cam.id)
  }
  await recordChanges(db, SYNC_ENTITIES.site, [site.id])
  await recordChanges(db, SYNC_ENTITIES.cameraModel, [model.id])
  await recordChanges(db, SYNC_ENTITIES.camera, cameraIds)
  return { siteId: site.id, modelId: model.id, cameraIds }
}

export async function createRound(
  db: Db,
  options: { assigneeId: number; createdBy: number; cameraIds: number[]; siteId?: number },
): Promise<number> {
  const [round] = await db
    .insert(rounds)
    .values({
      name: `Round ${randomUUID().slice(0, 6)}`,
      siteId: options.siteId ?? null,
      assigneeId: options.assigneeId,
      createdBy: options.createdBy,
      dueAt: new Date(Date.now() + 7 * 86_400_000),
    })
    .$returningId()
  await db
    .insert(roundCameras)
    .values(options.cameraIds.map((cameraId) => ({ roundId: round.id, cameraId })))
  await recordChanges(db, SYNC_ENTITIES.round, [round.id])
  return round.id
}

/** A `check.create` payload as a device would send it (two measured edges by default). */
export function checkPayload(
  cameraId: number,
  overrides: Partial<CheckCreatePayload> = {},
  measurementCount = 2,
): CheckCreatePayload {
  const curve: [number, number][] = []
  for (let k = 0; k <= 100; k++) {
    const f = k / 100
    curve.push([f, Number(Math.exp(-((f / 0.3) ** 2) * Math.LN2).toFixed(4))])
  }
  return {
    id: randomUUID(),
    cameraId,
    capturedAt: new Date(Date.now() - 60_000).toISOString(),
    mode: 'day',
    verdict: 'pass',
    reasons: [{ code: 'sharpness', text: 'Median MTF50 0.300 c/p meets the minimum 0.250 c/p.' }],
    medianMtf50CyPx: 0.3,
    pixelDensityPxPerM: 320,
    baselineRatio: null,
    shareFrame: false,
    measurements: Array.from({ length: measurementCount }, (_, i) => ({
      id: randomUUID(),
      roi: { x: 100 + 150 * i, y: 80, w: 120, h: 120 },
      orientation: i % 2 ? ('horizontal' as const) : ('vertical' as const),
      angleDeg: 5.2,
      mtf50CyPx: 0.3,
      mtf50pCyPx: 0.3,
      mtf10CyPx: 0.61,
      mtfNyquist: 0.12,
      rise1090Px: 1.9,
      overshoot: 0,
      noise: 0.004,
      psf: { model: 'gaussian' as const, sigmaPx: 0.62, rmsResidual: 0.003 },
      mtfCurve: curve,
      warnings: [],
    })),
    ...overrides,
  }
}

export function op(kind: string, payload: unknown, id: string = randomUUID()) {
  return { id, kind, payload }
}
