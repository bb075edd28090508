// Work orders over real HTTP and a real MariaDB: who may do what, the status flow, the version
// check, the append-only history, the list filters and photos.
import { eq } from 'drizzle-orm'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { cameras, changes, workOrderHistory, workOrders } from '../../server/db/schema'
import { workOrderDetailSchema, workOrderListSchema } from '../../shared/schemas/workOrders'
import type { WorkOrderDetail } from '../../shared/schemas/workOrders'
import { createTestDatabase } from './helpers/db'
import type { TestDatabase } from './helpers/db'
import { WORLD_TASK, api, buildWorld } from './helpers/workOrderWorld'
import type { World } from './helpers/workOrderWorld'

let tdb: TestDatabase
let w: World

beforeAll(async () => {
  tdb = await createTestDatabase()
  w = await buildWorld(tdb.db)
})
afterAll(() => tdb?.drop())

async function openByHand(cameraId: number, extra: object = {}): Promise<WorkOrderDetail> {
  const res = await api(w, 'supervisor').post('/api/work-orders', { cameraId, ...extra })
  expect(res.status, JSON.stringify(res.body)).toBe(201)
  return workOrderDetailSchema.parse(res.body)
}

async function act(who: Parameters<typeof api>[1], order: { id: number; version: number }, body: object) {
  return api(w, who).act(order.id, { version: order.version, ...body })
}

describe('opening by hand', () => {
  it('a supervisor opens one; priority and due date come from the camera task', async () => {
    const before = Date.now()
    const order = await openByHand(w.cameraIds[0], { title: 'Dome fogged after rain' })
    expect(order).toMatchObject({ status: 'open', priority: WORLD_TASK.priority, version: 1, assigneeId: null })
    const dueMs = new Date(order.dueAt!).getTime() - before
    // workOrderDueDays = 3 in the world's task: due 3 days after opening.
    expect(dueMs).toBeGreaterThanOrEqual(3 * 86_400_000 - 1000)
    expect(dueMs).toBeLessThanOrEqual(3 * 86_400_000 + 60_000)
    expect(order.history.map((h) => h.action)).toEqual(['opened'])
    expect(order.history[0].actorName).toBe('Rhea Lindqvist')
  })

  it('a second order for the same camera is refused while one is open (409 with its id)', async () => {
    const res = await api(w, 'supervisor').post('/api/work-orders', { cameraId: w.cameraIds[0] })
    expect(res.status).toBe(409)
    expect(res.body.error.code).toBe('work_order.already_open')
    const [first] = await tdb.db.select().from(workOrders).where(eq(workOrders.cameraId, w.cameraIds[0]))
    expect(res.body.error.details.workOrderId).toBe(first.id)
  })

  it('maintenance and inspectors may not open orders', async () => {
    for (const who of ['maint1', 'inspector'] as const) {
      const res = await api(w, who).post('/api/work-orders', { cameraId: w.cameraIds[1] })
      expect(res.status).toBe(403)
    }
  })

  it('an unknown camera is a 404', async () => {
    const res = await api(w, 'supervisor').post('/api/work-orders', { cameraId: 999999 })
    expect(res.status).toBe(404)
    expect(res.body.error.code).toBe('camera.not_found')
  })
})

