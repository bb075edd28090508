// A small invented world for the work-order tests: two sites, cameras on a task whose work
// orders are `high` priority and due in 3 days, and one user per job (signed in over HTTP).
import { randomUUID } from 'node:crypto'
import type { Express } from 'express'
import request from 'supertest'
import { eq } from 'drizzle-orm'
import type { Config } from '../../../server/config'
import type { Db } from '../../../server/db/client'
import { cameraModels, cameras, sites, tasks, workOrders } from '../../../server/db/schema'
import type { Role } from '../../../shared/schemas/enums'
import type { Verdict } from '../../../shared/schemas/enums'
import { createUser, makeApp, signIn, testConfig } from './app'
import type { TestUser } from './app'

export const WORLD_TASK = { id: 'wo-identify', priority: 'high', dueDays: 3 } as const

const PEOPLE = {
  supervisor: 'supervisor',
  supervisor2: 'supervisor',
  maint1: 'maintenance',
  maint2: 'maintenance',
  inspector: 'inspector',
  inspector2: 'inspector',
  admin: 'admin',
} as const satisfies Record<string, Role>
export type Person = keyof typeof PEOPLE

export interface World {
  app: Express
  config: Config
  db: Db
  siteId: number
  otherSiteId: number
  /** Cameras at the first site; `otherCamera` is at the second. */
  cameraIds: number[]
  otherCamera: number
  users: Record<Person, TestUser & { name: string }>
  token: Record<Person, string>
}

let worldCount = 0

export async function buildWorld(db: Db, overrides: Partial<Config> = {}): Promise<World> {
  const n = ++worldCount
  const config = testConfig({ demoMode: true, publicUrl: 'https://sharpfield.example.test', ...overrides })
  const { app } = makeApp(db, { config })
  await db.insert(tasks).values({
    id: `${WORLD_TASK.id}-${n}`,
    name: `Identify ${n}`,
    requiredPxPerM: 250,
    minMtf50CyPx: 0.25,
    checkIntervalDays: 90,
    workOrderPriority: WORLD_TASK.priority,
    workOrderDueDays: WORLD_TASK.dueDays,
  })
  const [site] = await db.insert(sites).values({ name: `Quarry Gate ${n}-${randomUUID().slice(0, 6)}` }).$returningId()
  const [other] = await db.insert(sites).values({ name: `Harbour Shed ${n}-${randomUUID().slice(0, 6)}` }).$returningId()
  const [model] = await db
    .insert(cameraModels)
    .values({
      name: `Box 4MP ${n}-${randomUUID().slice(0, 6)}`,
      sensorWidthPx: 2688,
      sensorHeightPx: 1520,
      pixelPitchUm: 2,
      focalLengthMinMm: 2.8,
      focalLengthMaxMm: 12,
      fNumber: 1.6,
    })
    .$returningId()
  const cameraIds: number[] = []
  for (let i = 0; i < 4; i++) {
    const [c] = await db
      .insert(cameras)
      .values({
        assetTag: `QG-${n}-${i + 1}-${randomUUID().slice(0, 4)}`,
        siteId: site.id,
        locationText: `Gate ${i + 1} <north>`,
        cameraModelId: model.id,
        taskId: `${WORLD_TASK.id}-${n}`,
      })
      .$returningId()
    cameraIds.push(c.id)
  }
  const [oc] = await db
    .insert(cameras)
    .values({
      assetTag: `HS-${n}-${randomUUID().slice(0, 4)}`,
      siteId: other.id,
      locationText: 'Shed door',
      cameraModelId: model.id,
      taskId: `${WORLD_TASK.id}-${n}`,
    })
    .$returningId()
  const users = {} as World['users']
  const token = {} as World['token']
  const names: Record<Person, string> = {
    supervisor: 'Rhea Lindqvist',
    supervisor2: 'Omar Haddad',
    maint1: 'Piet Alvarez',
    maint2: 'Mina Sorensen',
    inspector: 'Jonas Ekwueme',
    inspector2: 'Lucia Ferreira',
    admin: 'Kai Novak',
  }
  for (const [key, role] of Object.entries(PEOPLE) as [Person, Role][]) {
    const u = await createUser(db, role, { name: names[key] })
    users[key] = { ...u, name: names[key] }
    token[key] = (await signIn(app, u)).token
  }
  return { app, config, db, siteId: site.id, otherSiteId: other.id, cameraIds, otherCamera: oc.id, users, token }
}

/** Records a check as a phone does: a `check.create` operation through POST /api/sync/push. */
export async function recordTestCheck(
  w: World,
  who: Person,
  cameraId: number,
  verdict: Verdict,
  capturedAt: Date = new Date(),
): Promise<string> {
  const id = randomUUID()
  const payload = {
    id,
    cameraId,
    capturedAt: capturedAt.toISOString(),
    mode: 'day' as const,
    verdict,
    reasons:
      verdict === 'pass'
        ? [{ code: 'sharp', text: 'MTF50 0.31 cy/px meets the task minimum of 0.25.' }]
        : [{ code: 'soft', text: 'MTF50 0.12 cy/px is below the task minimum of 0.25 <b>bold</b>.' }],
    medianMtf50CyPx: verdict === 'pass' ? 0.31 : 0.12,
    shareFrame: false,
    measurements: [],
  }
  const res = await request(w.app)
    .post('/api/sync/push')
    .set('Authorization', `Bearer ${w.token[who]}`)
    .send({ deviceId: `phone-${who}`, ops: [{ id: randomUUID(), kind: 'check.create', payload }] })
  if (res.status !== 200 || res.body.results?.[0]?.status !== 'applied')
    throw new Error(`check.create was not applied: ${res.status} ${JSON.stringify(res.body)}`)
  return id
}

/** The camera's open work order id (or undefined). */
export async function openOrderOf(db: Db, cameraId: number): Promise<number | undefined> {
  const [row] = await db
    .select({ id: workOrders.id })
    .from(workOrders)
    .where(eq(workOrders.openCameraId, cameraId))
  return row?.id
}

export function api(w: World, who: Person) {
  const auth = (r: request.Test) => r.set('Authorization', `Bearer ${w.token[who]}`)
  return {
    get: (path: string) => auth(request(w.app).get(path)),
    post: (path: string, body?: object) => auth(request(w.app).post(path)).send(body ?? {}),
    act: (id: number, body: object) => auth(request(w.app).post(`/api/work-orders/${id}/actions`)).send(body),
  }
}
