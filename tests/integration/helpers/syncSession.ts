import { and, count, eq } from 'drizzle-orm'
import type { SQL } from 'drizzle-orm'
import type { Express } from 'express'
import request from 'supertest'
import { afterAll, beforeAll } from 'vitest'
import type { checks, measurements, syncOperations } from '../../../server/db/schema'
import { cameras, changes } from '../../../server/db/schema'
import { pushResponseSchema } from '../../../shared/schemas/sync'
import type { SyncOpResult } from '../../../shared/schemas/sync'
import { createUser, makeApp, signIn } from './app'
import type { TestUser } from './app'
import { createTestDatabase } from './db'
import type { TestDatabase } from './db'
import { createFleet } from './fleet'
import type { TestFleet } from './fleet'

// Shared set-up of the push tests: a database with a fleet, four signed-in users and helpers
// to push as one of them and to count what landed.

export type Who = 'inspector' | 'inspector2' | 'supervisor' | 'maintenance'

export interface SyncSession {
  tdb: TestDatabase
  app: Express
  fleet: TestFleet
  users: Record<Who, TestUser>
  tokens: Record<Who, string>
}

/** Registers beforeAll/afterAll; the returned object is filled before the first test runs. */
export function useSyncSession(cameraCount = 12): SyncSession {
  const s = { users: {}, tokens: {} } as SyncSession
  beforeAll(async () => {
    s.tdb = await createTestDatabase()
    s.app = makeApp(s.tdb.db).app
    s.fleet = await createFleet(s.tdb.db, cameraCount)
    for (const who of ['inspector', 'inspector2', 'supervisor', 'maintenance'] as const) {
      s.users[who] = await createUser(s.tdb.db, who === 'inspector2' ? 'inspector' : who)
      s.tokens[who] = (await signIn(s.app, s.users[who])).token
    }
  })
  afterAll(() => s.tdb?.drop())
  return s
}

export async function push(s: SyncSession, who: Who, ops: unknown[], deviceId = `phone-${who}`) {
  const res = await request(s.app)
    .post('/api/sync/push')
    .set('Authorization', `Bearer ${s.tokens[who]}`)
    .send({ deviceId, ops })
  if (res.status !== 200)
    throw new Error(`push answered ${res.status}: ${JSON.stringify(res.body)}`)
  return pushResponseSchema.parse(res.body).results
}

export async function rows(
  s: SyncSession,
  table: typeof checks | typeof measurements | typeof syncOperations | typeof changes,
  where?: SQL,
): Promise<number> {
  const [{ n }] = await s.tdb.db.select({ n: count() }).from(table).where(where)
  return Number(n)
}

export const statuses = (results: SyncOpResult[]) => results.map((r) => r.status)

export async function camera(s: SyncSession, id: number) {
  const [row] = await s.tdb.db.select().from(cameras).where(eq(cameras.id, id))
  return row
}

export function cameraFeedRows(s: SyncSession, id: number): Promise<number> {
  return rows(s, changes, and(eq(changes.entity, 'camera'), eq(changes.entityId, String(id))))
}
