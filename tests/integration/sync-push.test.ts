import { and, eq } from 'drizzle-orm'
import request from 'supertest'
import { describe, expect, it } from 'vitest'
import { auditLog, changes, checks, measurements, syncOperations } from '../../server/db/schema'
import { onCheckRecorded } from '../../server/services/checkHooks'
import { OpRejection } from '../../server/services/sync/registry'
import { checkPayload, op } from './helpers/fleet'
import { camera, push, rows, statuses, useSyncSession } from './helpers/syncSession'

// POST /api/sync/push against the real database: idempotent replays (counting rows), one bad
// operation among good ones, and the limits of the request itself.

const s = useSyncSession()

describe('replaying a batch', () => {
  it('applies a batch once; the same batch again answers duplicate and writes nothing', async () => {
    const [a, b, c] = s.fleet.cameraIds
    const checkA = checkPayload(a)
    const batch = [
      op('check.create', checkA),
      op('check.create', checkPayload(b, {}, 3)),
      op('check.create', checkPayload(c)),
      op('check.markBaseline', { checkId: checkA.id, cameraId: a }),
    ]
    expect(statuses(await push(s, 'inspector', batch))).toEqual([
      'applied',
      'applied',
      'applied',
      'applied',
    ])
    const before = {
      checks: await rows(s, checks),
      measurements: await rows(s, measurements),
      ops: await rows(s, syncOperations),
      changes: await rows(s, changes),
      cameraVersion: (await camera(s, a)).version,
    }
    expect(before.checks).toBe(3)
    expect(before.measurements).toBe(2 + 3 + 2)
    expect(before.ops).toBe(4)
    expect((await camera(s, a)).baselineCheckId).toBe(checkA.id)

    const replay = await push(s, 'inspector', batch)
    expect(statuses(replay)).toEqual(['duplicate', 'duplicate', 'duplicate', 'duplicate'])
    expect(replay.map((r) => r.id)).toEqual(batch.map((o) => o.id))
    expect(await rows(s, checks)).toBe(before.checks)
    expect(await rows(s, measurements)).toBe(before.measurements)
    expect(await rows(s, syncOperations)).toBe(before.ops)
    expect(await rows(s, changes)).toBe(before.changes)
    expect((await camera(s, a)).version).toBe(before.cameraVersion)
  })

  it('treats the same check under a new operation id as a duplicate', async () => {
    const payload = checkPayload(s.fleet.cameraIds[3])
    expect(statuses(await push(s, 'inspector', [op('check.create', payload)]))).toEqual(['applied'])
    expect(statuses(await push(s, 'inspector', [op('check.create', payload)]))).toEqual([
      'duplicate',
    ])
    expect(await rows(s, checks, eq(checks.id, payload.id))).toBe(1)
    expect(await rows(s, measurements, eq(measurements.checkId, payload.id))).toBe(2)
  })

  it('refuses a check id that another inspector already used', async () => {
    const payload = checkPayload(s.fleet.cameraIds[3])
    await push(s, 'inspector', [op('check.create', payload)])
    const [res] = await push(s, 'inspector2', [op('check.create', payload)])
    expect(res).toMatchObject({ status: 'rejected', code: 'check.id_taken' })
  })
})

describe('a batch with bad operations', () => {
  it('rejects each bad operation with a reason and still applies the good ones', async () => {
    const good1 = checkPayload(s.fleet.cameraIds[4])
    const good2 = checkPayload(s.fleet.cameraIds[5])
    const { cameraId: _dropped, ...noCamera } = checkPayload(s.fleet.cameraIds[4])
    const batch = [
      op('check.create', good1),
      op('check.create', noCamera),
      op('check.create', checkPayload(999_999)),
      op('check.create', good2),
      op('camera.rename', { name: 'x' }),
      op(
        'check.create',
        checkPayload(s.fleet.cameraIds[4], {
          capturedAt: new Date(Date.now() + 86_400_000).toISOString(),
        }),
      ),
    ]
    const results = await push(s, 'inspector', batch)
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
    expect(await rows(s, checks, eq(checks.id, good1.id))).toBe(1)
    expect(await rows(s, checks, eq(checks.id, good2.id))).toBe(1)
    // The refused payload is not dropped: it is kept in the audit log with the reason.
    const [kept] = await s.tdb.db
      .select()
      .from(auditLog)
      .where(and(eq(auditLog.action, 'sync.rejected'), eq(auditLog.entityId, batch[2].id)))
    expect(kept.detail).toMatchObject({ code: 'camera.not_found', payload: { cameraId: 999_999 } })
  })

  it('judges a rejected operation afresh when it is sent again', async () => {
    const payload = checkPayload(s.fleet.cameraIds[6])
    const baseline = op('check.markBaseline', {
      checkId: payload.id,
      cameraId: s.fleet.cameraIds[6],
    })
    const [first] = await push(s, 'inspector', [baseline])
    expect(first).toMatchObject({ status: 'rejected', code: 'check.not_found' })
    await push(s, 'inspector', [op('check.create', payload)])
    const [second] = await push(s, 'inspector', [baseline])
    expect(second.status).toBe('applied')
    expect((await camera(s, s.fleet.cameraIds[6])).baselineCheckId).toBe(payload.id)
  })

  it('rolls the whole operation back when a check hook refuses it', async () => {
    const payload = checkPayload(s.fleet.cameraIds[7], { notes: 'hook-refuses-this' })
    const off = onCheckRecorded(async (_tx, e) => {
      if (e.check.notes === 'hook-refuses-this')
        throw new OpRejection('test.refused', 'Refused by a test hook.')
    })
    try {
      const [res] = await push(s, 'inspector', [op('check.create', payload)])
      expect(res).toMatchObject({ status: 'rejected', code: 'test.refused' })
    } finally {
      off()
    }
    expect(await rows(s, checks, eq(checks.id, payload.id))).toBe(0)
    expect(await rows(s, measurements, eq(measurements.checkId, payload.id))).toBe(0)
  })
})

describe('the request itself', () => {
  it('answers 400 for a malformed batch and 413 for more than the push limit', async () => {
    const auth = { Authorization: `Bearer ${s.tokens.inspector}` }
    const bad = await request(s.app)
      .post('/api/sync/push')
      .set(auth)
      .send({ deviceId: 'p', ops: [{ id: 'x' }] })
    expect(bad.status).toBe(400)
    const tooMany = await request(s.app)
      .post('/api/sync/push')
      .set(auth)
      .send({ deviceId: 'p', ops: Array.from({ length: 101 }, () => op('check.create', {})) })
    expect(tooMany.status).toBe(400)
    const big = await request(s.app)
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
      op('check.create', checkPayload(s.fleet.cameraIds[2], {}, 12)),
    )
    const size = JSON.stringify({ deviceId: 'p', ops: batch }).length
    expect(size).toBeGreaterThan(1024 * 1024)
    const results = await push(s, 'inspector', batch)
    expect(results.every((r) => r.status === 'applied')).toBe(true)
  })

  it('refuses an unsigned push', async () => {
    const res = await request(s.app)
      .post('/api/sync/push')
      .send({ deviceId: 'p', ops: [op('check.create', {})] })
    expect(res.status).toBe(401)
  })
})
