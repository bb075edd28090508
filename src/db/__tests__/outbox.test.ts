import 'fake-indexeddb/auto'
import Dexie from 'dexie'
import { afterEach, describe, expect, it } from 'vitest'
import { CHECK_STORES } from '../checks'
import { SharpfieldDb } from '../database'
import {
  applyResults,
  backoffMs,
  dueOps,
  enqueue,
  failBatch,
  listOutbox,
  markSending,
  outboxTables,
  recoverSending,
  retryRejected,
  SENDING_STALE_MS,
} from '../outbox'
import { dueUploads } from '../outboxUploads'

let n = 0
const names: string[] = []
const opened: SharpfieldDb[] = []
function freshDb(name = `outbox-test-${++n}`): SharpfieldDb {
  const db = new SharpfieldDb(name)
  opened.push(db)
  names.push(name)
  return db
}
afterEach(async () => {
  for (const db of opened.splice(0)) db.close()
  for (const name of names.splice(0)) await Dexie.delete(name)
})

const USER = 7
const T0 = Date.parse('2025-05-02T10:00:00.000Z')
const checkId = '2b0b6f55-4c3a-4f0e-9d7e-8f2b9a1c0d11'
const cropId = '5a1c2d3e-4f50-4a6b-8c7d-9e0f1a2b3c4d'

function payload(id = checkId) {
  return { id, cameraId: 3, verdict: 'pass' }
}

describe('enqueue', () => {
  it('keeps operations in the order they were queued, for the signed-in user, as pending', async () => {
    const db = freshDb()
    await enqueue('check.create', payload(), { db, userId: USER })
    await enqueue('check.markBaseline', { checkId, cameraId: 3 }, { db, userId: USER })
    const list = await listOutbox(db, USER)
    expect(list.map((op) => op.kind)).toEqual(['check.create', 'check.markBaseline'])
    expect(list.every((op) => op.status === 'pending' && op.attempts === 0)).toBe(true)
    expect(list.map((op) => op.refId)).toEqual([checkId, checkId])
    expect(new Set(list.map((op) => op.id)).size).toBe(2)
  })

  it('refuses a malformed kind and an operation with nobody signed in', async () => {
    const db = freshDb()
    await expect(enqueue('nodot', {}, { db, userId: USER })).rejects.toThrow()
    await expect(enqueue('check.create', {}, { db })).rejects.toThrow(/Sign in/)
    expect(await db.outbox.count()).toBe(0)
  })

  it('is written together with the caller’s data, or not at all', async () => {
    const db = freshDb()
    await expect(
      db.transaction('rw', [db.checks, ...outboxTables(db)], async () => {
        await enqueue('check.create', payload(), { db, userId: USER })
        throw new Error('saving the check failed')
      }),
    ).rejects.toThrow('saving the check failed')
    expect(await db.outbox.count()).toBe(0)
  })
})

describe('acknowledgements', () => {
  it('removes applied and duplicate operations and keeps rejected ones with the reason', async () => {
    const db = freshDb()
    const a = await enqueue('check.create', payload(), { db, userId: USER })
    const b = await enqueue('check.create', payload(crypto.randomUUID()), { db, userId: USER })
    const c = await enqueue('check.markBaseline', { checkId, cameraId: 3 }, { db, userId: USER })
    const sent = await dueOps(db, USER, T0)
    await markSending(db, sent, T0)
    const summary = await applyResults(
      db,
      sent,
      [
        { id: a.id, status: 'applied' },
        { id: b.id, status: 'duplicate' },
        {
          id: c.id,
          status: 'rejected',
          code: 'baseline.exists',
          reason: 'Camera already has a baseline.',
        },
      ],
      T0,
    )
    expect(summary).toEqual({ done: 2, rejected: 1, retrying: 0 })
    const left = await listOutbox(db, USER)
    expect(left).toHaveLength(1)
    expect(left[0]).toMatchObject({
      id: c.id,
      status: 'rejected',
      rejectCode: 'baseline.exists',
      lastError: 'Camera already has a baseline.',
    })
    // A rejected operation is not sent again by itself …
    expect(await dueOps(db, USER, T0 + 3_600_000, { force: true })).toEqual([])
    // … until the user asks.
    expect(await retryRejected(db, USER)).toBe(1)
    expect((await dueOps(db, USER, T0)).map((op) => op.id)).toEqual([c.id])
  })

  it('retries server-side failures and unanswered operations with back-off', async () => {
    const db = freshDb()
    const a = await enqueue('check.create', payload(), { db, userId: USER })
    const b = await enqueue('check.create', payload(crypto.randomUUID()), { db, userId: USER })
    const sent = await dueOps(db, USER, T0)
    await applyResults(
      db,
      sent,
      [{ id: a.id, status: 'rejected', code: 'server.retry', reason: 'busy' }],
      T0,
      () => 0,
    )
    const [ra, rb] = await listOutbox(db, USER)
    expect(ra).toMatchObject({
      id: a.id,
      status: 'pending',
      attempts: 1,
      nextAttemptAt: T0 + 2_500,
      lastError: 'busy',
    })
    expect(rb).toMatchObject({ id: b.id, status: 'pending', attempts: 1 })
  })

  it('queues the crops of an accepted check for upload, and the frame only when shared', async () => {
    const db = freshDb()
    const blob = new Blob([new Uint8Array([137, 80, 78, 71])], { type: 'image/png' })
    await db.crops.put({
      id: cropId,
      checkId,
      kind: 'roi',
      blob,
      mime: 'image/png',
      width: 4,
      height: 4,
      encoding: 'srgb',
    })
    await db.frames.put({ checkId, blob, mime: 'image/png', width: 8, height: 8, share: false })
    const op = await enqueue('check.create', payload(), { db, userId: USER })
    expect(await dueUploads(db, USER, T0)).toEqual([])
    await applyResults(db, [op], [{ id: op.id, status: 'applied' }], T0)
    const queued = await dueUploads(db, USER, T0)
    expect(queued.map((u) => [u.kind, u.measurementId])).toEqual([['roi', cropId]])

    const shared = '9c8b7a6d-5e4f-4a3b-8c2d-1e0f9a8b7c6d'
    await db.frames.put({
      checkId: shared,
      blob,
      mime: 'image/png',
      width: 8,
      height: 8,
      share: true,
    })
    const op2 = await enqueue('check.create', payload(shared), { db, userId: USER })
    await applyResults(db, [op2], [{ id: op2.id, status: 'duplicate' }], T0)
    expect((await dueUploads(db, USER, T0)).map((u) => u.kind).sort()).toEqual(['frame', 'roi'])
  })
})

