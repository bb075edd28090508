// The sign-in limiter's failure counts kept in MariaDB, so every server process (WORKERS) and
// every replica behind a load balancer counts the same failures: an attacker cannot multiply the
// limit by spreading attempts over processes.
import { and, desc, eq, gte, lt } from 'drizzle-orm'
import type { Db } from '../db/client'
import { loginFailures } from '../db/schema'
import { LOGIN_WINDOW_MS } from './loginLimiter'
import type { LoginAttemptStore } from './loginLimiter'

/** Failures kept per key (the limiter needs at most its maximum inside the window). */
const KEEP_PER_KEY = 100
/** Every this many failures, rows older than the window are deleted for all keys. */
const SWEEP_EVERY = 200

export function createDbAttemptStore(db: Db, windowMs = LOGIN_WINDOW_MS): LoginAttemptStore {
  let writes = 0
  return {
    async recent(key, sinceMs) {
      const rows = await db
        .select({ at: loginFailures.at })
        .from(loginFailures)
        .where(and(eq(loginFailures.attemptKey, key), gte(loginFailures.at, new Date(sinceMs))))
        .orderBy(desc(loginFailures.at)) // the newest decide when the pair is free again
        .limit(KEEP_PER_KEY)
      return rows.map((r) => r.at.getTime())
    },
    async addFailure(key, atMs) {
      await db.insert(loginFailures).values({ attemptKey: key, at: new Date(atMs) })
      if (++writes % SWEEP_EVERY === 0) {
        await db.delete(loginFailures).where(lt(loginFailures.at, new Date(atMs - windowMs)))
      }
    },
    async clear(key) {
      await db.delete(loginFailures).where(eq(loginFailures.attemptKey, key))
    },
  }
}
