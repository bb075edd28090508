import { and, eq } from 'drizzle-orm'
import type { PushRequest, SyncOp, SyncOpResult } from '../../../shared/schemas/sync'
import type { Db } from '../../db/client'
import { syncOperations } from '../../db/schema'
import type { Logger } from '../../errors'
import { AppError } from '../../errors'
import type { AuthUser } from '../tokens'
import { audit } from './audit'
import { isConnectivity, isDataError, isDuplicateEntry, isRetryableTx } from '../../db/mysqlErrors'
import { getOp, OpRejection } from './registry'
import type { OpContext, OpOutcome } from './registry'

/** How often one operation is tried again after losing a deadlock. */
const RETRIES = 4

/** Rejection code of a failure on the server's side: the device retries it with back-off. */
export const SERVER_RETRY = 'server.retry'

class AlreadyRecorded extends Error {}

export interface PushDeps {
  db: Db
  now: () => Date
  logger: Logger
}

const AUDIT_MAX_DEPTH = 20

/** True when `value` nests objects/arrays deeper than `left` levels (stops early). */
function deeperThan(value: unknown, left: number): boolean {
  if (value === null || typeof value !== 'object') return false
  if (left === 0) return true
  for (const child of Object.values(value)) if (deeperThan(child, left - 1)) return true
  return false
}

function summarise(payload: unknown): unknown {
  // A hostile payload nested thousands deep would overflow JSON.stringify and MariaDB's JSON.
  if (deeperThan(payload, AUDIT_MAX_DEPTH))
    return { truncated: `(nested more than ${AUDIT_MAX_DEPTH} levels deep; not kept)` }
  const text = JSON.stringify(payload ?? null)
  return text.length <= 8000 ? payload : { truncated: text.slice(0, 8000) }
}

/** Keeps a refused operation in sync_operations and its payload in the audit log. */
async function recordRejection(
  deps: PushDeps,
  op: SyncOp,
  user: AuthUser,
  deviceId: string,
  rejection: OpRejection,
): Promise<SyncOpResult> {
  await deps.db.transaction(async (tx) => {
    try {
      await tx.insert(syncOperations).values({
        opId: op.id,
        deviceId,
        userId: user.id,
        kind: op.kind.slice(0, 40),
        status: 'rejected',
        reason: `${rejection.code}: ${rejection.message}`,
      })
    } catch (err) {
      if (!isDuplicateEntry(err)) throw err
      return // applied meanwhile by a concurrent push: nothing to record
    }
    await audit(tx, {
      actorId: user.id,
      action: 'sync.rejected',
      entity: 'sync_operation',
      entityId: op.id,
      detail: {
        kind: op.kind,
        deviceId,
        code: rejection.code,
        reason: rejection.message,
        payload: summarise(op.payload),
      },
    })
  })
  return { id: op.id, status: 'rejected', code: rejection.code, reason: rejection.message }
}

function fieldSentence(issues: { path: PropertyKey[]; message: string }[]): string {
  const parts = issues
    .slice(0, 5)
    .map((i) => (i.path.length ? `${i.path.map(String).join('.')}: ${i.message}` : i.message))
  return `The operation's data is not valid (${parts.join('; ')}).`
}

/** Tries to apply one operation in its own transaction; the op id row is the idempotency lock. */
async function applyOnce(
  deps: PushDeps,
  op: SyncOp,
  payload: unknown,
  ctx: OpContext,
): Promise<OpOutcome> {
  const def = getOp(op.kind)!
  return deps.db.transaction(async (tx) => {
    try {
      await tx.insert(syncOperations).values({
        opId: op.id,
        deviceId: ctx.deviceId,
        userId: ctx.user.id,
        kind: op.kind,
        status: 'applied',
      })
    } catch (err) {
      // Another push holds or has committed this op id (a concurrent push waits here, then fails).
      if (isDuplicateEntry(err)) throw new AlreadyRecorded()
      throw err
    }
    const outcome = await def.apply(tx, payload, ctx)
    await tx
      .update(syncOperations)
      .set({ result: { outcome: outcome.status, ...outcome.result } })
      .where(eq(syncOperations.opId, op.id))
    return outcome
  })
}

async function applyOne(
  deps: PushDeps,
  op: SyncOp,
  user: AuthUser,
  deviceId: string,
): Promise<SyncOpResult> {
  const def = getOp(op.kind)
  const reject = (code: string, message: string) =>
    recordRejection(deps, op, user, deviceId, new OpRejection(code, message))
  if (!def) {
    return reject(
      'op.unknown_kind',
      `The server does not know the operation "${op.kind}"; update the app.`,
    )
  }
  if (!def.roles.includes(user.role)) {
    return reject('op.forbidden', `A ${user.role} may not send "${op.kind}" operations.`)
  }
  const parsed = def.payload.safeParse(op.payload)
  if (!parsed.success) return reject('op.invalid', fieldSentence(parsed.error.issues))

  for (let attempt = 0; ; attempt++) {
    const ctx: OpContext = { user, deviceId, opId: op.id, kind: op.kind, now: deps.now() }
    const retry = attempt < RETRIES
    try {
      const outcome = await applyOnce(deps, op, parsed.data, ctx)
      return { id: op.id, status: outcome.status }
    } catch (err) {
      if (err instanceof AlreadyRecorded) {
        const [prior] = await deps.db
          .select({ status: syncOperations.status })
          .from(syncOperations)
          .where(eq(syncOperations.opId, op.id))
        if (prior?.status === 'applied') return { id: op.id, status: 'duplicate' }
        // A rejected op sent again is judged afresh (the server's state may have changed).
        await deps.db
          .delete(syncOperations)
          .where(and(eq(syncOperations.opId, op.id), eq(syncOperations.status, 'rejected')))
        if (retry) continue
        return reject(
          SERVER_RETRY,
          'The server was busy with this operation; it will be sent again.',
        )
      }
      if (err instanceof OpRejection) return recordRejection(deps, op, user, deviceId, err)
      if (err instanceof AppError && err.status < 500) return reject(err.code, err.message)
      if (isRetryableTx(err) && retry) continue
      if (isConnectivity(err)) throw err // 503 for the batch; the device sends it again
      if (isDataError(err)) {
        deps.logger.error(`sync op ${op.id} (${op.kind}) refused by the database:`, err)
        return reject('op.unstorable', 'The server could not store this operation as sent.')
      }
      deps.logger.error(`sync op ${op.id} (${op.kind}) failed:`, err)
      return reject(
        SERVER_RETRY,
        'The server failed to apply this operation; it will be sent again later.',
      )
    }
  }
}

/**
 * POST /api/sync/push: applies each operation in its own transaction, in order. An operation
 * applied before (same id) answers `duplicate` and changes nothing; a refused one answers
 * `rejected` with a reason and the rest still apply. A database outage stops the batch (503):
 * the device sends it again and what was applied answers `duplicate`. Rejections with a code
 * starting `server.` are the server's fault and the device retries them on its own.
 */
export async function pushOps(
  deps: PushDeps,
  user: AuthUser,
  body: PushRequest,
): Promise<SyncOpResult[]> {
  const results: SyncOpResult[] = []
  for (const op of body.ops) results.push(await applyOne(deps, op, user, body.deviceId))
  return results
}
