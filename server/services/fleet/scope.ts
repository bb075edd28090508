// Shared pieces of the fleet queries: the period and the camera filters.
import { and, eq } from 'drizzle-orm'
import type { SQL } from 'drizzle-orm'
import { resolvePeriod } from '../../../shared/schemas/fleet'
import type { FleetFilter, Period } from '../../../shared/schemas/fleet'
import { cameras } from '../../db/schema'
import { AppError } from '../../errors'

export const FLEET_ERRORS = {
  badPeriod: 'fleet.bad_period',
  cameraNotFound: 'camera.not_found',
  checkNotFound: 'check.not_found',
} as const

/** The query's period as a half-open UTC interval; a bad one is a 400 with a sentence. */
export function periodOf(f: Pick<FleetFilter, 'from' | 'to'>, now: Date): Period {
  try {
    return resolvePeriod(f, now)
  } catch (err) {
    if (err instanceof RangeError) throw new AppError(FLEET_ERRORS.badPeriod, err.message, 400)
    throw err
  }
}

/** Active cameras narrowed by site, task and model. */
export function cameraScope(f: Pick<FleetFilter, 'siteId' | 'taskId' | 'cameraModelId'>): SQL {
  const where: SQL[] = [eq(cameras.active, true)]
  if (f.siteId !== undefined) where.push(eq(cameras.siteId, f.siteId))
  if (f.taskId !== undefined) where.push(eq(cameras.taskId, f.taskId))
  if (f.cameraModelId !== undefined) where.push(eq(cameras.cameraModelId, f.cameraModelId))
  return and(...where) as SQL
}

export const iso = (d: Date | null): string | null => (d ? d.toISOString() : null)

/** A count or sum column as mysql2 returns it (number, string or null) → number. */
export const num = (v: unknown): number => (v === null || v === undefined ? 0 : Number(v))
