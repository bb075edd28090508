import { eq } from 'drizzle-orm'
import type { Express } from 'express'
import request from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { workOrders } from '../../server/db/schema'
import { recordChanges, SYNC_ENTITIES } from '../../server/services/sync/changes'
import { pullResponseSchema } from '../../shared/schemas/sync'
import type { PullResponse } from '../../shared/schemas/sync'
import { createUser, makeApp, signIn, testConfig } from './helpers/app'
import type { TestUser } from './helpers/app'
import { createTestDatabase } from './helpers/db'
import type { TestDatabase } from './helpers/db'
import { checkPayload, createFleet, createRound, op } from './helpers/fleet'
import type { TestFleet } from './helpers/fleet'

// GET /api/sync/pull: a first download fills an empty device, later pulls bring what changed
// since the cursor, each role gets only what it may see, and records that stop being visible
// come back as `removed`.

const SETTLE_MS = 400
let tdb: TestDatabase
let app: Express
let fleet: TestFleet
const users = {} as Record<
  'inspector' | 'inspector2' | 'supervisor' | 'maintenance' | 'maintenance2',
  TestUser
>
const tokens = {} as Record<keyof typeof users, string>
const orderIds: Record<'forMaintenance' | 'forOther' | 'awaiting', number> = {} as never
let ownRound = 0
let otherRound = 0

const settle = () => new Promise((r) => setTimeout(r, SETTLE_MS + 150))

async function pull(
  who: keyof typeof users,
  cursor?: number,
  limit?: number,
): Promise<PullResponse> {
  const res = await request(app)
    .get('/api/sync/pull')
    .query({ ...(cursor !== undefined ? { cursor } : {}), ...(limit ? { limit } : {}) })
    .set('Authorization', `Bearer ${tokens[who]}`)
  if (res.status !== 200)
    throw new Error(`pull answered ${res.status}: ${JSON.stringify(res.body)}`)
  return pullResponseSchema.parse(res.body)
}

async function insertOrder(
  cameraId: number,
  status: 'assigned' | 'awaiting_recheck',
  assigneeId: number,
) {
  const [row] = await tdb.db
    .insert(workOrders)
    .values({
      cameraId,
      status,
      assigneeId,
      title: `Refocus camera ${cameraId}`,
      priority: 'normal',
    })
    .$returningId()
  await recordChanges(tdb.db, SYNC_ENTITIES.workOrder, [row.id])
  return row.id
}

beforeAll(async () => {
  tdb = await createTestDatabase()
  app = makeApp(tdb.db, { config: testConfig({ syncSettleMs: SETTLE_MS }) }).app
  fleet = await createFleet(tdb.db, 4)
  for (const k of [
    'inspector',
    'inspector2',
    'supervisor',
    'maintenance',
    'maintenance2',
  ] as const) {
    users[k] = await createUser(tdb.db, k.replace(/2$/, '') as TestUser['role'])
    tokens[k] = (await signIn(app, users[k])).token
  }
  ownRound = await createRound(tdb.db, {
    assigneeId: users.inspector.id,
    createdBy: users.supervisor.id,
    cameraIds: fleet.cameraIds.slice(0, 2),
  })
  otherRound = await createRound(tdb.db, {
    assigneeId: users.inspector2.id,
    createdBy: users.supervisor.id,
    cameraIds: fleet.cameraIds.slice(2),
  })
  orderIds.forMaintenance = await insertOrder(fleet.cameraIds[0], 'assigned', users.maintenance.id)
  orderIds.forOther = await insertOrder(fleet.cameraIds[1], 'assigned', users.maintenance2.id)
  orderIds.awaiting = await insertOrder(
    fleet.cameraIds[2],
    'awaiting_recheck',
    users.maintenance2.id,
  )
  await settle()
})
afterAll(() => tdb?.drop())

