import { sql } from 'drizzle-orm'
import type { Health } from '../../shared/schemas/health'
import type { Db } from '../db/client'

const TIMEOUT_MS = 3_000

/** A real `select 1` against the database, bounded in time. */
export function createHealthService(db: Db) {
  return {
    async check(): Promise<Health> {
      let timer: NodeJS.Timeout | undefined
      const timeout = new Promise<never>((_, reject) => {
        timer = setTimeout(() => reject(new Error('database ping timed out')), TIMEOUT_MS)
      })
      try {
        await Promise.race([db.execute(sql`select 1`), timeout])
        return { status: 'ok', db: 'up' }
      } catch {
        return { status: 'degraded', db: 'down' }
      } finally {
        clearTimeout(timer)
      }
    },
  }
}

export type HealthService = ReturnType<typeof createHealthService>
