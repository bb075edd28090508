import { and, asc, count, desc, eq, like, lt, or, sql } from 'drizzle-orm'
import type { SQL } from 'drizzle-orm'
import { alias } from 'drizzle-orm/mysql-core'
import type {
  Camera,
  CameraDetail,
  CameraList,
  CameraListQuery,
} from '../../shared/schemas/cameras'
import type { Db, DbOrTx } from '../db/client'
import { cameraModels, cameras, checks, sites, tasks } from '../db/schema'
import { AppError } from '../errors'
import { toCameraModel, toTask } from './catalog'

/** The camera's baseline check, joined for its median MTF50. */
const baselineCheck = alias(checks, 'baseline_check')

export const cameraColumns = {
  camera: cameras,
  siteName: sites.name,
  cameraModelName: cameraModels.name,
  taskName: tasks.name,
  taskRequiredPxPerM: tasks.requiredPxPerM,
  taskMinMtf50CyPx: tasks.minMtf50CyPx,
  taskCheckIntervalDays: tasks.checkIntervalDays,
  baselineMtf50CyPx: baselineCheck.medianMtf50CyPx,
}

/** Joins a camera to its baseline check (left join: most cameras start without one). */
export const baselineJoin = [baselineCheck, eq(baselineCheck.id, cameras.baselineCheckId)] as const

/**
 * Cameras with their site, model, task and baseline check: the query behind the camera list
 * and the sync pull, so both answer the same camera record.
 */
export function selectCameras(db: DbOrTx) {
  return db
    .select(cameraColumns)
    .from(cameras)
    .innerJoin(sites, eq(sites.id, cameras.siteId))
    .innerJoin(cameraModels, eq(cameraModels.id, cameras.cameraModelId))
    .innerJoin(tasks, eq(tasks.id, cameras.taskId))
    .leftJoin(...baselineJoin)
}

export type CameraRow = {
  camera: typeof cameras.$inferSelect
  siteName: string
  cameraModelName: string
  taskName: string
  taskRequiredPxPerM: number
  taskMinMtf50CyPx: number
  taskCheckIntervalDays: number
  baselineMtf50CyPx: number | null
}

const iso = (d: Date | null) => (d ? d.toISOString() : null)

export function toCamera(r: CameraRow, now: Date): Camera {
  const c = r.camera
  return {
    id: c.id,
    assetTag: c.assetTag,
    siteId: c.siteId,
    siteName: r.siteName,
    locationText: c.locationText,
    cameraModelId: c.cameraModelId,
    cameraModelName: r.cameraModelName,
    taskId: c.taskId,
    taskName: r.taskName,
    requiredPxPerM: c.requiredPxPerM ?? r.taskRequiredPxPerM,
    minMtf50CyPx: c.minMtf50CyPx ?? r.taskMinMtf50CyPx,
    checkIntervalDays: c.checkIntervalDays ?? r.taskCheckIntervalDays,
    overrides: {
      requiredPxPerM: c.requiredPxPerM,
      minMtf50CyPx: c.minMtf50CyPx,
      checkIntervalDays: c.checkIntervalDays,
    },
    focalLengthMm: c.focalLengthMm,
    targetDistanceM: c.targetDistanceM,
    baselineCheckId: c.baselineCheckId,
    baselineMtf50CyPx: c.baselineCheckId ? r.baselineMtf50CyPx : null,
    state: c.state,
    lastCheckId: c.lastCheckId,
    lastCheckAt: iso(c.lastCheckAt),
    lastVerdict: c.lastVerdict,
    lastMtf50CyPx: c.lastMtf50CyPx,
    nextDueAt: iso(c.nextDueAt),
    overdue: c.nextDueAt !== null && c.nextDueAt.getTime() < now.getTime(),
    active: c.active,
    version: c.version,
    updatedAt: c.updatedAt.toISOString(),
  }
}

const sortColumns = {
  assetTag: cameras.assetTag,
  nextDueAt: cameras.nextDueAt,
  lastCheckAt: cameras.lastCheckAt,
  state: cameras.state,
  site: sites.name,
} as const

export function createCameraService(db: Db, now: () => Date = () => new Date()) {
  return {
    async list(q: CameraListQuery): Promise<CameraList> {
      const t = now()
      const where: SQL[] = []
      if (q.siteId !== undefined) where.push(eq(cameras.siteId, q.siteId))
      if (q.taskId !== undefined) where.push(eq(cameras.taskId, q.taskId))
      if (q.cameraModelId !== undefined) where.push(eq(cameras.cameraModelId, q.cameraModelId))
      if (q.state !== undefined) where.push(eq(cameras.state, q.state))
      if (q.overdue === true) where.push(lt(cameras.nextDueAt, t))
      if (q.overdue === false)
        where.push(sql`(${cameras.nextDueAt} is null or ${cameras.nextDueAt} >= ${t})`)
      if (q.q !== undefined) {
        const pattern = `%${q.q.replace(/[\\%_]/g, (m) => `\\${m}`)}%`
        where.push(or(like(cameras.assetTag, pattern), like(cameras.locationText, pattern)) as SQL)
      }
      const cond = where.length ? and(...where) : undefined
      const dir = q.order === 'desc' ? desc : asc
      const rows = await selectCameras(db)
        .where(cond)
        .orderBy(dir(sortColumns[q.sort]), asc(cameras.id))
        .limit(q.limit)
        .offset(q.offset)
      const [{ total }] = await db
        .select({ total: count() })
        .from(cameras)
        .innerJoin(sites, eq(sites.id, cameras.siteId))
        .where(cond)
      return {
        items: rows.map((r) => toCamera(r, t)),
        total: Number(total),
        limit: q.limit,
        offset: q.offset,
      }
    },

    async get(id: number): Promise<CameraDetail> {
      const [row] = await db
        .select({ ...cameraColumns, site: sites, task: tasks, model: cameraModels })
        .from(cameras)
        .innerJoin(sites, eq(sites.id, cameras.siteId))
        .innerJoin(cameraModels, eq(cameraModels.id, cameras.cameraModelId))
        .innerJoin(tasks, eq(tasks.id, cameras.taskId))
        .leftJoin(...baselineJoin)
        .where(eq(cameras.id, id))
        .limit(1)
      if (!row) throw new AppError('camera.not_found', `There is no camera with id ${id}.`, 404)
      return {
        ...toCamera(row, now()),
        site: {
          id: row.site.id,
          name: row.site.name,
          address: row.site.address,
          timeZone: row.site.timeZone,
        },
        task: toTask(row.task),
        model: toCameraModel(row.model),
      }
    },
  }
}

export type CameraService = ReturnType<typeof createCameraService>
