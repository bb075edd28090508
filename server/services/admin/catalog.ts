// Sites, camera models and task thresholds. Each change goes to the audit log and to the
// change feed, so devices pick it up on their next pull.
import { eq, sql } from 'drizzle-orm'
import type { CameraModel, Task } from '../../../shared/schemas/catalog'
import type { CameraModelInput, SiteInput, TaskUpdate } from '../../../shared/schemas/setup'
import type { Site } from '../../../shared/schemas/sites'
import type { Db, DbOrTx } from '../../db/client'
import { cameraModels, cameras, sites, tasks } from '../../db/schema'
import { toCameraModel, toTask } from '../catalog'
import { audit } from '../sync/audit'
import { recordChanges, SYNC_ENTITIES } from '../sync/changes'
import type { AuthUser } from '../tokens'
import { diff, fieldError, notFound, staleVersion, uniqueOr } from './common'

async function siteOut(tx: DbOrTx, id: number): Promise<Site> {
  const [s] = await tx.select().from(sites).where(eq(sites.id, id))
  const [{ n }] = await tx
    .select({ n: sql<number>`count(*)` })
    .from(cameras)
    .where(eq(cameras.siteId, id))
  return {
    id: s.id,
    name: s.name,
    address: s.address,
    timeZone: s.timeZone,
    cameraCount: Number(n),
    updatedAt: s.updatedAt.toISOString(),
  }
}

const SITE_TAKEN = 'A site with this name exists already.'
const MODEL_TAKEN = 'A camera model with this name exists already.'

export function createCatalogAdmin(db: Db) {
  return {
    async createSite(actor: AuthUser, input: SiteInput): Promise<Site> {
      return db.transaction(async (tx) => {
        const [ins] = await uniqueOr(
          () => tx.insert(sites).values(input).$returningId(),
          'sites_name_unique',
          'name',
          SITE_TAKEN,
        )
        await audit(tx, {
          actorId: actor.id,
          action: 'site.create',
          entity: 'site',
          entityId: ins.id,
          detail: { after: input },
        })
        await recordChanges(tx, SYNC_ENTITIES.site, [ins.id])
        return siteOut(tx, ins.id)
      })
    },

    async updateSite(actor: AuthUser, id: number, input: Partial<SiteInput>): Promise<Site> {
      return db.transaction(async (tx) => {
        const [before] = await tx.select().from(sites).where(eq(sites.id, id)).for('update')
        if (!before) throw notFound('site', id)
        const change = diff(before, input)
        if (Object.keys(change.after).length) {
          await uniqueOr(
            () => tx.update(sites).set(change.after).where(eq(sites.id, id)),
            'sites_name_unique',
            'name',
            SITE_TAKEN,
          )
          await audit(tx, {
            actorId: actor.id,
            action: 'site.update',
            entity: 'site',
            entityId: id,
            detail: change,
          })
          await recordChanges(tx, SYNC_ENTITIES.site, [id])
        }
        return siteOut(tx, id)
      })
    },

    async createModel(actor: AuthUser, input: CameraModelInput): Promise<CameraModel> {
      return db.transaction(async (tx) => {
        const [ins] = await uniqueOr(
          () => tx.insert(cameraModels).values(input).$returningId(),
          'camera_models_name_unique',
          'name',
          MODEL_TAKEN,
        )
        await audit(tx, {
          actorId: actor.id,
          action: 'camera_model.create',
          entity: 'camera_model',
          entityId: ins.id,
          detail: { after: input },
        })
        await recordChanges(tx, SYNC_ENTITIES.cameraModel, [ins.id])
        const [row] = await tx.select().from(cameraModels).where(eq(cameraModels.id, ins.id))
        return toCameraModel(row)
      })
    },

    async updateModel(actor: AuthUser, id: number, input: CameraModelInput): Promise<CameraModel> {
      return db.transaction(async (tx) => {
        const [before] = await tx
          .select()
          .from(cameraModels)
          .where(eq(cameraModels.id, id))
          .for('update')
        if (!before) throw notFound('camera model', id)
        const change = diff(before, input)
        if (Object.keys(change.after).length) {
          await uniqueOr(
            () => tx.update(cameraModels).set(change.after).where(eq(cameraModels.id, id)),
            'camera_models_name_unique',
            'name',
            MODEL_TAKEN,
          )
          await audit(tx, {
            actorId: actor.id,
            action: 'camera_model.update',
            entity: 'camera_model',
            entityId: id,
            detail: change,
          })
          await recordChanges(tx, SYNC_ENTITIES.cameraModel, [id])
        }
        const [row] = await tx.select().from(cameraModels).where(eq(cameraModels.id, id))
        return toCameraModel(row)
      })
    },

    /** Supervisors and admins: a task's thresholds and follow-up settings. */
    async updateTask(actor: AuthUser, id: string, input: TaskUpdate): Promise<Task> {
      return db.transaction(async (tx) => {
        const [before] = await tx.select().from(tasks).where(eq(tasks.id, id)).for('update')
        if (!before) throw notFound('task', id)
        if (input.version !== undefined && input.version !== before.version)
          throw staleVersion('task')
        const warn = input.driftWarnRatio ?? before.driftWarnRatio
        const fail = input.driftFailRatio ?? before.driftFailRatio
        if (fail >= warn)
          throw fieldError('driftFailRatio', 'The failure ratio must be below the warning ratio.')
        const change = diff(before, input)
        if (Object.keys(change.after).length) {
          await tx
            .update(tasks)
            .set({ ...change.after, version: sql`${tasks.version} + 1` })
            .where(eq(tasks.id, id))
          await audit(tx, {
            actorId: actor.id,
            action: 'task.update',
            entity: 'task',
            entityId: id,
            detail: change,
          })
          await recordChanges(tx, SYNC_ENTITIES.task, [id])
        }
        const [row] = await tx.select().from(tasks).where(eq(tasks.id, id))
        return toTask(row)
      })
    },
  }
}
