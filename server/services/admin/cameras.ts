// Cameras in the inventory: add one, change one (including retiring it). Site, model and task
// must exist; the asset tag is unique. Every change is audited and fed to devices.
import { eq, sql } from 'drizzle-orm'
import type { CameraInput, CameraUpdate } from '../../../shared/schemas/setup'
import type { Db, DbOrTx } from '../../db/client'
import { cameraModels, cameras, sites, tasks } from '../../db/schema'
import { audit } from '../sync/audit'
import { recordChanges, SYNC_ENTITIES } from '../sync/changes'
import type { AuthUser } from '../tokens'
import { diff, fieldError, notFound, staleVersion, uniqueOr } from './common'

export const ASSET_TAG_TAKEN = 'A camera with this asset tag exists already.'
export const ASSET_TAG_KEY = 'cameras_assetTag_unique'

/** Throws a field error when the site, model or task named in the input does not exist. */
async function checkReferences(tx: DbOrTx, input: Partial<CameraInput>): Promise<void> {
  if (input.siteId !== undefined) {
    const [s] = await tx.select({ id: sites.id }).from(sites).where(eq(sites.id, input.siteId))
    if (!s) throw fieldError('siteId', `There is no site with id ${input.siteId}.`)
  }
  if (input.cameraModelId !== undefined) {
    const [m] = await tx
      .select({ id: cameraModels.id })
      .from(cameraModels)
      .where(eq(cameraModels.id, input.cameraModelId))
    if (!m)
      throw fieldError('cameraModelId', `There is no camera model with id ${input.cameraModelId}.`)
  }
  if (input.taskId !== undefined) {
    const [t] = await tx.select({ id: tasks.id }).from(tasks).where(eq(tasks.id, input.taskId))
    if (!t) throw fieldError('taskId', `There is no task "${input.taskId}".`)
  }
}

export const CAMERA_AUDIT_FIELDS = [
  'assetTag',
  'siteId',
  'locationText',
  'cameraModelId',
  'taskId',
  'requiredPxPerM',
  'minMtf50CyPx',
  'checkIntervalDays',
  'focalLengthMm',
  'targetDistanceM',
  'active',
] as const

export function createCameraAdmin(db: Db) {
  return {
    /** Returns the new camera's id. */
    async create(actor: AuthUser, input: CameraInput): Promise<number> {
      return db.transaction(async (tx) => {
        await checkReferences(tx, input)
        const [ins] = await uniqueOr(
          () =>
            tx
              .insert(cameras)
              .values({ ...input, state: 'due' })
              .$returningId(),
          ASSET_TAG_KEY,
          'assetTag',
          ASSET_TAG_TAKEN,
        )
        await audit(tx, {
          actorId: actor.id,
          action: 'camera.create',
          entity: 'camera',
          entityId: ins.id,
          detail: { after: input },
        })
        await recordChanges(tx, SYNC_ENTITIES.camera, [ins.id])
        return ins.id
      })
    },

    async update(actor: AuthUser, id: number, input: CameraUpdate): Promise<number> {
      return db.transaction(async (tx) => {
        const [before] = await tx.select().from(cameras).where(eq(cameras.id, id)).for('update')
        if (!before) throw notFound('camera', id)
        if (input.version !== undefined && input.version !== before.version)
          throw staleVersion('camera')
        await checkReferences(tx, input)
        const change = diff(before, input)
        if (Object.keys(change.after).length === 0) return id
        await uniqueOr(
          () =>
            tx
              .update(cameras)
              .set({ ...change.after, version: sql`${cameras.version} + 1` })
              .where(eq(cameras.id, id)),
          ASSET_TAG_KEY,
          'assetTag',
          ASSET_TAG_TAKEN,
        )
        const action =
          change.after.active === false
            ? 'camera.retire'
            : change.after.active === true
              ? 'camera.reinstate'
              : 'camera.update'
        await audit(tx, {
          actorId: actor.id,
          action,
          entity: 'camera',
          entityId: id,
          detail: change,
        })
        await recordChanges(tx, SYNC_ENTITIES.camera, [id])
        return id
      })
    },
  }
}