describe('first download', () => {
  it('fills an empty device with the inventory and the inspector’s own rounds', async () => {
    const first = await pull('inspector')
    expect(first.full).toBe(true)
    expect(first.hasMore).toBe(false)
    expect(first.cursor).toBeGreaterThan(0)
    expect(first.sites.map((s) => s.id)).toEqual([fleet.siteId])
    expect(first.sites[0].cameraCount).toBe(4)
    expect(first.cameras.map((c) => c.id)).toEqual(fleet.cameraIds)
    expect(first.tasks.map((t) => t.id)).toContain('identify')
    expect(first.cameraModels.map((m) => m.id)).toEqual([fleet.modelId])
    expect(first.rounds.map((r) => r.id)).toEqual([ownRound])
    expect(first.rounds[0].cameras.map((c) => c.cameraId)).toEqual(fleet.cameraIds.slice(0, 2))
    // Inspectors see only the orders waiting for their re-check.
    expect(first.workOrders.map((w) => w.id)).toEqual([orderIds.awaiting])
  })

  it('gives maintenance only its own orders and no rounds; supervisors everything', async () => {
    const maint = await pull('maintenance')
    expect(maint.workOrders.map((w) => w.id)).toEqual([orderIds.forMaintenance])
    expect(maint.rounds).toEqual([])
    expect(maint.cameras).toHaveLength(4)
    const sup = await pull('supervisor')
    expect(sup.workOrders.map((w) => w.id).sort()).toEqual(Object.values(orderIds).sort())
    expect(sup.rounds.map((r) => r.id).sort()).toEqual([ownRound, otherRound].sort())
  })

  it('treats a cursor the server never issued (e.g. after a reset) as a first download', async () => {
    const res = await pull('inspector', 10_000_000)
    expect(res.full).toBe(true)
    expect(res.cameras).toHaveLength(4)
  })
})

describe('later pulls', () => {
  it('bring only what changed since the cursor, once the change has settled', async () => {
    const start = await pull('inspector')
    const nothing = await pull('inspector', start.cursor)
    expect(nothing).toMatchObject({
      full: false,
      hasMore: false,
      cursor: start.cursor,
      cameras: [],
    })

    const payload = checkPayload(fleet.cameraIds[3], { verdict: 'marginal' })
    const pushed = await request(app)
      .post('/api/sync/push')
      .set('Authorization', `Bearer ${tokens.inspector}`)
      .send({ deviceId: 'phone-1', ops: [op('check.create', payload)] })
    expect(pushed.body.results[0].status).toBe('applied')

    // A change younger than SYNC_SETTLE_MS waits for the next pull (a commit may be in flight).
    const tooSoon = await pull('inspector', start.cursor)
    expect(tooSoon.cameras).toEqual([])
    expect(tooSoon.cursor).toBe(start.cursor)

    await settle()
    const next = await pull('inspector', start.cursor)
    expect(next.full).toBe(false)
    expect(next.cursor).toBeGreaterThan(start.cursor)
    expect(next.cameras.map((c) => c.id)).toEqual([fleet.cameraIds[3]])
    expect(next.cameras[0]).toMatchObject({ lastCheckId: payload.id, lastVerdict: 'marginal' })
    expect(next.sites).toEqual([])
    const after = await pull('inspector', next.cursor)
    expect(after.cameras).toEqual([])
    expect(after.cursor).toBe(next.cursor)
  })

  it('pages with limit and hasMore without losing a change', async () => {
    const start = await pull('supervisor')
    for (const id of fleet.cameraIds) await recordChanges(tdb.db, SYNC_ENTITIES.camera, [id])
    await settle()
    const seen: number[] = []
    let cursor = start.cursor
    let pages = 0
    for (;;) {
      const page = await pull('supervisor', cursor, 1)
      pages++
      seen.push(...page.cameras.map((c) => c.id))
      cursor = page.cursor
      if (!page.hasMore) break
    }
    expect(pages).toBe(4)
    expect(seen).toEqual(fleet.cameraIds)
  })

  it('lists an order reassigned away from maintenance as removed, and gives it to the new assignee', async () => {
    const before = await pull('maintenance')
    const beforeOther = await pull('maintenance2')
    await tdb.db
      .update(workOrders)
      .set({ assigneeId: users.maintenance2.id, version: 2 })
      .where(eq(workOrders.id, orderIds.forMaintenance))
    await recordChanges(tdb.db, SYNC_ENTITIES.workOrder, [orderIds.forMaintenance])
    await settle()
    const mine = await pull('maintenance', before.cursor)
    expect(mine.workOrders).toEqual([])
    expect(mine.removed.workOrders).toEqual([orderIds.forMaintenance])
    const theirs = await pull('maintenance2', beforeOther.cursor)
    expect(theirs.workOrders.map((w) => w.id)).toEqual([orderIds.forMaintenance])
    expect(theirs.removed.workOrders).toEqual([])
  })

  it('passes deletions on as removed ids', async () => {
    const start = await pull('inspector')
    await recordChanges(tdb.db, SYNC_ENTITIES.round, [otherRound], 'delete')
    await settle()
    const res = await pull('inspector', start.cursor)
    expect(res.removed.rounds).toEqual([otherRound])
  })
})

describe('the request', () => {
  it('answers 400 for a malformed cursor and 401 without a session', async () => {
    const bad = await request(app)
      .get('/api/sync/pull?cursor=abc')
      .set('Authorization', `Bearer ${tokens.inspector}`)
    expect(bad.status).toBe(400)
    expect((await request(app).get('/api/sync/pull')).status).toBe(401)
  })
})
