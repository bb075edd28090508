import 'fake-indexeddb/auto'
import Dexie from 'dexie'
import { afterEach, describe, expect, it } from 'vitest'
import { ApiError } from '@/api/errors'
import type { SyncApi } from '@/api/sync'
import { SharpfieldDb } from '@/db/database'
import { enqueue, listOutbox } from '@/db/outbox'
import { readCursor, SYNC_META_KEYS } from '@/db/syncCache'
import { sampleCamera, sampleSite, sampleTask } from '@/db/__tests__/sampleCatalog'
import { createSyncEngine } from '../useSyncEngine'
import { fakeServer, noRemoved, page } from './fakeSyncServer'

const USER = 4
let n = 0
const dbs: SharpfieldDb[] = []
function freshDb(): SharpfieldDb {
  const db = new SharpfieldDb(`engine-test-${++n}`)
  dbs.push(db)
  return db
}
afterEach(async () => {
  for (const db of dbs.splice(0)) {
    db.close()
    await Dexie.delete(db.name)
  }
})

function engineFor(
  db: SharpfieldDb,
  api: SyncApi,
  clock = { t: Date.parse('2025-05-02T10:00:00Z') },
  user: { id: number | null } = { id: USER },
) {
  return createSyncEngine({ db, api, userId: () => user.id, now: () => clock.t, random: () => 0.5 })
}

const check = () => ({ id: crypto.randomUUID(), cameraId: 1 })

describe('pushing the outbox', () => {
  it('sends every queued operation in batches of at most 100 and empties the outbox', async () => {
    const db = freshDb()
    const server = fakeServer()
    for (let i = 0; i < 130; i++) await enqueue('check.create', check(), { db, userId: USER })
    const report = await engineFor(db, server.api).run()
    expect(server.state.pushes.map((p) => p.ops.length)).toEqual([100, 30])
    expect(report).toMatchObject({ sent: 130, rejected: 0, offline: false, error: null })
    expect(await listOutbox(db, USER)).toEqual([])
    expect((await db.meta.get(SYNC_META_KEYS.lastSyncAt))?.value).toBe('2025-05-02T10:00:00.000Z')
    // Every push carries the same device id.
    expect(new Set(server.state.pushes.map((p) => p.deviceId)).size).toBe(1)
  })

  it('keeps everything queued while offline, waits out the back-off, and sends at once when forced', async () => {
    const db = freshDb()
    const server = fakeServer()
    const clock = { t: Date.parse('2025-05-02T10:00:00Z') }
    const engine = engineFor(db, server.api, clock)
    await enqueue('check.create', check(), { db, userId: USER })
    server.state.pushError = new ApiError('offline', 'You are offline.', 0)
    const first = await engine.run()
    expect(first.offline).toBe(true)
    expect((await listOutbox(db, USER))[0]).toMatchObject({ status: 'pending', attempts: 1 })
    server.state.pushError = null
    server.state.pushes.length = 0
    await engine.run()
    expect(server.state.pushes).toEqual([]) // still inside its back-off (3.75 s with random 0.5)
    await engine.run({ force: true })
    expect(server.state.pushes).toHaveLength(1)
    expect(await listOutbox(db, USER)).toEqual([])
  })

  it('sends a batch again after a lost answer, and the server’s duplicates empty the outbox', async () => {
    const db = freshDb()
    const server = fakeServer()
    const ops = [
      await enqueue('check.create', check(), { db, userId: USER }),
      await enqueue('check.create', check(), { db, userId: USER }),
    ]
    // The server applied the batch but the answer never arrived.
    server.applied.add(ops[0].id).add(ops[1].id)
    server.state.pushError = new ApiError('network', 'The server cannot be reached.', 0)
    await engineFor(db, server.api).run()
    expect(await listOutbox(db, USER)).toHaveLength(2)
    server.state.pushError = null
    const report = await engineFor(db, server.api).run({ force: true })
    expect(report.sent).toBe(2)
    expect(await listOutbox(db, USER)).toEqual([])
  })

  it('keeps a rejected operation with its reason and sends the rest', async () => {
    const db = freshDb()
    const server = fakeServer()
    const bad = await enqueue(
      'check.markBaseline',
      { checkId: crypto.randomUUID(), cameraId: 1 },
      { db, userId: USER },
    )
    await enqueue('check.create', check(), { db, userId: USER })
    server.state.reject.set(bad.id, {
      code: 'baseline.exists',
      reason: 'The camera already has a baseline.',
    })
    const report = await engineFor(db, server.api).run()
    expect(report).toMatchObject({ sent: 1, rejected: 1 })
    const left = await listOutbox(db, USER)
    expect(left).toMatchObject([
      { id: bad.id, status: 'rejected', lastError: 'The camera already has a baseline.' },
    ])
  })

  it('sends nothing when nobody is signed in, and only the signed-in user’s operations', async () => {
    const db = freshDb()
    const server = fakeServer()
    await enqueue('check.create', check(), { db, userId: USER + 1 })
    await engineFor(db, server.api, undefined, { id: null }).run()
    await engineFor(db, server.api).run()
    expect(server.state.pushes).toEqual([])
    expect(await db.outbox.count()).toBe(1)
  })
})

