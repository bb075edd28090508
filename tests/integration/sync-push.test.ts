import { and, count, eq, like } from 'drizzle-orm'
import type { Express } from 'express'
import request from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import {
  auditLog,
  cameras,
  changes,
  checks,
  measurements,
  roundCameras,
  rounds,
  syncOperations,
} from '../../server/db/schema'
import { onCheckRecorded } from '../../server/services/checkHooks'
import { OpRejection } from '../../server/services/sync/registry'
import { pushResponseSchema } from '../../shared/schemas/sync'
import type { SyncOpResult } from '../../shared/schemas/sync'
import { createUser, makeApp, signIn } from './helpers/app'
import type { TestUser } from './helpers/app'
import { createTestDatabase } from './helpers/db'
import type { TestDatabase } from './helpers/db'
import { checkPayload, createFleet, createRound, op } from './helpers/fleet'
import type { TestFleet } from './helpers/fleet'

// POST /api/sync/push against the real database: idempotent replays, one bad operation among
// good ones, role rules per kind, two devices at once, and the camera status a check leaves.

let tdb: TestDatabase
let app: Express
let fleet: TestFleet
const users = {} as Record<'inspector' | 'inspector2' | 'supervisor' | 'maintenance', TestUser>
const tokens = {} as Record<keyof typeof users, string>

beforeAll(async () => {
  tdb = await createTestDatabase()
  app = makeApp(tdb.db).app
  fleet = await createFleet(tdb.db, 12)
  users.inspector = await createUser(tdb.db, 'inspector')
  users.inspector2 = await createUser(tdb.db, 'inspector')
  users.supervisor = await createUser(tdb.db, 'supervisor')
  users.maintenance = await createUser(tdb.db, 'maintenance')
  for (const k of Object.keys(users) as (keyof typeof users)[]) {
    tokens[k] = (await signIn(app, users[k])).token
  }
})
afterAll(() => tdb?.drop())

async function push(who: keyof typeof users, ops: unknown[], deviceId = `phone-${who}`) {
  const res = await request(app)
    .post('/api/sync/push')
    .set('Authorization', `Bearer ${tokens[who]}`)
    .send({ deviceId, ops })
  if (res.status !== 200)
    throw new Error(`push answered ${res.status}: ${JSON.stringify(res.body)}`)
  return pushResponseSchema.parse(res.body).results
}

async function rows(
  table: typeof checks | typeof measurements | typeof syncOperations,
  where?: ReturnType<typeof eq>,
) {
  const [{ n }] = await tdb.db.select({ n: count() }).from(table).where(where)
  return Number(n)
}

const statuses = (results: SyncOpResult[]) => results.map((r) => r.status)

async function camera(id: number) {
  const [row] = await tdb.db.select().from(cameras).where(eq(cameras.id, id))
  return row
}

async function cameraFeedRows(id: number): Promise<number> {
  const [{ n }] = await tdb.db
    .select({ n: count() })
    .from(changes)
    .where(and(eq(changes.entity, 'camera'), eq(changes.entityId, String(id))))
  return Number(n)
}