describe('back-off', () => {
  it('waits 5 s × 2^(attempts − 1), capped at 15 min, with half of it random', () => {
    expect([1, 2, 3, 4].map((a) => backoffMs(a, 1))).toEqual([5_000, 10_000, 20_000, 40_000])
    expect([1, 2, 3, 4].map((a) => backoffMs(a, 0))).toEqual([2_500, 5_000, 10_000, 20_000])
    expect(backoffMs(9, 1)).toBe(15 * 60_000)
    expect(backoffMs(50, 0.5)).toBe(Math.round(0.75 * 15 * 60_000))
  })

  it('holds a failed batch back until its time, unless forced', async () => {
    const db = freshDb()
    await enqueue('check.create', payload(), { db, userId: USER })
    let batch = await dueOps(db, USER, T0)
    for (let attempt = 1; attempt <= 3; attempt++) {
      await markSending(db, batch, T0)
      await failBatch(db, batch, 'offline', T0, () => 1)
      batch = await dueOps(db, USER, T0, { force: true })
      expect(batch[0]).toMatchObject({
        attempts: attempt,
        nextAttemptAt: T0 + backoffMs(attempt, 1),
      })
    }
    expect(await dueOps(db, USER, T0 + backoffMs(3, 1) - 1)).toEqual([])
    expect(await dueOps(db, USER, T0 + backoffMs(3, 1))).toHaveLength(1)
  })

  it('does not count a try that failed because the session expired', async () => {
    const db = freshDb()
    await enqueue('check.create', payload(), { db, userId: USER })
    const batch = await dueOps(db, USER, T0)
    await failBatch(db, batch, 'session expired', T0, Math.random, false)
    expect((await listOutbox(db, USER))[0]).toMatchObject({
      attempts: 0,
      nextAttemptAt: 0,
      status: 'pending',
    })
  })

  it('splits batches at 100 operations and keeps other users’ operations out', async () => {
    const db = freshDb()
    for (let i = 0; i < 130; i++)
      await enqueue('check.create', payload(crypto.randomUUID()), { db, userId: USER })
    await enqueue('check.create', payload(crypto.randomUUID()), { db, userId: USER + 1 })
    expect(await dueOps(db, USER, T0)).toHaveLength(100)
    expect(await dueOps(db, USER + 1, T0)).toHaveLength(1)
  })
})

describe('surviving a restart', () => {
  it('keeps queued operations when the database is closed and opened again', async () => {
    const name = `outbox-reopen-${++n}`
    const first = freshDb(name)
    const op = await enqueue('check.create', payload(), { db: first, userId: USER })
    await markSending(first, [op], T0)
    first.close()
    const again = freshDb(name)
    const [kept] = await listOutbox(again, USER)
    expect(kept).toMatchObject({
      id: op.id,
      kind: 'check.create',
      payload: payload(),
      status: 'sending',
    })
    // The app closed mid-push: after a while the operation goes back to the queue.
    expect(await recoverSending(again, T0 + 1_000)).toBe(0)
    expect(await recoverSending(again, T0 + SENDING_STALE_MS + 1)).toBe(1)
    expect(await dueOps(again, USER, T0 + SENDING_STALE_MS + 1)).toHaveLength(1)
  })

  it('keeps a version-2 database’s saved checks when the app upgrades to the sync tables', async () => {
    const name = `outbox-upgrade-${++n}`
    names.push(name)
    const old = new Dexie(name)
    old.version(1).stores({
      sites: 'id, name',
      cameras: 'id, siteId, state, nextDueAt, assetTag',
      tasks: 'id',
      meta: 'key',
    })
    old.version(2).stores(CHECK_STORES)
    await old.open()
    await old.table('meta').put({ key: 'catalogUserId', value: String(USER) })
    await old
      .table('checks')
      .put({ id: checkId, cameraId: 3, capturedAt: '2025-05-01T09:00:00.000Z' })
    old.close()
    const upgraded = freshDb(name)
    expect(await upgraded.checks.get(checkId)).toMatchObject({ cameraId: 3 })
    expect((await upgraded.meta.get('catalogUserId'))?.value).toBe(String(USER))
    await enqueue('check.create', payload(), { db: upgraded, userId: USER })
    expect(await upgraded.outbox.count()).toBe(1)
  })
})
