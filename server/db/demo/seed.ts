import { count, eq } from 'drizzle-orm'
import { hashPassword } from '../../services/passwords'
import type { Db, DbOrTx } from '../client'
import {
  auditLog,
  cameraModels,
  cameras,
  changes,
  checks,
  measurements,
  roundCameras,
  rounds,
  sites,
  tasks,
  users,
  workOrderHistory,
  workOrders,
} from '../schema'
import { TASK_DEFAULTS } from '../taskDefaults'
import { DEMO_CAMERAS, DEMO_MODELS, DEMO_SITES } from './fleet'
import { DAY_MS, buildHistory } from './history'
import type { CameraContext } from './history'
import { DEMO_PASSWORD, DEMO_USERS } from './people'
import { createRng } from './random'
import { buildWorkOrders } from './workOrders'

export const DEMO_SEED = 20_240_611

export interface SeedResult {
  seeded: boolean
  counts: Record<string, number>
}

async function insertChunked<T>(rows: T[], size: number, insert: (chunk: T[]) => Promise<unknown>) {
  for (let i = 0; i < rows.length; i += size) await insert(rows.slice(i, i + size))
}

async function recordChanges(tx: DbOrTx, entity: string, ids: (string | number)[]) {
  if (ids.length)
    await tx.insert(changes).values(ids.map((id) => ({ entity, entityId: String(id) })))
}

/** Row counts of the tables the demo fills (used by the idempotency test and the script). */
export async function demoCounts(db: Db): Promise<Record<string, number>> {
  const tables = {
    users,
    sites,
    cameraModels,
    tasks,
    cameras,
    checks,
    measurements,
    workOrders,
    workOrderHistory,
    rounds,
  }
  const out: Record<string, number> = {}
  for (const [name, table] of Object.entries(tables)) {
    const [{ n }] = await db.select({ n: count() }).from(table)
    out[name] = Number(n)
  }
  return out
}

/**
 * Loads the invented demo scenario into an empty database, in one transaction.
 * Does nothing (seeded: false) when any user exists already.
 */