describe('replaying a batch', () => {
  it('applies a batch once; the same batch again answers duplicate and writes nothing', async () => {
    const [a, b, c] = fleet.cameraIds
    const checkA = checkPayload(a)
    const batch = [
      op('check.create', checkA),
      op('check.create', checkPayload(b, {}, 3)),
      op('check.create', checkPayload(c)),
      op('check.markBaseline', { checkId: checkA.id, cameraId: a }),
    ]
    expect(statuses(await push('inspector', batch))).toEqual([
      'applied',
      'applied',
      'applied',
      'applied',
    ])
    const before = {
      checks: await rows(checks),
      measurements: await rows(measurements),
      ops: await rows(syncOperations),
      changes: Number((await tdb.db.select({ n: count() }).from(changes))[0].n),
      cameraVersion: (await camera(a)).version,
    }
    expect(before.checks).toBe(3)
    expect(before.measurements).toBe(2 + 3 + 2)
    expect(before.ops).toBe(4)
    expect((await camera(a)).baselineCheckId).toBe(checkA.id)

    const replay = await push('inspector', batch)
    expect(statuses(replay)).toEqual(['duplicate', 'duplicate', 'duplicate', 'duplicate'])
    expect(replay.map((r) => r.id)).toEqual(batch.map((o) => o.id))
    expect(await rows(checks)).toBe(before.checks)
    expect(await rows(measurements)).toBe(before.measurements)
    expect(await rows(syncOperations)).toBe(before.ops)
    expect(Number((await tdb.db.select({ n: count() }).from(changes))[0].n)).toBe(before.changes)
    expect((await camera(a)).version).toBe(before.cameraVersion)
  })

  it('treats the same check under a new operation id as a duplicate', async () => {
    const payload = checkPayload(fleet.cameraIds[3])
    expect(statuses(await push('inspector', [op('check.create', payload)]))).toEqual(['applied'])
    expect(statuses(await push('inspector', [op('check.create', payload)]))).toEqual(['duplicate'])
    expect(await rows(checks, eq(checks.id, payload.id))).toBe(1)
    expect(await rows(measurements, eq(measurements.checkId, payload.id))).toBe(2)
  })

  it('refuses a check id that another inspector already used', async () => {
    const payload = checkPayload(fleet.cameraIds[3])
    await push('inspector', [op('check.create', payload)])
    const [res] = await push('inspector2', [op('check.create', payload)])
    expect(res).toMatchObject({ status: 'rejected', code: 'check.id_taken' })
  })
})

describe('a batch with bad operations', () => {
  it('rejects each bad operation with a reason and still applies the good ones', async () => {
    const good1 = checkPayload(fleet.cameraIds[4])
    const good2 = checkPayload(fleet.cameraIds[5])
    const { cameraId: _dropped, ...noCamera } = checkPayload(fleet.cameraIds[4])
    const batch = [
      op('check.create', good1),
      op('check.create', noCamera),
      op('check.create', checkPayload(999_999)),
      op('check.create', good2),
      op('camera.rename', { name: 'x' }),
      op(
        'check.create',
        checkPayload(fleet.cameraIds[4], {
          capturedAt: new Date(Date.now() + 86_400_000).toISOString(),
        }),
      ),
    ]
    const results = await push('inspector', batch)
    expect(statuses(results)).toEqual([
      'applied',
      'rejected',
      'rejected',
      'applied',
      'rejected',
      'rejected',
    ])
    expect(results[1].code).toBe('op.invalid')
    expect(results[1].reason).toMatch(/cameraId/)
    expect(results[2]).toMatchObject({ code: 'camera.not_found' })
    expect(results[2].reason).toMatch(/999999/)
    expect(results[4].code).toBe('op.unknown_kind')
    expect(results[5].code).toBe('check.in_future')
    expect(await rows(checks, eq(checks.id, good1.id))).toBe(1)
    expect(await rows(checks, eq(checks.id, good2.id))).toBe(1)
    // The refused payload is not dropped: it is kept in the audit log with the reason.
    const [kept] = await tdb.db
      .select()
      .from(auditLog)
      .where(and(eq(auditLog.action, 'sync.rejected'), eq(auditLog.entityId, batch[2].id)))
    expect(kept.detail).toMatchObject({ code: 'camera.not_found', payload: { cameraId: 999_999 } })
  })

  it('judges a rejected operation afresh when it is sent again', async () => {
    const payload = checkPayload(fleet.cameraIds[6])
    const baseline = op('check.markBaseline', { checkId: payload.id, cameraId: fleet.cameraIds[6] })
    const [first] = await push('inspector', [baseline])
    expect(first).toMatchObject({ status: 'rejected', code: 'check.not_found' })
    await push('inspector', [op('check.create', payload)])
    const [second] = await push('inspector', [baseline])
    expect(second.status).toBe('applied')
    expect((await camera(fleet.cameraIds[6])).baselineCheckId).toBe(payload.id)
  })

  it('rolls the whole operation back when a check hook refuses it', async () => {
    const payload = checkPayload(fleet.cameraIds[7], { notes: 'hook-refuses-this' })
    const off = onCheckRecorded(async (_tx, e) => {
      if (e.check.notes === 'hook-refuses-this')
        throw new OpRejection('test.refused', 'Refused by a test hook.')
    })
    try {
      const [res] = await push('inspector', [op('check.create', payload)])
      expect(res).toMatchObject({ status: 'rejected', code: 'test.refused' })
    } finally {
      off()
    }
    expect(await rows(checks, eq(checks.id, payload.id))).toBe(0)
    expect(await rows(measurements, eq(measurements.checkId, payload.id))).toBe(0)
  })
})

