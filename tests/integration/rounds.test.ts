// Rounds over HTTP: a supervisor assigns cameras or a whole site to an inspector with a due
// date, lists and cancels rounds; the inspector's device receives them through sync pull.
import { and, eq } from 'drizzle-orm'
import type { Express } from 'express'
import request from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { auditLog, changes } from '../../server/db/schema'
import { pullResponseSchema } from '../../shared/schemas/sync'
import { assigneeListSchema, roundDetailSchema, roundListSchema } from '../../shared/schemas/rounds'
import { now, seedFleet } from './fleetFixture'
import type { Fleet } from './fleetFixture'
import { createUser, makeApp, signIn, testConfig } from './helpers/app'
import type { TestUser } from './helpers/app'
import { createTestDatabase } from './helpers/db'
import type { TestDatabase } from './helpers/db'

let tdb: TestDatabase
let app: Express
let fleet: Fleet
let other: TestUser
let retired: TestUser
let supervisor: TestUser
const token: Record<string, string> = {}

beforeAll(async () => {
  tdb = await createTestDatabase()
  fleet = await seedFleet(tdb.db)
  app = makeApp(tdb.db, { now, config: testConfig({ syncSettleMs: 0 }) }).app
  supervisor = await createUser(tdb.db, 'supervisor')
  token.supervisor = (await signIn(app, supervisor)).token
  for (const role of ['admin', 'maintenance'] as const)
    token[role] = (await signIn(app, await createUser(tdb.db, role))).token
  token.inspector = (await signIn(app, fleet.inspector)).token
  other = await createUser(tdb.db, 'inspector', { name: 'Otto Other' })
  token.other = (await signIn(app, other)).token
  retired = await createUser(tdb.db, 'inspector', { active: false, name: 'Rita Retired' })
})
afterAll(() => tdb?.drop())

const as = (role: string) => ({
  get: (p: string) => request(app).get(p).set('Authorization', `Bearer ${token[role]}`),
  post: (p: string, body: unknown) =>
    request(app)
      .post(p)
      .set('Authorization', `Bearer ${token[role]}`)
      .send(body as object),
})
const due = '2025-06-30T17:00:00.000Z' // after the fixture's fixed now (2025-06-15)

async function roundChanges(id: number) {
  return tdb.db
    .select()
    .from(changes)
    .where(and(eq(changes.entity, 'round'), eq(changes.entityId, String(id))))
}

