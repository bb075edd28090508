// Work orders: the use cases the routes and the sync operation call.
import { and, eq } from 'drizzle-orm'
import type {
  Assignee,
  WorkOrderActionRequest,
  WorkOrderCreate,
  WorkOrderDetail,
  WorkOrderListQuery,
} from '../../../shared/schemas/workOrders'
import { WORK_ORDER_ERRORS } from '../../../shared/schemas/workOrders'
import type { Config } from '../../config'
import type { Db } from '../../db/client'
import { cameras, workOrderPhotos } from '../../db/schema'
import { AppError } from '../../errors'
import type { AuthUser } from '../tokens'
import { applyAction } from './actions'
import { openOrder } from './checkRecorded'
import { listOrders } from './list'
import { createPhotoStore, sniffImage } from './photos'
import { activeUsersOfRole, loadDetail, loadJoined } from './repository'

export interface WorkOrderServiceDeps {
  db: Db
  config: Pick<Config, 'publicUrl' | 'dataDir'>
  now: () => Date
}

/** Maintenance reads and changes only the orders assigned to it. */
function assertCanSee(user: AuthUser, assigneeId: number | null): void {
  if (user.role === 'maintenance' && assigneeId !== user.id)
    throw new AppError(WORK_ORDER_ERRORS.notAllowed, 'This work order is not assigned to you.', 403)
}

export function createWorkOrderService({ db, config, now }: WorkOrderServiceDeps) {
  const photos = createPhotoStore(config.dataDir)

  async function get(user: AuthUser, id: number): Promise<WorkOrderDetail> {
    const detail = await loadDetail(db, id, now())
    assertCanSee(user, detail.assigneeId)
    return detail
  }

  return {
    list: (user: AuthUser, q: WorkOrderListQuery) => listOrders(db, user, q, now()),
    get,

    async create(user: AuthUser, input: WorkOrderCreate): Promise<WorkOrderDetail> {
      const t = now()
      const id = await db.transaction(async (tx) => {
        const [camera] = await tx
          .select({ active: cameras.active, assetTag: cameras.assetTag })
          .from(cameras)
          .where(eq(cameras.id, input.cameraId))
        if (!camera)
          throw new AppError('camera.not_found', `There is no camera with id ${input.cameraId}.`, 404)
        if (!camera.active)
          throw new AppError(WORK_ORDER_ERRORS.notAllowed, `Camera ${camera.assetTag} is retired.`, 400)
        const { created, order } = await openOrder(tx, {
          cameraId: input.cameraId,
          now: t,
          actorId: user.id,
          createdBy: user.id,
          checkId: null,
          title: input.title,
          description: input.description ?? null,
          priority: input.priority,
          dueAt: input.dueAt ? new Date(input.dueAt) : undefined,
          note: 'Opened by hand.',
        })
        if (!created)
          throw new AppError(
            WORK_ORDER_ERRORS.alreadyOpen,
            `Camera ${camera.assetTag} already has an open work order (#${order.id}); add to that one.`,
            409,
            { workOrderId: order.id },
          )
        return order.id
      })
      return loadDetail(db, id, t)
    },

    async act(user: AuthUser, id: number, body: WorkOrderActionRequest): Promise<WorkOrderDetail> {
      const t = now()
      await db.transaction((tx) =>
        applyAction({ tx, actor: user, now: t, publicUrl: config.publicUrl, versions: 'strict' }, id, body),
      )
      return loadDetail(db, id, t)
    },

    /** Stores the photo, then records it as an action (with the version the user saw). */
    async addPhoto(
      user: AuthUser,
      id: number,
      p: { bytes: Buffer; version: number; note?: string },
    ): Promise<WorkOrderDetail> {
      const row = await loadJoined(db, id)
      assertCanSee(user, row.o.assigneeId)
      const info = sniffImage(p.bytes)
      const stored = await photos.save(id, info, p.bytes)
      const t = now()
      try {
        await db.transaction(async (tx) => {
          await tx.insert(workOrderPhotos).values({
            id: stored.id,
            workOrderId: id,
            uploadedBy: user.id,
            storageKey: stored.storageKey,
            sha256: stored.sha256,
            bytes: stored.bytes,
            mime: info.mime,
            width: info.width,
            height: info.height,
            createdAt: t,
          })
          await applyAction(
            { tx, actor: user, now: t, publicUrl: config.publicUrl, versions: 'strict' },
            id,
            { action: 'add_photo', version: p.version, note: p.note, photoId: stored.id },
          )
        })
      } catch (err) {
        await photos.remove(stored.storageKey) // nothing refers to it: the transaction rolled back
        throw err
      }
      return loadDetail(db, id, t)
    },

    async photo(user: AuthUser, id: number, photoId: string) {
      const row = await loadJoined(db, id)
      assertCanSee(user, row.o.assigneeId)
      const [p] = await db
        .select()
        .from(workOrderPhotos)
        .where(and(eq(workOrderPhotos.id, photoId), eq(workOrderPhotos.workOrderId, id)))
      if (!p)
        throw new AppError(WORK_ORDER_ERRORS.photoNotFound, 'That photo is not on this work order.', 404)
      return { mime: p.mime, bytes: await photos.read(p.storageKey) }
    },

    async assignees(): Promise<Assignee[]> {
      const rows = await activeUsersOfRole(db, 'maintenance')
      return rows.map((u) => ({ id: u.id, name: u.name, email: u.email }))
    },
  }
}

export type WorkOrderService = ReturnType<typeof createWorkOrderService>
