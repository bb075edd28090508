// How urgent a camera is for the inspector: failing first, then overdue, then due, then in
// repair, then fine. Pure functions of the cached record and "now".
import type { Camera } from '@shared/schemas/cameras'

const DAY_MS = 86_400_000

export type Urgency = 'failing' | 'overdue' | 'due' | 'in_repair' | 'ok'

const URGENCY_RANK: Record<Urgency, number> = {
  failing: 0,
  overdue: 1,
  due: 2,
  in_repair: 3,
  ok: 4,
}

type DueFields = Pick<Camera, 'state' | 'nextDueAt' | 'assetTag'>

/** Whole days since the next check fell due; 0 when due today or not yet due; null if never planned. */
export function daysOverdue(camera: Pick<Camera, 'nextDueAt'>, now: Date): number | null {
  if (!camera.nextDueAt) return null
  const late = now.getTime() - Date.parse(camera.nextDueAt)
  return late > 0 ? Math.floor(late / DAY_MS) : 0
}

export function isOverdue(camera: Pick<Camera, 'nextDueAt'>, now: Date): boolean {
  return camera.nextDueAt !== null && Date.parse(camera.nextDueAt) < now.getTime()
}

export function urgencyOf(camera: DueFields, now: Date): Urgency {
  if (camera.state === 'failing') return 'failing'
  if (camera.state === 'in_repair') return 'in_repair'
  if (isOverdue(camera, now)) return 'overdue'
  if (camera.state === 'due') return 'due'
  return 'ok'
}

/** True for cameras an inspector should visit: failing, overdue or due. */
export function needsCheck(camera: DueFields, now: Date): boolean {
  const u = urgencyOf(camera, now)
  return u === 'failing' || u === 'overdue' || u === 'due'
}

/** Most urgent first; the longest overdue first within a level; asset tag breaks ties. */
export function compareUrgency(a: DueFields, b: DueFields, now: Date): number {
  const rank = URGENCY_RANK[urgencyOf(a, now)] - URGENCY_RANK[urgencyOf(b, now)]
  if (rank !== 0) return rank
  const da = a.nextDueAt ? Date.parse(a.nextDueAt) : Number.POSITIVE_INFINITY
  const dbt = b.nextDueAt ? Date.parse(b.nextDueAt) : Number.POSITIVE_INFINITY
  if (da !== dbt) return da < dbt ? -1 : 1
  return a.assetTag.localeCompare(b.assetTag, undefined, { numeric: true })
}
