import type { CameraState, CheckMode, Verdict } from '../../shared/schemas/enums'

const DAY_MS = 86_400_000

export interface CameraStatusBefore {
  state: CameraState
  lastCheckAt: Date | null
  nextDueAt: Date | null
}

export interface RecordedCheck {
  id: string
  capturedAt: Date
  mode: CheckMode
  verdict: Verdict
  medianMtf50CyPx: number | null
}

export interface CameraStatusUpdate {
  /** The check is the camera's newest (captured at or after the previous latest check). */
  isLatest: boolean
  /** Columns to write; empty when the check changes nothing on the camera. */
  set: {
    lastCheckId?: string
    lastCheckAt?: Date
    lastVerdict?: Verdict
    lastMtf50CyPx?: number | null
    nextDueAt?: Date
    state?: CameraState
  }
}

/**
 * What a recorded check does to its camera's status (the same rule as the demo data):
 * - only the newest check (by capture time) sets the last-check fields and the state; an older
 *   check arriving late is kept in the history but does not overwrite a newer result;
 * - a day-mode check moves the next due date to its capture time + the check interval (a late
 *   day check can only move it later, never earlier);
 * - state: a failing newest check → `failing`; otherwise `due` when the next due date has
 *   passed, else `ok` (this also ends `in_repair`; work-order hooks may set it again).
 */
export function cameraStatusAfterCheck(
  camera: CameraStatusBefore,
  check: RecordedCheck,
  checkIntervalDays: number,
  now: Date,
): CameraStatusUpdate {
  const isLatest =
    camera.lastCheckAt === null || check.capturedAt.getTime() >= camera.lastCheckAt.getTime()
  const set: CameraStatusUpdate['set'] = {}
  let nextDueAt = camera.nextDueAt
  if (check.mode === 'day') {
    const due = new Date(check.capturedAt.getTime() + checkIntervalDays * DAY_MS)
    if (isLatest || nextDueAt === null || due.getTime() > nextDueAt.getTime()) {
      nextDueAt = due
      set.nextDueAt = due
    }
  }
  if (isLatest) {
    set.lastCheckId = check.id
    set.lastCheckAt = check.capturedAt
    set.lastVerdict = check.verdict
    set.lastMtf50CyPx = check.medianMtf50CyPx
    const overdue = nextDueAt !== null && nextDueAt.getTime() < now.getTime()
    set.state = check.verdict === 'fail' ? 'failing' : overdue ? 'due' : 'ok'
  }
  return { isLatest, set }
}
