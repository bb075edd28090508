import { and, eq, like } from 'drizzle-orm'
import { describe, expect, it } from 'vitest'
import {
  auditLog,
  checks,
  measurements,
  roundCameras,
  rounds,
  syncOperations,
} from '../../server/db/schema'
import { checkPayload, createRound, op } from './helpers/fleet'
import { camera, cameraFeedRows, push, rows, statuses, useSyncSession } from './helpers/syncSession'

// Push rules against the real database: who may send which operation, two devices pushing the
// same thing at once, and what a recorded check does to its camera and its round.

const s = useSyncSession()

describe('who may send what', () => {
  it('refuses checks from maintenance', async () => {
    const [res] = await push(s, 'maintenance', [
      op('check.create', checkPayload(s.fleet.cameraIds[8])),
    ])
    expect(res).toMatchObject({ status: 'rejected', code: 'op.forbidden' })
  })

  it('lets an inspector set a baseline only at commissioning; a supervisor may replace it', async () => {
    const cam = s.fleet.cameraIds[8]
    const first = checkPayload(cam, { capturedAt: new Date(Date.now() - 3_600_000).toISOString() })
    const second = checkPayload(cam)
    await push(s, 'inspector', [op('check.create', first), op('check.create', second)])
    const [mine] = await push(s, 'inspector', [
      op('check.markBaseline', { checkId: first.id, cameraId: cam }),
    ])
    expect(mine.status).toBe('applied')
    const [again] = await push(s, 'inspector', [
      op('check.markBaseline', { checkId: second.id, cameraId: cam }),
    ])
    expect(again).toMatchObject({ status: 'rejected', code: 'baseline.exists' })
    const [sup] = await push(s, 'supervisor', [
      op('check.markBaseline', { checkId: second.id, cameraId: cam }),
    ])
    expect(sup.status).toBe('applied')
    expect((await camera(s, cam)).baselineCheckId).toBe(second.id)
    const [old] = await s.tdb.db.select().from(checks).where(eq(checks.id, first.id))
    expect(old.isBaseline).toBe(false)
    const history = await s.tdb.db
      .select()
      .from(auditLog)
      .where(and(eq(auditLog.action, 'camera.baseline'), eq(auditLog.entityId, String(cam))))
    expect(history.map((h) => h.detail?.previousBaselineCheckId)).toEqual([null, first.id])
  })
})

describe('two devices at once', () => {
  it('applies the same operation exactly once when two devices push it together', async () => {
    for (let round = 0; round < 5; round++) {
      const shared = op('check.create', checkPayload(s.fleet.cameraIds[9]))
      const [a, b] = await Promise.all([
        push(s, 'inspector', [shared], 'phone-a'),
        push(s, 'inspector', [shared], 'phone-b'),
      ])
      expect([a[0].status, b[0].status].sort()).toEqual(['applied', 'duplicate'])
      const id = (shared.payload as { id: string }).id
      expect(await rows(s, checks, eq(checks.id, id))).toBe(1)
      expect(await rows(s, syncOperations, eq(syncOperations.opId, shared.id))).toBe(1)
    }
  })

  it('stores a check once when it arrives under two operation ids at the same time', async () => {
    for (let round = 0; round < 5; round++) {
      const payload = checkPayload(s.fleet.cameraIds[10])
      const [a, b] = await Promise.all([
        push(s, 'inspector', [op('check.create', payload)], 'phone-a'),
        push(s, 'inspector', [op('check.create', payload)], 'phone-b'),
      ])
      expect([a[0].status, b[0].status].sort()).toEqual(['applied', 'duplicate'])
      expect(await rows(s, checks, eq(checks.id, payload.id))).toBe(1)
      expect(await rows(s, measurements, eq(measurements.checkId, payload.id))).toBe(2)
    }
  })
})

describe('what a check does to its camera', () => {
  it('a failing check marks the camera failing, moves its due date and bumps its version', async () => {
    const cam = s.fleet.cameraIds[11]
    const before = await camera(s, cam)
    const feedBefore = await cameraFeedRows(s, cam)
    const capturedAt = new Date(Date.now() - 5 * 60_000)
    const payload = checkPayload(cam, {
      verdict: 'fail',
      medianMtf50CyPx: 0.12,
      capturedAt: capturedAt.toISOString(),
      cameraVersion: before.version,
    })
    await push(s, 'inspector', [op('check.create', payload)])
    const after = await camera(s, cam)
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
    expect(await cameraFeedRows(s, cam)).toBe(feedBefore + 1)
  })

  it('an older check arriving late is kept but does not overwrite the newer result', async () => {
    const cam = s.fleet.cameraIds[11]
    const newest = await camera(s, cam)
    const stale = checkPayload(cam, {
      verdict: 'pass',
      capturedAt: new Date(Date.now() - 3 * 86_400_000).toISOString(),
      cameraVersion: 1,
    })
    const [res] = await push(s, 'inspector2', [op('check.create', stale)])
    expect(res.status).toBe('applied')
    const after = await camera(s, cam)
    expect(after.lastCheckId).toBe(newest.lastCheckId)
    expect(after.state).toBe('failing')
    expect(await rows(s, checks, eq(checks.id, stale.id))).toBe(1)
    const notes = await s.tdb.db
      .select({ action: auditLog.action })
      .from(auditLog)
      .where(and(eq(auditLog.entityId, stale.id), like(auditLog.action, 'sync.conflict.%')))
    expect(notes.map((n) => n.action).sort()).toEqual([
      'sync.conflict.camera_version',
      'sync.conflict.older_check',
    ])
  })

  it('links a check to its round, and keeps it (without the link) when the round left the camera out', async () => {
    const [cam, other] = [s.fleet.cameraIds[0], s.fleet.cameraIds[1]]
    const roundId = await createRound(s.tdb.db, {
      assigneeId: s.users.inspector.id,
      createdBy: s.users.supervisor.id,
      cameraIds: [cam],
    })
    const inRound = checkPayload(cam, { roundId })
    const outside = checkPayload(other, { roundId })
    expect(
      statuses(
        await push(s, 'inspector', [op('check.create', inRound), op('check.create', outside)]),
      ),
    ).toEqual(['applied', 'applied'])
    const [member] = await s.tdb.db
      .select()
      .from(roundCameras)
      .where(eq(roundCameras.roundId, roundId))
    expect(member.checkId).toBe(inRound.id)
    const [round] = await s.tdb.db.select().from(rounds).where(eq(rounds.id, roundId))
    expect(round.status).toBe('done')
    const [kept] = await s.tdb.db.select().from(checks).where(eq(checks.id, outside.id))
    expect(kept.roundId).toBeNull()
    const [note] = await s.tdb.db
      .select()
      .from(auditLog)
      .where(and(eq(auditLog.entityId, outside.id), eq(auditLog.action, 'sync.conflict.round')))
    expect(note.detail).toMatchObject({ deviceRoundId: roundId })
  })
})
