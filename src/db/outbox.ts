// The outbox: operations made on this device (a saved check, a baseline mark, a work-order
// action), each with a client UUID, kept in IndexedDB until the server acknowledges them.
// `enqueue` may run inside a caller's Dexie transaction that includes `outboxTables(db)`, so a
// saved check and its operation are written together or not at all.
import { syncOpSchema, type SyncOpResult } from '@shared/schemas/sync'
import { SESSION_STORAGE_KEY } from '@/stores/auth'
import { db as defaultDb, type SharpfieldDb } from './database'
import type { OutboxRecord } from './syncTables'
import { backoffMs } from './backoff'
import { queueUploadsForCheck } from './outboxUploads'

export type { OutboxRecord } from './syncTables'
export { backoffMs, BACKOFF_BASE_MS, BACKOFF_MAX_MS } from './backoff'

/** An operation stuck in `sending` this long (the app closed mid-push) is sent again. */
export const SENDING_STALE_MS = 2 * 60_000
/** Rejection codes starting with this are the server's fault: retried like a network error. */
export const SERVER_RETRY_PREFIX = 'server.'

let userSource: (() => number | null) | null = null

/** The sync store tells the outbox who is signed in (enqueue records it on each operation). */
export function setOutboxUser(source: (() => number | null) | null): void {
  userSource = source
}

function savedSessionUserId(): number | null {
  try {
    const raw = globalThis.localStorage?.getItem(SESSION_STORAGE_KEY)
    const id = raw ? (JSON.parse(raw) as { user?: { id?: unknown } }).user?.id : null
    return typeof id === 'number' ? id : null
  } catch {
    return null
  }
}

function refIdOf(kind: string, payload: unknown): string | null {
  const p = (payload ?? {}) as Record<string, unknown>
  const ref = kind === 'check.create' ? p.id : (p.checkId ?? p.workOrderId ?? p.id)
  return typeof ref === 'string' || typeof ref === 'number' ? String(ref) : null
}

/** The tables enqueue writes; add them to a transaction that also saves what the op is about. */
export function outboxTables(db: SharpfieldDb = defaultDb) {
  return [db.outbox, db.uploads, db.crops, db.frames]
}

export interface EnqueueOptions {
  db?: SharpfieldDb
  userId?: number
  id?: string
  now?: Date
}

/** Queues one operation for the server. Throws when nobody is signed in or the kind is malformed. */
export async function enqueue(
  kind: string,
  payload: unknown,
  options: EnqueueOptions = {},
): Promise<OutboxRecord> {
  const db = options.db ?? defaultDb
  const userId = options.userId ?? userSource?.() ?? savedSessionUserId()
  if (userId === null) throw new Error('Sign in before saving: the change must belong to someone.')
  const id = options.id ?? crypto.randomUUID()
  syncOpSchema.parse({ id, kind, payload })
  const record: OutboxRecord = {
    id,
    kind,
    payload,
    userId,
    refId: refIdOf(kind, payload),
    status: 'pending',
    attempts: 0,
    nextAttemptAt: 0,
    sendingSince: null,
    lastError: null,
    rejectCode: null,
    createdAt: (options.now ?? new Date()).toISOString(),
  }
  record.seq = await db.outbox.add(record)
  return record
}

/** Operations to send now, oldest first; `force` ignores back-off (the network just came back). */
export async function dueOps(
  db: SharpfieldDb,
  userId: number,
  nowMs: number,
  options: { limit?: number; maxBytes?: number; force?: boolean } = {},
): Promise<OutboxRecord[]> {
  const { limit = 100, maxBytes = 2 * 1024 * 1024, force = false } = options
  const pending = await db.outbox.where('[userId+status]').equals([userId, 'pending']).sortBy('seq')
  const batch: OutboxRecord[] = []
  let bytes = 0
  for (const op of pending) {
    if (!force && op.nextAttemptAt > nowMs) continue
    const size = JSON.stringify(op.payload ?? null).length + 200
    if (batch.length && (batch.length >= limit || bytes + size > maxBytes)) break
    batch.push(op)
    bytes += size
  }
  return batch
}

