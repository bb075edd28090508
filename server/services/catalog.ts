import { asc } from 'drizzle-orm'
import type { CameraModel, Task } from '../../shared/schemas/catalog'
import type { Db } from '../db/client'
import { cameraModels, tasks } from '../db/schema'

type TaskRow = typeof tasks.$inferSelect
type ModelRow = typeof cameraModels.$inferSelect

export function toTask(r: TaskRow): Task {
  return {
    id: r.id,
    name: r.name,
    description: r.description,
    requiredPxPerM: r.requiredPxPerM,
    minMtf50CyPx: r.minMtf50CyPx,
    marginalBand: r.marginalBand,
    driftWarnRatio: r.driftWarnRatio,
    driftFailRatio: r.driftFailRatio,
    nightDayWarnRatio: r.nightDayWarnRatio,
    checkIntervalDays: r.checkIntervalDays,
    workOrderPriority: r.workOrderPriority,
    workOrderDueDays: r.workOrderDueDays,
    version: r.version,
    updatedAt: r.updatedAt.toISOString(),
  }
}

export function toCameraModel(r: ModelRow): CameraModel {
  return {
    id: r.id,
    name: r.name,
    sensorWidthPx: r.sensorWidthPx,
    sensorHeightPx: r.sensorHeightPx,
    pixelPitchUm: r.pixelPitchUm,
    focalLengthMinMm: r.focalLengthMinMm,
    focalLengthMaxMm: r.focalLengthMaxMm,
    fNumber: r.fNumber,
    updatedAt: r.updatedAt.toISOString(),
  }
}

/** Tasks (with their thresholds) and camera models: read by every role. */
export function createCatalogService(db: Db) {
  return {
    async tasks(): Promise<Task[]> {
      const rows = await db.select().from(tasks).orderBy(asc(tasks.sortOrder), asc(tasks.name))
      return rows.map(toTask)
    },
    async cameraModels(): Promise<CameraModel[]> {
      const rows = await db.select().from(cameraModels).orderBy(asc(cameraModels.name))
      return rows.map(toCameraModel)
    },
  }
}

export type CatalogService = ReturnType<typeof createCatalogService>