export async function seedDemo(db: Db, options: { now?: Date } = {}): Promise<SeedResult> {
  const [{ n }] = await db.select({ n: count() }).from(users)
  if (Number(n) > 0) return { seeded: false, counts: await demoCounts(db) }
  const now = options.now ?? new Date()
  const rng = createRng(DEMO_SEED)
  const passwordHash = await hashPassword(DEMO_PASSWORD)

  await db.transaction(async (tx) => {
    const userIds: Record<string, number> = {}
    for (const u of DEMO_USERS) {
      const [row] = await tx
        .insert(users)
        .values({
          email: u.email,
          name: u.name,
          role: u.role,
          passwordHash,
          active: u.active ?? true,
        })
        .$returningId()
      userIds[u.key] = row.id
    }
    await tx.insert(tasks).values(TASK_DEFAULTS.map((t, i) => ({ ...t, sortOrder: i })))
    await recordChanges(
      tx,
      'task',
      TASK_DEFAULTS.map((t) => t.id),
    )

    const siteIds: Record<string, number> = {}
    for (const s of DEMO_SITES) {
      const [row] = await tx
        .insert(sites)
        .values({ name: s.name, address: s.address, timeZone: s.timeZone })
        .$returningId()
      siteIds[s.key] = row.id
    }
    await recordChanges(tx, 'site', Object.values(siteIds))
    const modelIds: Record<string, number> = {}
    for (const m of DEMO_MODELS) {
      const { key: _key, sharpMtf50: _sharp, ...row } = m
      const [ins] = await tx.insert(cameraModels).values(row).$returningId()
      modelIds[m.key] = ins.id
    }
    await recordChanges(tx, 'camera_model', Object.values(modelIds))

    const contexts: CameraContext[] = []
    for (const [i, cam] of DEMO_CAMERAS.entries()) {
      const [row] = await tx
        .insert(cameras)
        .values({
          assetTag: cam.assetTag,
          siteId: siteIds[cam.site],
          locationText: cam.location,
          cameraModelId: modelIds[cam.model],
          taskId: cam.task,
          focalLengthMm: cam.focalLengthMm,
          targetDistanceM: cam.distanceM,
        })
        .$returningId()
      const task = TASK_DEFAULTS.find((t) => t.id === cam.task)
      const model = DEMO_MODELS.find((m) => m.key === cam.model)
      if (!task || !model)
        throw new Error(`demo camera ${cam.assetTag} names an unknown task or model`)
      const inspectorId =
        cam.site === 'yard' || (cam.site === 'bottling' && i % 2)
          ? userIds.inspector2
          : userIds.inspector
      contexts.push({ id: row.id, spec: cam, task, model, inspectorId })
    }

    const history = buildHistory(rng, now, contexts)
    await insertChunked(history.checks, 200, (chunk) => tx.insert(checks).values(chunk))
    await insertChunked(history.measurements, 200, (chunk) => tx.insert(measurements).values(chunk))

    const orders = buildWorkOrders(history.failures, {
      supervisor: userIds.supervisor,
      maintenance: userIds.maintenance,
      maintenance2: userIds.maintenance2,
    })
    const orderIds: number[] = []
    for (const o of orders) {
      const [row] = await tx.insert(workOrders).values(o.order).$returningId()
      orderIds.push(row.id)
      await tx
        .insert(workOrderHistory)
        .values(o.history.map((h) => ({ ...h, workOrderId: row.id })))
      if (o.order.status === 'in_progress') {
        const update = history.cameraUpdates.find((u) => u.id === o.order.cameraId)
        if (update) update.set.state = 'in_repair'
      }
    }
    for (const u of history.cameraUpdates)
      await tx.update(cameras).set(u.set).where(eq(cameras.id, u.id))
    await recordChanges(
      tx,
      'camera',
      contexts.map((c) => c.id),
    )
    await recordChanges(tx, 'work_order', orderIds)

    const roundIds = await seedRounds(tx, now, contexts, history.cameraUpdates, siteIds, userIds)
    await recordChanges(tx, 'round', roundIds)
    await tx.insert(auditLog).values({
      actorId: userIds.admin,
      action: 'demo.seed',
      entity: 'system',
      detail: { cameras: contexts.length, checks: history.checks.length, seed: DEMO_SEED },
    })
  })
  return { seeded: true, counts: await demoCounts(db) }
}

async function seedRounds(
  tx: DbOrTx,
  now: Date,
  contexts: CameraContext[],
  updates: { id: number; set: { nextDueAt?: Date | null } }[],
  siteIds: Record<string, number>,
  userIds: Record<string, number>,
): Promise<number[]> {
  const dueSoon = (id: number) => {
    const next = updates.find((u) => u.id === id)?.set.nextDueAt
    return next ? next.getTime() < now.getTime() + 30 * DAY_MS : false
  }
  const plans = [
    { name: 'Millbrook depot round', site: 'depot', assignee: userIds.inspector, dueDays: 5 },
    { name: 'Fenwick gates and docks', site: 'yard', assignee: userIds.inspector2, dueDays: 10 },
  ]
  const ids: number[] = []
  for (const p of plans) {
    const siteCams = contexts.filter((c) => c.spec.site === p.site)
    let picked = siteCams.filter((c) => dueSoon(c.id))
    if (picked.length < 3) picked = siteCams.slice(0, 4)
    const [row] = await tx
      .insert(rounds)
      .values({
        name: p.name,
        siteId: siteIds[p.site],
        assigneeId: p.assignee,
        dueAt: new Date(now.getTime() + p.dueDays * DAY_MS),
        createdBy: userIds.supervisor,
      })
      .$returningId()
    await tx.insert(roundCameras).values(picked.map((c) => ({ roundId: row.id, cameraId: c.id })))
    ids.push(row.id)
  }
  return ids
}