describe('who may send what', () => {
  it('refuses checks from maintenance', async () => {
    const [res] = await push('maintenance', [op('check.create', checkPayload(fleet.cameraIds[8]))])
    expect(res).toMatchObject({ status: 'rejected', code: 'op.forbidden' })
  })

  it('lets an inspector set a baseline only at commissioning; a supervisor may replace it', async () => {
    const cam = fleet.cameraIds[8]
    const first = checkPayload(cam, { capturedAt: new Date(Date.now() - 3_600_000).toISOString() })
    const second = checkPayload(cam)
    await push('inspector', [op('check.create', first), op('check.create', second)])
    const [mine] = await push('inspector', [
      op('check.markBaseline', { checkId: first.id, cameraId: cam }),
    ])
    expect(mine.status).toBe('applied')
    const [again] = await push('inspector', [
      op('check.markBaseline', { checkId: second.id, cameraId: cam }),
    ])
    expect(again).toMatchObject({ status: 'rejected', code: 'baseline.exists' })
    const [sup] = await push('supervisor', [
      op('check.markBaseline', { checkId: second.id, cameraId: cam }),
    ])
    expect(sup.status).toBe('applied')
    expect((await camera(cam)).baselineCheckId).toBe(second.id)
    const [old] = await tdb.db.select().from(checks).where(eq(checks.id, first.id))
    expect(old.isBaseline).toBe(false)
    const history = await tdb.db
      .select()
      .from(auditLog)
      .where(and(eq(auditLog.action, 'camera.baseline'), eq(auditLog.entityId, String(cam))))
    expect(history.map((h) => h.detail?.previousBaselineCheckId)).toEqual([null, first.id])
  })
})

describe('two devices at once', () => {
  it('applies the same operation exactly once when two devices push it together', async () => {
    for (let round = 0; round < 5; round++) {
      const shared = op('check.create', checkPayload(fleet.cameraIds[9]))
      const [a, b] = await Promise.all([
        push('inspector', [shared], 'phone-a'),
        push('inspector', [shared], 'phone-b'),
      ])
      expect([a[0].status, b[0].status].sort()).toEqual(['applied', 'duplicate'])
      const id = (shared.payload as { id: string }).id
      expect(await rows(checks, eq(checks.id, id))).toBe(1)
      expect(await rows(syncOperations, eq(syncOperations.opId, shared.id))).toBe(1)
    }
  })

  it('stores a check once when it arrives under two operation ids at the same time', async () => {
    for (let round = 0; round < 5; round++) {
      const payload = checkPayload(fleet.cameraIds[10])
      const [a, b] = await Promise.all([
        push('inspector', [op('check.create', payload)], 'phone-a'),
        push('inspector', [op('check.create', payload)], 'phone-b'),
      ])
      expect([a[0].status, b[0].status].sort()).toEqual(['applied', 'duplicate'])
      expect(await rows(checks, eq(checks.id, payload.id))).toBe(1)
      expect(await rows(measurements, eq(measurements.checkId, payload.id))).toBe(2)
    }
  })
})

