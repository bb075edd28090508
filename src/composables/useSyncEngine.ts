// The sync engine: one run pushes the outbox in batches, uploads the files of accepted checks
// and pulls what changed. Plain functions over injected parts (database, API, clock) so it can
// be tested without a browser; the sync store runs it and shows the result.
import { SYNC_LIMITS, type PullResponse } from '@shared/schemas/sync'
import { ApiError, CLIENT_ERROR_CODES, errorMessage } from '@/api/errors'
import type { SyncApi } from '@/api/sync'
import type { SharpfieldDb } from '@/db/database'
import {
  applyResults,
  dueOps,
  failBatch,
  markSending,
  recoverSending,
  type OutboxRecord,
} from '@/db/outbox'
import { dueUploads, uploadBlob, uploadDone, uploadFailed } from '@/db/outboxUploads'
import { applyPull, deviceId, readCursor, SYNC_META_KEYS } from '@/db/syncCache'

export interface SyncEngineDeps {
  db: SharpfieldDb
  api: SyncApi
  /** The signed-in user, or null (nothing is sent then). */
  userId: () => number | null
  now?: () => number
  random?: () => number
  /** Called after each pulled page is applied (e.g. to reload screens). */
  onPulled?: (page: PullResponse) => void | Promise<void>
}

export interface SyncError {
  code: string
  message: string
}

export interface SyncReport {
  /** Operations acknowledged (applied or duplicate). */
  sent: number
  rejected: number
  uploaded: number
  pulledPages: number
  /** The server could not be reached. */
  offline: boolean
  /** Why the run stopped early, if it did. */
  error: SyncError | null
  /** The run reached the server at least once. */
  reachedServer: boolean
}

const MAX_BATCHES = 20
const MAX_PULL_PAGES = 50
/** After this many failed tries an upload the server keeps refusing with 404 is given up. */
const MAX_UPLOAD_404 = 8

function asSyncError(e: unknown): SyncError {
  return { code: e instanceof ApiError ? e.code : 'unknown', message: errorMessage(e) }
}

function isTransient(e: unknown): boolean {
  return (
    e instanceof ApiError &&
    (e.isConnectivity || e.status === 0 || e.status >= 500 || e.status === 429 || e.status === 408)
  )
}

const sessionOver = (e: unknown) =>
  e instanceof ApiError && (e.code === CLIENT_ERROR_CODES.sessionExpired || e.status === 401)

export function createSyncEngine(deps: SyncEngineDeps) {
  const now = deps.now ?? (() => Date.now())
  const random = deps.random ?? Math.random
  const { db, api } = deps

  async function pushAll(userId: number, force: boolean, report: SyncReport): Promise<boolean> {
    const device = await deviceId(db)
    for (let i = 0; i < MAX_BATCHES; i++) {
      const batch: OutboxRecord[] = await dueOps(db, userId, now(), {
        limit: SYNC_LIMITS.maxOpsPerPush,
        force,
      })
      if (batch.length === 0) return true
      await markSending(db, batch, now())
      try {
        const answer = await api.push({
          deviceId: device,
          ops: batch.map((op) => ({ id: op.id, kind: op.kind, payload: op.payload })),
        })
        report.reachedServer = true
        const s = await applyResults(db, batch, answer.results, now(), random)
        report.sent += s.done
        report.rejected += s.rejected
      } catch (e) {
        // Nothing was acknowledged: every op of the batch stays queued (the server may have
        // applied some; sending them again answers `duplicate`).
        await failBatch(db, batch, errorMessage(e), now(), random, !sessionOver(e))
        report.offline = e instanceof ApiError && e.isConnectivity
        report.error = asSyncError(e)
        return false
      }
    }
    return true
  }

  async function uploadAll(userId: number, force: boolean, report: SyncReport): Promise<boolean> {
    for (const u of await dueUploads(db, userId, now(), { force })) {
      const file = await uploadBlob(db, u)
      if (!file) {
        await uploadFailed(db, u, 'The file is no longer on this device.', {
          final: true,
          nowMs: now(),
        })
        continue
      }
      try {
        await api.upload(u.checkId, file.blob, file.name, u)
        report.reachedServer = true
        await uploadDone(db, u.id)
        report.uploaded++
      } catch (e) {
        if (sessionOver(e)) {
          report.error = asSyncError(e)
          return false
        }
        const notYet = e instanceof ApiError && e.status === 404 && u.attempts + 1 < MAX_UPLOAD_404
        const retry = isTransient(e) || notYet
        await uploadFailed(db, u, errorMessage(e), { final: !retry, nowMs: now(), random })
        if (e instanceof ApiError && e.isConnectivity) {
          report.offline = true
          report.error = asSyncError(e)
          return false
        }
      }
    }
    return true
  }

  async function pullAll(userId: number, report: SyncReport): Promise<void> {
    let cursor = await readCursor(db, userId)
    for (let page = 0; page < MAX_PULL_PAGES; page++) {
      const answer = await api.pull(cursor)
      report.reachedServer = true
      // The user may have signed out (or in as someone else) while the page was on its way.
      if (deps.userId() !== userId) return
      await applyPull(db, answer, userId, new Date(now()))
      report.pulledPages++
      await deps.onPulled?.(answer)
      cursor = answer.cursor
      if (!answer.hasMore) return
    }
  }

  /** One sync: push, upload, pull. `force` sends even what waits for its back-off time. */
  async function run(options: { force?: boolean } = {}): Promise<SyncReport> {
    const report: SyncReport = {
      sent: 0,
      rejected: 0,
      uploaded: 0,
      pulledPages: 0,
      offline: false,
      error: null,
      reachedServer: false,
    }
    const userId = deps.userId()
    if (userId === null) return report
    const force = options.force ?? false
    await recoverSending(db, now())
    if (!(await pushAll(userId, force, report))) return report
    if (!(await uploadAll(userId, force, report))) return report
    try {
      await pullAll(userId, report)
    } catch (e) {
      report.offline = e instanceof ApiError && e.isConnectivity
      report.error = asSyncError(e)
    }
    if (report.reachedServer && !report.error) {
      await db.meta.put({ key: SYNC_META_KEYS.lastSyncAt, value: new Date(now()).toISOString() })
    }
    return report
  }

  return { run }
}

export type SyncEngine = ReturnType<typeof createSyncEngine>