describe('uploading files of accepted checks', () => {
  async function savedCheck(db: SharpfieldDb) {
    const id = crypto.randomUUID()
    const cropId = crypto.randomUUID()
    const blob = new Blob([new Uint8Array([137, 80, 78, 71])], { type: 'image/png' })
    await db.crops.put({
      id: cropId,
      checkId: id,
      kind: 'roi',
      blob,
      mime: 'image/png',
      width: 4,
      height: 4,
      encoding: 'srgb',
    })
    await enqueue('check.create', { id, cameraId: 1 }, { db, userId: USER })
    return { id, cropId }
  }

  it('uploads a region crop after its check is accepted, with its measurement id', async () => {
    const db = freshDb()
    const server = fakeServer()
    const { id, cropId } = await savedCheck(db)
    const report = await engineFor(db, server.api).run()
    expect(report.uploaded).toBe(1)
    expect(server.state.uploads).toEqual([
      { checkId: id, fields: { kind: 'roi', measurementId: cropId, encoding: 'srgb' } },
    ])
    expect(await db.uploads.count()).toBe(0)
  })

  it('retries an upload the store could not take (503) and keeps a refused file (415) with its reason', async () => {
    const db = freshDb()
    const server = fakeServer()
    await savedCheck(db)
    server.state.uploadError = new ApiError(
      'storage.unavailable',
      'The file store cannot be written right now.',
      503,
    )
    await engineFor(db, server.api).run()
    expect((await db.uploads.toArray())[0]).toMatchObject({ status: 'pending', attempts: 1 })
    server.state.uploadError = new ApiError(
      'upload.unsupported_type',
      'The file is not a PNG or JPEG image.',
      415,
    )
    await engineFor(db, server.api).run({ force: true })
    expect((await db.uploads.toArray())[0]).toMatchObject({
      status: 'rejected',
      lastError: 'The file is not a PNG or JPEG image.',
    })
  })
})

describe('pulling changes', () => {
  it('fills an empty device, then applies changes and removals, keeping the cursor', async () => {
    const db = freshDb()
    const server = fakeServer()
    server.state.pages.push(
      page({
        full: true,
        cursor: 10,
        sites: [sampleSite(1, 'North Depot')],
        cameras: [
          { ...sampleCamera(1), baselineMtf50CyPx: 0.3 },
          { ...sampleCamera(2), baselineMtf50CyPx: null },
        ],
        tasks: [sampleTask('identify')],
      }),
    )
    const engine = engineFor(db, server.api)
    await engine.run()
    expect(server.state.pulls).toEqual([0])
    expect(await db.cameras.count()).toBe(2)
    expect(await readCursor(db, USER)).toBe(10)

    server.state.pages.push(
      page({
        cursor: 12,
        hasMore: true,
        cameras: [{ ...sampleCamera(1, { state: 'failing' }), baselineMtf50CyPx: 0.3 }],
      }),
      page({ cursor: 14, removed: { ...noRemoved, cameras: [2] } }),
    )
    await engine.run()
    expect(server.state.pulls).toEqual([0, 10, 12])
    expect((await db.cameras.get(1))?.state).toBe('failing')
    expect(await db.cameras.get(2)).toBeUndefined()
    expect(await readCursor(db, USER)).toBe(14)
  })

  it('starts from scratch for another user on the same device', async () => {
    const db = freshDb()
    const server = fakeServer()
    server.state.pages.push(page({ full: true, cursor: 10 }))
    await engineFor(db, server.api).run()
    expect(await readCursor(db, USER)).toBe(10)
    expect(await readCursor(db, USER + 1)).toBe(0)
  })
})
