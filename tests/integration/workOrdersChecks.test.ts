// Checks drive work orders: a failing check opens one (one open order per camera), a passing
// re-check closes it and records which check did, a failing re-check sends it back. Checks are
// recorded the way a phone's sync does (`check.create`), so the real check hook runs.
import { randomUUID } from 'node:crypto'
import { eq } from 'drizzle-orm'
import request from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { workOrderHistory, workOrders } from '../../server/db/schema'
import { isDuplicateEntry } from '../../server/db/mysqlErrors'
import { workOrderDetailSchema } from '../../shared/schemas/workOrders'
import type { WorkOrderDetail } from '../../shared/schemas/workOrders'
import { createTestDatabase } from './helpers/db'
import type { TestDatabase } from './helpers/db'
import { WORLD_TASK, api, buildWorld, openOrderOf, recordTestCheck } from './helpers/workOrderWorld'
import type { Person, World } from './helpers/workOrderWorld'

let tdb: TestDatabase
let w: World

beforeAll(async () => {
  tdb = await createTestDatabase()
  w = await buildWorld(tdb.db)
})
afterAll(() => tdb?.drop())

async function detail(id: number): Promise<WorkOrderDetail> {
  return workOrderDetailSchema.parse((await api(w, 'supervisor').get(`/api/work-orders/${id}`)).body)
}

async function act(who: Person, o: WorkOrderDetail, body: object): Promise<WorkOrderDetail> {
  const res = await api(w, who).act(o.id, { version: o.version, ...body })
  expect(res.status, JSON.stringify(res.body)).toBe(200)
  return workOrderDetailSchema.parse(res.body)
}

/** Pushes a `workOrder.action` operation as a phone would. */
async function pushAction(who: Person, payload: object): Promise<{ status: string; code?: string; reason?: string }> {
  const opId = randomUUID()
  const res = await request(w.app)
    .post('/api/sync/push')
    .set('Authorization', `Bearer ${w.token[who]}`)
    .send({ deviceId: `phone-${who}`, ops: [{ id: opId, kind: 'workOrder.action', payload }] })
  expect(res.status).toBe(200)
  return res.body.results[0]
}

describe('failing checks open work orders', () => {
  it('the first failing check opens an order with the task priority and due date; later failures add to it', async () => {
    const cam = w.cameraIds[0]
    const first = await recordTestCheck(w, 'inspector', cam, 'fail')
    const id = await openOrderOf(tdb.db, cam)
    expect(id).toBeDefined()
    let o = await detail(id!)
    expect(o).toMatchObject({ status: 'open', priority: WORLD_TASK.priority, openedByCheckId: first })
    const dueInMs = new Date(o.dueAt!).getTime() - new Date(o.createdAt).getTime()
    expect(dueInMs).toBe(WORLD_TASK.dueDays * 86_400_000)
    expect(o.history[0]).toMatchObject({ action: 'opened', checkId: first, actorName: 'Jonas Ekwueme' })

    const second = await recordTestCheck(w, 'inspector2', cam, 'fail')
    const rows = await tdb.db.select().from(workOrders).where(eq(workOrders.cameraId, cam))
    expect(rows.length).toBe(1)
    o = await detail(id!)
    expect(o.history.map((h) => [h.action, h.checkId])).toEqual([
      ['opened', first],
      ['check_fail', second],
    ])
  })

  it('a passing or marginal check opens nothing', async () => {
    await recordTestCheck(w, 'inspector', w.cameraIds[1], 'pass')
    await recordTestCheck(w, 'inspector', w.cameraIds[1], 'marginal')
    expect(await openOrderOf(tdb.db, w.cameraIds[1])).toBeUndefined()
  })

  it('an old failing check synced after a newer passing one opens nothing', async () => {
    const cam = w.cameraIds[1]
    await recordTestCheck(w, 'inspector', cam, 'fail', new Date(Date.now() - 3 * 86_400_000))
    expect(await openOrderOf(tdb.db, cam)).toBeUndefined()
  })

  it('the database itself refuses a second open order for a camera', async () => {
    const cam = w.cameraIds[0]
    const err = await tdb.db
      .insert(workOrders)
      .values({ cameraId: cam, title: 'duplicate', status: 'assigned' })
      .then(() => null, (e: unknown) => e)
    expect(isDuplicateEntry(err, 'work_orders_open_camera_uq')).toBe(true)
    // A closed or cancelled order does not count: those may pile up.
    await tdb.db.insert(workOrders).values({ cameraId: cam, title: 'old', status: 'cancelled' })
    await tdb.db.insert(workOrders).values({ cameraId: cam, title: 'older', status: 'closed' })
  })

  it('failing checks of one camera arriving together open exactly one order', async () => {
    const cam = w.cameraIds[3]
    await Promise.all([
      recordTestCheck(w, 'inspector', cam, 'fail'),
      recordTestCheck(w, 'inspector2', cam, 'fail'),
      recordTestCheck(w, 'inspector', cam, 'fail'),
    ])
    const rows = await tdb.db.select().from(workOrders).where(eq(workOrders.cameraId, cam))
    expect(rows.length).toBe(1)
    const history = await tdb.db.select().from(workOrderHistory).where(eq(workOrderHistory.workOrderId, rows[0].id))
    expect(history.map((h) => h.action).sort()).toEqual(['check_fail', 'check_fail', 'opened'])
  })
})