describe('what a check does to its camera', () => {
  it('a failing check marks the camera failing, moves its due date and bumps its version', async () => {
    const cam = fleet.cameraIds[11]
    const before = await camera(cam)
    const feedBefore = await cameraFeedRows(cam)
    const capturedAt = new Date(Date.now() - 5 * 60_000)
    const payload = checkPayload(cam, {
      verdict: 'fail',
      medianMtf50CyPx: 0.12,
      capturedAt: capturedAt.toISOString(),
      cameraVersion: before.version,
    })
    await push('inspector', [op('check.create', payload)])
    const after = await camera(cam)
    expect(after).toMatchObject({
      state: 'failing',
      lastVerdict: 'fail',
      lastCheckId: payload.id,
      lastMtf50CyPx: 0.12,
      version: before.version + 1,
    })
    // identify task: 90-day interval (server/db/taskDefaults.ts)
    expect(after.nextDueAt?.getTime()).toBe(capturedAt.getTime() + 90 * 86_400_000)
    // Devices learn about it through the change feed.
    expect(await cameraFeedRows(cam)).toBe(feedBefore + 1)
  })

  it('an older check arriving late is kept but does not overwrite the newer result', async () => {
    const cam = fleet.cameraIds[11]
    const newest = await camera(cam)
    const stale = checkPayload(cam, {
      verdict: 'pass',
      capturedAt: new Date(Date.now() - 3 * 86_400_000).toISOString(),
      cameraVersion: 1,
    })
    const [res] = await push('inspector2', [op('check.create', stale)])
    expect(res.status).toBe('applied')
    const after = await camera(cam)
    expect(after.lastCheckId).toBe(newest.lastCheckId)
    expect(after.state).toBe('failing')
    expect(await rows(checks, eq(checks.id, stale.id))).toBe(1)
    const notes = await tdb.db
      .select({ action: auditLog.action })
      .from(auditLog)
      .where(and(eq(auditLog.entityId, stale.id), like(auditLog.action, 'sync.conflict.%')))
    expect(notes.map((n) => n.action).sort()).toEqual([
      'sync.conflict.camera_version',
      'sync.conflict.older_check',
    ])
  })

  it('links a check to its round, and keeps it (without the link) when the round left the camera out', async () => {
    const [cam, other] = [fleet.cameraIds[0], fleet.cameraIds[1]]
    const roundId = await createRound(tdb.db, {
      assigneeId: users.inspector.id,
      createdBy: users.supervisor.id,
      cameraIds: [cam],
    })
    const inRound = checkPayload(cam, { roundId })
    const outside = checkPayload(other, { roundId })
    expect(
      statuses(await push('inspector', [op('check.create', inRound), op('check.create', outside)])),
    ).toEqual(['applied', 'applied'])
    const [member] = await tdb.db
      .select()
      .from(roundCameras)
      .where(eq(roundCameras.roundId, roundId))
    expect(member.checkId).toBe(inRound.id)
    const [round] = await tdb.db.select().from(rounds).where(eq(rounds.id, roundId))
    expect(round.status).toBe('done')
    const [kept] = await tdb.db.select().from(checks).where(eq(checks.id, outside.id))
    expect(kept.roundId).toBeNull()
    const [note] = await tdb.db
      .select()
      .from(auditLog)
      .where(and(eq(auditLog.entityId, outside.id), eq(auditLog.action, 'sync.conflict.round')))
    expect(note.detail).toMatchObject({ deviceRoundId: roundId })
  })
})

describe('the request itself', () => {
  it('answers 400 for a malformed batch and 413 for more than the push limit', async () => {
    const auth = { Authorization: `Bearer ${tokens.inspector}` }
    const bad = await request(app)
      .post('/api/sync/push')
      .set(auth)
      .send({ deviceId: 'p', ops: [{ id: 'x' }] })
    expect(bad.status).toBe(400)
    const tooMany = await request(app)
      .post('/api/sync/push')
      .set(auth)
      .send({ deviceId: 'p', ops: Array.from({ length: 101 }, () => op('check.create', {})) })
    expect(tooMany.status).toBe(400)
    const big = await request(app)
      .post('/api/sync/push')
      .set(auth)
      .set('Content-Type', 'application/json')
      .send(
        JSON.stringify({
          deviceId: 'p',
          ops: [op('check.create', { notes: 'x'.repeat(9 * 1024 * 1024) })],
        }),
      )
    expect(big.status).toBe(413)
    expect(big.body.error.message).toMatch(/8 MB/)
  })

  it('accepts a batch larger than the general 1 MB body limit', async () => {
    const batch = Array.from({ length: 60 }, () =>
      op('check.create', checkPayload(fleet.cameraIds[2], {}, 12)),
    )
    const size = JSON.stringify({ deviceId: 'p', ops: batch }).length
    expect(size).toBeGreaterThan(1024 * 1024)
    const results = await push('inspector', batch)
    expect(results.every((r) => r.status === 'applied')).toBe(true)
  })

  it('refuses an unsigned push', async () => {
    const res = await request(app)
      .post('/api/sync/push')
      .send({ deviceId: 'p', ops: [op('check.create', {})] })
    expect(res.status).toBe(401)
  })
})