describe('assigning a round', () => {
  let siteRoundId: number

  it('a whole site: every active camera there (retired ones left out)', async () => {
    const res = await as('supervisor').post('/api/rounds', {
      name: 'South Yard June',
      assigneeId: fleet.inspector.id,
      dueAt: due,
      siteId: fleet.siteIds.south,
    })
    expect(res.status).toBe(201)
    const r = roundDetailSchema.parse(res.body)
    siteRoundId = r.id
    expect(r).toMatchObject({
      name: 'South Yard June',
      siteName: 'South Yard',
      assigneeName: 'Ida Inspector',
      status: 'open',
      cameraCount: 2,
      doneCount: 0,
      dueAt: due,
    })
    expect(r.cameras.map((c) => c.assetTag)).toEqual(['S1', 'S2'])
    // Written to the change feed (devices pull it) and to the audit log.
    expect(await roundChanges(r.id)).toHaveLength(1)
    const [entry] = await tdb.db
      .select()
      .from(auditLog)
      .where(and(eq(auditLog.entity, 'round'), eq(auditLog.entityId, String(r.id))))
    expect(entry).toMatchObject({ action: 'round.create', actorId: supervisor.id })
    expect(entry.detail).toMatchObject({ cameraCount: 2 })
  })

  it('chosen cameras, optionally checked against a site', async () => {
    const res = await as('supervisor').post('/api/rounds', {
      name: 'North re-checks',
      assigneeId: other.id,
      dueAt: due,
      siteId: fleet.siteIds.north,
      cameraIds: [fleet.cameraIds.N1, fleet.cameraIds.N3, fleet.cameraIds.N1],
    })
    expect(res.status).toBe(201)
    expect(roundDetailSchema.parse(res.body).cameras.map((c) => c.assetTag)).toEqual(['N1', 'N3'])
    const elsewhere = await as('supervisor').post('/api/rounds', {
      name: 'Mixed',
      assigneeId: other.id,
      dueAt: due,
      siteId: fleet.siteIds.south,
      cameraIds: [fleet.cameraIds.N1],
    })
    expect(elsewhere.status).toBe(400)
    expect(elsewhere.body.error.code).toBe('round.bad_cameras')
  })

  it('refuses retired or unknown cameras, non-inspectors, past due dates and wrong types', async () => {
    const base = { name: 'x', assigneeId: fleet.inspector.id, dueAt: due }
    const cases: [unknown, number, string][] = [
      [{ ...base, cameraIds: [fleet.cameraIds.S3] }, 400, 'round.bad_cameras'],
      [{ ...base, cameraIds: [999999] }, 400, 'round.bad_cameras'],
      [
        { ...base, assigneeId: supervisor.id, siteId: fleet.siteIds.north },
        400,
        'round.bad_assignee',
      ],
      [{ ...base, assigneeId: retired.id, siteId: fleet.siteIds.north }, 400, 'round.bad_assignee'],
      [
        { ...base, dueAt: '2025-06-01T00:00:00Z', siteId: fleet.siteIds.north },
        400,
        'round.past_due',
      ],
      [{ ...base }, 400, 'request.invalid'],
      [{ name: '', assigneeId: 'ida', dueAt: 'tomorrow', cameraIds: 'N1' }, 400, 'request.invalid'],
    ]
    for (const [body, status, code] of cases) {
      const res = await as('supervisor').post('/api/rounds', body)
      expect(res.status, JSON.stringify(body)).toBe(status)
      expect(res.body.error.code).toBe(code)
    }
    const wrong = await as('supervisor').post('/api/rounds', {
      name: '',
      assigneeId: 'ida',
      dueAt: 'tomorrow',
      cameraIds: 'N1',
    })
    expect(Object.keys(wrong.body.error.details.fields).sort()).toEqual([
      'assigneeId',
      'cameraIds',
      'dueAt',
      'name',
    ])
  })

  it('lists the inspectors a round can go to (active ones only)', async () => {
    const list = assigneeListSchema.parse((await as('supervisor').get('/api/round-assignees')).body)
    const names = list.items.map((i) => i.name)
    expect(names).toContain('Ida Inspector')
    expect(names).toContain('Otto Other')
    expect(names).not.toContain('Rita Retired')
  })

  it('inspectors see only their own rounds; supervisors and admins see all', async () => {
    const all = roundListSchema.parse((await as('supervisor').get('/api/rounds')).body)
    expect(all.total).toBe(2)
    expect(roundListSchema.parse((await as('admin').get('/api/rounds')).body).total).toBe(2)
    const mine = roundListSchema.parse((await as('inspector').get('/api/rounds')).body)
    expect(mine.items.map((r) => r.name)).toEqual(['South Yard June'])
    expect((await as('other').get(`/api/rounds/${siteRoundId}`)).status).toBe(404)
    expect((await as('inspector').get(`/api/rounds/${siteRoundId}`)).status).toBe(200)
  })

  it('the inspector’s device receives the round through sync pull, and its cancellation', async () => {
    const first = pullResponseSchema.parse((await as('inspector').get('/api/sync/pull')).body)
    const pulled = first.rounds.find((r) => r.id === siteRoundId)
    expect(pulled).toMatchObject({ status: 'open', assigneeId: fleet.inspector.id })
    expect(pulled!.cameras.map((c) => c.cameraId).sort()).toEqual(
      [fleet.cameraIds.S1, fleet.cameraIds.S2].sort(),
    )
    // The other inspector's device does not get it.
    const theirs = pullResponseSchema.parse((await as('other').get('/api/sync/pull')).body)
    expect(theirs.rounds.map((r) => r.id)).not.toContain(siteRoundId)

    const cancel = await as('supervisor').post(`/api/rounds/${siteRoundId}/cancel`, {
      reason: 'Site closed for works',
    })
    expect(cancel.status).toBe(200)
    expect(roundDetailSchema.parse(cancel.body).status).toBe('cancelled')
    expect(await roundChanges(siteRoundId)).toHaveLength(2)
    const next = pullResponseSchema.parse(
      (await as('inspector').get(`/api/sync/pull?cursor=${first.cursor}`)).body,
    )
    expect(next.rounds.find((r) => r.id === siteRoundId)?.status).toBe('cancelled')
    const [entry] = await tdb.db
      .select()
      .from(auditLog)
      .where(and(eq(auditLog.action, 'round.cancel'), eq(auditLog.entityId, String(siteRoundId))))
    expect(entry.detail).toMatchObject({
      reason: 'Site closed for works',
      after: { status: 'cancelled' },
    })

    const again = await as('supervisor').post(`/api/rounds/${siteRoundId}/cancel`, {})
    expect(again.status).toBe(409)
    expect(again.body.error.code).toBe('round.not_open')
  })
})

describe('who may do what with rounds', () => {
  it('only supervisors assign and cancel; maintenance may not read', async () => {
    const body = {
      name: 'x',
      assigneeId: fleet.inspector.id,
      dueAt: due,
      siteId: fleet.siteIds.north,
    }
    for (const role of ['inspector', 'admin', 'maintenance']) {
      expect((await as(role).post('/api/rounds', body)).status).toBe(403)
      expect((await as(role).post('/api/rounds/1/cancel', {})).status).toBe(403)
      expect((await as(role).get('/api/round-assignees')).status).toBe(403)
    }
    expect((await as('maintenance').get('/api/rounds')).status).toBe(403)
    expect((await request(app).get('/api/rounds')).status).toBe(401)
    expect((await as('supervisor').get('/api/rounds/999999')).status).toBe(404)
  })
})
