import { and, asc, count, eq, inArray } from 'drizzle-orm'
import type { SQL } from 'drizzle-orm'
import type { CameraModel, Task } from '../../../../shared/schemas/catalog'
import type { Site } from '../../../../shared/schemas/sites'
import type { SyncCamera, SyncRemoved, SyncRound } from '../../../../shared/schemas/sync'
import type { WorkOrder } from '../../../../shared/schemas/workOrders'
import type { DbOrTx } from '../../../db/client'
import {
  cameraModels,
  cameras,
  roundCameras,
  rounds,
  sites,
  tasks,
  workOrders,
} from '../../../db/schema'
import { selectCameras, toCamera } from '../../cameras'
import { toCameraModel, toTask } from '../../catalog'
import type { AuthUser } from '../../tokens'
import { selectOrders, toWorkOrder } from '../../workOrders/repository'
import { SYNC_ENTITIES } from '../changes'
import type { SyncEntity } from '../changes'
import { visibility } from './visibility'

/** What one entity contributes to a pull: its records for a user, by id or all of them. */
export interface PullSource<T extends { id: number | string }> {
  entity: SyncEntity
  removedKey: keyof SyncRemoved
  /** Visible records among `ids` (null: every visible record). Ids not returned are removed. */
  load(db: DbOrTx, user: AuthUser, ids: string[] | null, now: Date): Promise<T[]>
}

const numericIds = (ids: string[]) => ids.map(Number).filter((n) => Number.isInteger(n) && n > 0)

function byIds(column: Parameters<typeof inArray>[0], ids: string[] | null, numeric = true) {
  if (ids === null) return undefined
  const list = numeric ? numericIds(ids) : ids
  return list.length ? inArray(column, list) : eq(column, numeric ? -1 : '')
}

const siteSource: PullSource<Site> = {
  entity: SYNC_ENTITIES.site,
  removedKey: 'sites',
  async load(db, _user, ids) {
    const rows = await db
      .select({
        id: sites.id,
        name: sites.name,
        address: sites.address,
        timeZone: sites.timeZone,
        updatedAt: sites.updatedAt,
        cameraCount: count(cameras.id),
      })
      .from(sites)
      .leftJoin(cameras, eq(cameras.siteId, sites.id))
      .where(byIds(sites.id, ids))
      .groupBy(sites.id)
      .orderBy(asc(sites.id))
    return rows.map((r) => ({
      ...r,
      cameraCount: Number(r.cameraCount),
      updatedAt: r.updatedAt.toISOString(),
    }))
  },
}

const cameraSource: PullSource<SyncCamera> = {
  entity: SYNC_ENTITIES.camera,
  removedKey: 'cameras',
  async load(db, _user, ids, now) {
    const rows = await selectCameras(db).where(byIds(cameras.id, ids)).orderBy(asc(cameras.id))
    return rows.map((r) => toCamera(r, now))
  },
}

const taskSource: PullSource<Task> = {
  entity: SYNC_ENTITIES.task,
  removedKey: 'tasks',
  async load(db, _user, ids) {
    const rows = await db
      .select()
      .from(tasks)
      .where(byIds(tasks.id, ids, false))
      .orderBy(asc(tasks.sortOrder))
    return rows.map(toTask)
  },
}

const cameraModelSource: PullSource<CameraModel> = {
  entity: SYNC_ENTITIES.cameraModel,
  removedKey: 'cameraModels',
  async load(db, _user, ids) {
    const rows = await db
      .select()
      .from(cameraModels)
      .where(byIds(cameraModels.id, ids))
      .orderBy(asc(cameraModels.id))
    return rows.map(toCameraModel)
  },
}

const roundSource: PullSource<SyncRound> = {
  entity: SYNC_ENTITIES.round,
  removedKey: 'rounds',
  async load(db, user, ids) {
    const scope = visibility(user).rounds
    if (scope === 'none') return []
    const where: SQL[] = []
    const idCond = byIds(rounds.id, ids)
    if (idCond) where.push(idCond)
    if (scope === 'own') where.push(eq(rounds.assigneeId, user.id))
    const rows = await db
      .select()
      .from(rounds)
      .where(where.length ? and(...where) : undefined)
      .orderBy(asc(rounds.id))
    if (rows.length === 0) return []
    const members = await db
      .select()
      .from(roundCameras)
      .where(
        inArray(
          roundCameras.roundId,
          rows.map((r) => r.id),
        ),
      )
      .orderBy(asc(roundCameras.cameraId))
    return rows.map((r) => ({
      id: r.id,
      name: r.name,
      siteId: r.siteId,
      assigneeId: r.assigneeId,
      dueAt: r.dueAt.toISOString(),
      status: r.status,
      cameras: members
        .filter((m) => m.roundId === r.id)
        .map((m) => ({ cameraId: m.cameraId, checkId: m.checkId })),
      version: r.version,
      updatedAt: r.updatedAt.toISOString(),
    }))
  },
}

const workOrderSource: PullSource<WorkOrder> = {
  entity: SYNC_ENTITIES.workOrder,
  removedKey: 'workOrders',
  async load(db, user, ids, now) {
    const scope = visibility(user).workOrders
    if (scope === 'none') return []
    const where: SQL[] = []
    const idCond = byIds(workOrders.id, ids)
    if (idCond) where.push(idCond)
    if (scope === 'assigned') where.push(eq(workOrders.assigneeId, user.id))
    if (scope === 'awaiting_recheck') where.push(eq(workOrders.status, 'awaiting_recheck'))
    const rows = await selectOrders(db, where.length ? and(...where) : undefined).orderBy(
      asc(workOrders.id),
    )
    return rows.map((r) => toWorkOrder(r, now))
  },
}

/** Every entity a device holds, in the order a first download fills them. */
export const PULL_SOURCES = [
  siteSource,
  taskSource,
  cameraModelSource,
  cameraSource,
  roundSource,
  workOrderSource,
] as const