describe('re-checks close or return the order', () => {
  it('a failing re-check sends it back to the same assignee; a passing one closes it and records the check', async () => {
    const cam = w.cameraIds[2]
    await recordTestCheck(w, 'inspector2', cam, 'fail')
    let o = await detail((await openOrderOf(tdb.db, cam))!)
    o = await act('supervisor', o, { action: 'assign', assigneeId: w.users.maint1.id })
    o = await act('maint1', o, { action: 'start' })

    // A passing check while work is still under way is noted but closes nothing.
    await recordTestCheck(w, 'inspector', cam, 'pass')
    o = await detail(o.id)
    expect(o.status).toBe('in_progress')
    expect(o.history.at(-1)!.action).toBe('check_pass')

    o = await act('maint1', o, { action: 'request_recheck', note: 'Refocused.' })
    const failing = await recordTestCheck(w, 'inspector2', cam, 'fail')
    o = await detail(o.id)
    expect(o).toMatchObject({ status: 'assigned', assigneeId: w.users.maint1.id, closedByCheckId: null })
    expect(o.history.at(-1)).toMatchObject({ action: 'recheck_failed', checkId: failing, fromStatus: 'awaiting_recheck', toStatus: 'assigned' })

    o = await act('maint1', o, { action: 'request_recheck', note: 'New lens fitted.' })
    // A check captured before this request (an old one, synced late) does not count as the re-check.
    await recordTestCheck(w, 'inspector', cam, 'pass', new Date(Date.now() - 60_000))
    expect((await detail(o.id)).status).toBe('awaiting_recheck')

    const passing = await recordTestCheck(w, 'inspector', cam, 'pass')
    o = await detail(o.id)
    expect(o).toMatchObject({ status: 'closed', closedByCheckId: passing })
    expect(o.closedAt).not.toBeNull()
    expect(o.history.at(-1)).toMatchObject({ action: 'closed', checkId: passing, actorName: 'Jonas Ekwueme' })
    expect(await openOrderOf(tdb.db, cam)).toBeUndefined()

    // The next failure opens a new order.
    await recordTestCheck(w, 'inspector', cam, 'fail')
    const next = await openOrderOf(tdb.db, cam)
    expect(next).toBeDefined()
    expect(next).not.toBe(o.id)
  })
})

describe('work-order actions through sync (workOrder.action)', () => {
  it('maintenance updates offline: an older version still applies while the table allows it; conflicts are rejected with a reason', async () => {
    const opened = await api(w, 'supervisor').post('/api/work-orders', { cameraId: w.otherCamera })
    let o = workOrderDetailSchema.parse(opened.body)
    o = await act('supervisor', o, { action: 'assign', assigneeId: w.users.maint2.id })
    const seen = o.version
    // Meanwhile the supervisor adds a note (version moves on).
    o = await act('supervisor', o, { action: 'comment', note: 'Bring the long ladder.' })

    const start = await pushAction('maint2', { workOrderId: o.id, action: 'start', version: seen })
    expect(start.status).toBe('applied')
    const note = await pushAction('maint2', { workOrderId: o.id, action: 'comment', version: seen + 1, note: 'On site, no signal here.' })
    expect(note.status).toBe('applied')
    o = await detail(o.id)
    expect(o.status).toBe('in_progress')
    expect(o.history.slice(-2).map((h) => [h.action, h.actorName])).toEqual([
      ['started', 'Mina Sorensen'],
      ['comment', 'Mina Sorensen'],
    ])

    // Reassigned away while the phone was offline: its queued re-check request is refused.
    o = await act('supervisor', o, { action: 'reassign', assigneeId: w.users.maint1.id, reason: 'Mina is needed at the quarry.' })
    const late = await pushAction('maint2', { workOrderId: o.id, action: 'request_recheck', version: seen + 2 })
    expect(late.status).toBe('rejected')
    expect(late.code).toBe('work_order.not_allowed')
    expect(late.reason).toContain('not assigned to you')
    expect((await detail(o.id)).status).toBe('assigned')

    const bad = await pushAction('maint1', { workOrderId: o.id, action: 'reassign', version: o.version })
    expect(bad.status).toBe('rejected')
  })

  it('the same operation pushed twice applies once; inspectors may not send work-order actions', async () => {
    let o = workOrderDetailSchema.parse((await api(w, 'supervisor').get(`/api/work-orders/${await openOrderOf(tdb.db, w.otherCamera)}`)).body)
    const op = {
      id: randomUUID(),
      kind: 'workOrder.action',
      payload: { workOrderId: o.id, action: 'comment', version: o.version, note: 'Sent twice by a flaky connection.' },
    }
    const push = (who: Person, ops: object[]) =>
      request(w.app).post('/api/sync/push').set('Authorization', `Bearer ${w.token[who]}`).send({ deviceId: `phone-${who}`, ops })
    const first = await push('maint1', [op])
    const again = await push('maint1', [op])
    expect(first.body.results[0].status).toBe('applied')
    expect(again.body.results[0].status).toBe('duplicate')
    const after = await detail(o.id)
    expect(after.version).toBe(o.version + 1)
    expect(after.history.filter((h) => h.note === 'Sent twice by a flaky connection.').length).toBe(1)
    o = after

    const byInspector = await push('inspector', [{ ...op, id: randomUUID() }])
    expect(byInspector.body.results[0].status).toBe('rejected')
    expect((await detail(o.id)).version).toBe(o.version)
  })
})