export async function markSending(
  db: SharpfieldDb,
  ops: OutboxRecord[],
  nowMs: number,
): Promise<void> {
  await db.outbox.bulkUpdate(
    ops.map((op) => ({
      key: op.seq!,
      changes: { status: 'sending' as const, sendingSince: nowMs },
    })),
  )
}

/** Operations left in `sending` by an app that closed mid-push go back to the queue. */
export async function recoverSending(db: SharpfieldDb, nowMs: number): Promise<number> {
  return db.outbox
    .filter((op) => op.status === 'sending' && (op.sendingSince ?? 0) < nowMs - SENDING_STALE_MS)
    .modify({ status: 'pending', sendingSince: null })
}

function failedChanges(op: OutboxRecord, error: string, nowMs: number, random: () => number) {
  const attempts = op.attempts + 1
  return {
    status: 'pending' as const,
    attempts,
    nextAttemptAt: nowMs + backoffMs(attempts, random()),
    sendingSince: null,
    lastError: error,
  }
}

/** The batch did not get through (offline, server down): back to the queue with back-off. */
export async function failBatch(
  db: SharpfieldDb,
  ops: OutboxRecord[],
  error: string,
  nowMs: number,
  random: () => number = Math.random,
  countAttempt = true,
): Promise<void> {
  await db.outbox.bulkUpdate(
    ops.map((op) => ({
      key: op.seq!,
      changes: countAttempt
        ? failedChanges(op, error, nowMs, random)
        : { status: 'pending' as const, sendingSince: null, lastError: error },
    })),
  )
}

export interface AppliedSummary {
  done: number
  rejected: number
  retrying: number
}

/**
 * Records the server's answers in one transaction: applied and duplicate operations leave the
 * outbox (an accepted check queues its files for upload), rejected ones stay with the reason,
 * server-side failures and unanswered ones go back to the queue with back-off.
 */
export async function applyResults(
  db: SharpfieldDb,
  sent: OutboxRecord[],
  results: SyncOpResult[],
  nowMs: number,
  random: () => number = Math.random,
): Promise<AppliedSummary> {
  const byId = new Map(results.map((r) => [r.id, r]))
  const summary: AppliedSummary = { done: 0, rejected: 0, retrying: 0 }
  await db.transaction('rw', outboxTables(db), async () => {
    for (const op of sent) {
      const r = byId.get(op.id)
      if (r && (r.status === 'applied' || r.status === 'duplicate')) {
        await db.outbox.delete(op.seq!)
        if (op.kind === 'check.create' && op.refId) {
          await queueUploadsForCheck(db, op.refId, op.userId, new Date(nowMs))
        }
        summary.done++
      } else if (r && r.status === 'rejected' && !r.code?.startsWith(SERVER_RETRY_PREFIX)) {
        await db.outbox.update(op.seq!, {
          status: 'rejected',
          sendingSince: null,
          rejectCode: r.code ?? 'rejected',
          lastError: r.reason ?? 'The server refused this change.',
        })
        summary.rejected++
      } else {
        const why = r?.reason ?? 'The server did not answer for this change.'
        await db.outbox.update(op.seq!, failedChanges(op, why, nowMs, random))
        summary.retrying++
      }
    }
  })
  return summary
}

/** Sends rejected operations (one, or all of this user's) again with the next sync. */
export async function retryRejected(
  db: SharpfieldDb,
  userId: number,
  id?: string,
): Promise<number> {
  return db.outbox
    .where('[userId+status]')
    .equals([userId, 'rejected'])
    .filter((op) => id === undefined || op.id === id)
    .modify({ status: 'pending', nextAttemptAt: 0, rejectCode: null })
}

/** This user's queue, oldest first. */
export async function listOutbox(db: SharpfieldDb, userId: number): Promise<OutboxRecord[]> {
  const all = await db.outbox.orderBy('seq').toArray()
  return all.filter((op) => op.userId === userId)
}
