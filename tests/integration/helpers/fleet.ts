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

export { checkPayload } from '../../fixtures/checkPayload'

export function op(kind: string, payload: unknown, id: string = randomUUID()) {
  return { id, kind, payload }
}
