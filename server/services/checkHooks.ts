import type { DbOrTx } from '../db/client'
import type { cameras, checks } from '../db/schema'
import type { AuthUser } from './tokens'

export type CheckRow = typeof checks.$inferSelect
export type CameraRow = typeof cameras.$inferSelect

/** A check has just been stored (through sync). Hooks run inside the same transaction. */
export interface CheckRecordedEvent {
  check: CheckRow
  /** The camera row before and after this check updated it (the same when it did not). */
  cameraBefore: CameraRow
  cameraAfter: CameraRow
  /** True when this is now the camera's latest check (it was captured after the previous one). */
  isLatest: boolean
  actor: AuthUser
  deviceId: string
  now: Date
}

/**
 * Something that must happen together with a recorded check, e.g. opening or closing a work
 * order. It runs in the check's transaction: throwing an OpRejection rejects the whole operation,
 * any other error rolls it back and the device retries later. A hook that changes the camera row
 * must bump its `version`; the camera's change-feed row is written after all hooks ran. A hook
 * that writes other synced entities records their changes itself (sync/changes.ts).
 */
export type CheckHook = (tx: DbOrTx, event: CheckRecordedEvent) => Promise<void>

const hooks: CheckHook[] = []

/** Adds a hook; hooks run in the order registered. Returns a function that removes it. */
export function onCheckRecorded(hook: CheckHook): () => void {
  hooks.push(hook)
  return () => {
    const at = hooks.indexOf(hook)
    if (at >= 0) hooks.splice(at, 1)
  }
}

export async function runCheckHooks(tx: DbOrTx, event: CheckRecordedEvent): Promise<void> {
  for (const hook of [...hooks]) await hook(tx, event)
}