describe('the status flow and who may do what', () => {
  let order: WorkOrderDetail
  beforeAll(async () => {
    order = await openByHand(w.cameraIds[1])
  })

  it('maintenance cannot assign or reassign; an inspector cannot act at all', async () => {
    const asMaint = await act('maint1', order, { action: 'assign', assigneeId: w.users.maint1.id })
    expect(asMaint.status).toBe(403)
    const asInspector = await act('inspector', order, { action: 'assign', assigneeId: w.users.maint1.id })
    expect(asInspector.status).toBe(403)
    expect(asInspector.body.error.code).toBe('auth.forbidden')
  })

  it('assigning needs a maintenance user; a supervisor assigns', async () => {
    const missing = await act('supervisor', order, { action: 'assign' })
    expect(missing.status).toBe(400)
    expect(missing.body.error.details.fields.assigneeId).toBeDefined()
    const toInspector = await act('supervisor', order, { action: 'assign', assigneeId: w.users.inspector.id })
    expect(toInspector.status).toBe(400)
    expect(toInspector.body.error.code).toBe('work_order.bad_assignee')

    const ok = await act('supervisor', order, { action: 'assign', assigneeId: w.users.maint1.id })
    expect(ok.status).toBe(200)
    order = workOrderDetailSchema.parse(ok.body)
    expect(order).toMatchObject({ status: 'assigned', assigneeId: w.users.maint1.id, assigneeName: 'Piet Alvarez', version: 2 })
  })

  it('maintenance cannot reassign, and cannot act on an order that is not theirs', async () => {
    const reassign = await act('maint1', order, { action: 'reassign', assigneeId: w.users.maint2.id, reason: 'busy' })
    expect(reassign.status).toBe(403)
    expect(reassign.body.error.code).toBe('work_order.not_allowed')
    const other = await act('maint2', order, { action: 'start' })
    expect(other.status).toBe(403)
    expect(other.body.error.message).toContain('not assigned to you')
    expect((await api(w, 'maint2').get(`/api/work-orders/${order.id}`)).status).toBe(403)
  })

  it('reassigning needs a reason, then moves the order to the new person', async () => {
    const noReason = await act('supervisor', order, { action: 'reassign', assigneeId: w.users.maint2.id })
    expect(noReason.status).toBe(400)
    expect(noReason.body.error.details.fields.reason).toEqual(['Give a reason.'])
    const ok = await act('supervisor', order, {
      action: 'reassign',
      assigneeId: w.users.maint2.id,
      reason: 'Piet is on leave this week.',
    })
    expect(ok.status).toBe(200)
    order = workOrderDetailSchema.parse(ok.body)
    expect(order).toMatchObject({ status: 'assigned', assigneeId: w.users.maint2.id, version: 3 })
    const last = order.history.at(-1)!
    expect(last).toMatchObject({
      action: 'reassigned',
      actorName: 'Rhea Lindqvist',
      fromAssigneeName: 'Piet Alvarez',
      toAssigneeName: 'Mina Sorensen',
      reason: 'Piet is on leave this week.',
    })
    // The previous assignee has lost it.
    expect((await act('maint1', order, { action: 'start' })).status).toBe(403)
  })

  it('nobody closes an order by hand', async () => {
    for (const who of ['supervisor', 'maint2'] as const) {
      const res = await act(who, order, { action: 'close' })
      expect(res.status).toBe(403)
      expect(res.body.error.message).toContain('passing re-check')
    }
    // An inspector is refused by the route itself.
    expect((await act('inspector', order, { action: 'close' })).status).toBe(403)
  })

  it('a stale version is refused with 409 and the current order', async () => {
    const res = await act('maint2', { id: order.id, version: order.version - 1 }, { action: 'start' })
    expect(res.status).toBe(409)
    expect(res.body.error.code).toBe('work_order.stale')
    const current = workOrderDetailSchema.parse(res.body.error.details.current)
    expect(current.version).toBe(order.version)
    expect(current.status).toBe('assigned')
    const [row] = await tdb.db.select().from(workOrders).where(eq(workOrders.id, order.id))
    expect(row.status).toBe('assigned') // nothing changed
  })

  it('maintenance starts work (camera in repair), then asks for a re-check; no going back', async () => {
    let res = await act('maint2', order, { action: 'start' })
    expect(res.status).toBe(200)
    order = workOrderDetailSchema.parse(res.body)
    expect(order.status).toBe('in_progress')
    const [cam] = await tdb.db.select().from(cameras).where(eq(cameras.id, order.cameraId))
    expect(cam.state).toBe('in_repair')
    res = await act('maint2', order, { action: 'request_recheck', note: 'Refocused and cleaned the dome.' })
    expect(res.status).toBe(200)
    order = workOrderDetailSchema.parse(res.body)
    expect(order.status).toBe('awaiting_recheck')
    res = await act('maint2', order, { action: 'start' })
    expect(res.status).toBe(409)
    expect(res.body.error.code).toBe('work_order.invalid_transition')
  })

  it('a supervisor cancels with a reason; nothing moves after that', async () => {
    const noReason = await act('supervisor', order, { action: 'cancel' })
    expect(noReason.status).toBe(400)
    const ok = await act('supervisor', order, { action: 'cancel', reason: 'Camera replaced instead.' })
    expect(ok.status).toBe(200)
    order = workOrderDetailSchema.parse(ok.body)
    expect(order.status).toBe('cancelled')
    expect(order.closedAt).not.toBeNull()
    for (const body of [
      { action: 'comment', note: 'late' },
      { action: 'cancel', reason: 'again' },
      { action: 'reassign', assigneeId: w.users.maint1.id, reason: 'late' },
    ]) {
      const res = await act('supervisor', order, body)
      expect(res.status).toBe(409)
      expect(res.body.error.code).toBe('work_order.invalid_transition')
    }
    // The camera leaves repair: it is failing again until someone fixes it.
    const [cam] = await tdb.db.select().from(cameras).where(eq(cameras.id, order.cameraId))
    expect(cam.state).toBe('failing')
    // The camera may get a new order now.
    expect((await openByHand(w.cameraIds[1])).status).toBe('open')
  })
})

describe('history, version and change feed', () => {
  it('every change appends one history entry, bumps the version and writes a change row; old entries never change', async () => {
    const order = await openByHand(w.cameraIds[2])
    const steps = [
      { who: 'supervisor', body: { action: 'assign', assigneeId: w.users.maint1.id } },
      { who: 'maint1', body: { action: 'start' } },
      { who: 'maint1', body: { action: 'comment', note: 'Lens ring was loose; tightened.' } },
      { who: 'supervisor', body: { action: 'comment', note: 'Thanks — <b>check the seal</b> too.' } },
      { who: 'maint1', body: { action: 'request_recheck', note: 'Refocused at 8 m.' } },
    ] as const
    let version = order.version
    let snapshot = await tdb.db.select().from(workOrderHistory).where(eq(workOrderHistory.workOrderId, order.id))
    for (const step of steps) {
      const res = await api(w, step.who).act(order.id, { ...step.body, version })
      expect(res.status, JSON.stringify(res.body)).toBe(200)
      expect(res.body.version).toBe(version + 1)
      version++
      const now = await tdb.db.select().from(workOrderHistory).where(eq(workOrderHistory.workOrderId, order.id))
      expect(now.length).toBe(snapshot.length + 1)
      expect(now.slice(0, snapshot.length)).toEqual(snapshot) // earlier entries untouched
      snapshot = now
    }
    expect(snapshot.map((h) => h.action)).toEqual([
      'opened',
      'assigned',
      'started',
      'comment',
      'comment',
      'recheck_requested',
    ])
    expect(snapshot.map((h) => h.toStatus)).toEqual([
      'open',
      'assigned',
      'in_progress',
      'in_progress',
      'in_progress',
      'awaiting_recheck',
    ])
    expect(snapshot[4].note).toBe('Thanks — <b>check the seal</b> too.')
    const feed = await tdb.db.select().from(changes).where(eq(changes.entityId, String(order.id)))
    expect(feed.filter((c) => c.entity === 'work_order').length).toBe(1 + steps.length)
  })
})

describe('the list', () => {
  it('filters by status, assignee, site and overdue; maintenance sees only its own', async () => {
    const a = await openByHand(w.otherCamera, { dueAt: new Date(Date.now() - 86_400_000).toISOString() })
    const assigned = await act('supervisor', a, { action: 'assign', assigneeId: w.users.maint2.id })
    expect(assigned.status).toBe(200)

    const all = workOrderListSchema.parse((await api(w, 'supervisor').get('/api/work-orders?limit=500')).body)
    const ids = all.items.map((o) => o.id)
    expect(ids).toContain(a.id)

    const overdue = workOrderListSchema.parse((await api(w, 'supervisor').get('/api/work-orders?overdue=true')).body)
    expect(overdue.items.map((o) => o.id)).toEqual([a.id])
    expect(overdue.items[0].overdue).toBe(true)

    const atOther = workOrderListSchema.parse(
      (await api(w, 'supervisor').get(`/api/work-orders?siteId=${w.otherSiteId}`)).body,
    )
    expect(atOther.items.map((o) => o.id)).toEqual([a.id])

    const cancelled = workOrderListSchema.parse(
      (await api(w, 'supervisor').get('/api/work-orders?status=cancelled')).body,
    )
    expect(cancelled.items.every((o) => o.status === 'cancelled')).toBe(true)
    expect(cancelled.total).toBe(1)

    const byAssignee = workOrderListSchema.parse(
      (await api(w, 'supervisor').get(`/api/work-orders?assigneeId=${w.users.maint1.id}`)).body,
    )
    expect(byAssignee.items.every((o) => o.assigneeId === w.users.maint1.id)).toBe(true)
    expect(byAssignee.total).toBeGreaterThan(0)

    // maint2 asks for everything (and for maint1's orders): gets only its own.
    for (const q of ['', `?assigneeId=${w.users.maint1.id}`]) {
      const mine = workOrderListSchema.parse((await api(w, 'maint2').get(`/api/work-orders${q}`)).body)
      expect(mine.items.length).toBeGreaterThan(0)
      expect(mine.items.every((o) => o.assigneeId === w.users.maint2.id)).toBe(true)
    }
  })

  it('bad filters are a 400 with field messages', async () => {
    const res = await api(w, 'supervisor').get('/api/work-orders?status=done&overdue=maybe')
    expect(res.status).toBe(400)
    expect(Object.keys(res.body.error.details.fields).sort()).toEqual(['overdue', 'status'])
  })

  it('supervisors get the maintenance users to assign to', async () => {
    const res = await api(w, 'supervisor').get('/api/assignees')
    expect(res.status).toBe(200)
    const names = res.body.items.map((u: { name: string }) => u.name)
    expect(names).toEqual(expect.arrayContaining(['Piet Alvarez', 'Mina Sorensen']))
    expect(names).not.toContain('Jonas Ekwueme')
    expect((await api(w, 'maint1').get('/api/assignees')).status).toBe(403)
  })
})
