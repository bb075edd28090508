// Tables of the sync feature (database version 3): the outbox of operations waiting for the
// server, the queue of files to upload after their check is accepted, and the pulled rounds and
// work orders. Kept apart from outbox.ts so database.ts can import it without a cycle.
import type { SyncRound } from '@shared/schemas/sync'
import type { WorkOrder } from '@shared/schemas/workOrders'

export const SYNC_STORES = {
  // `seq` keeps the order operations were queued in (a baseline mark after its check).
  outbox: '++seq, &id, [userId+status], refId',
  uploads: 'id, checkId, [userId+status]',
  rounds: 'id, assigneeId, status',
  workOrders: 'id, cameraId, status, assigneeId',
} as const

export type OutboxStatus = 'pending' | 'sending' | 'rejected'

/** One queued operation; kept until the server has acknowledged it (applied or duplicate). */
export interface OutboxRecord {
  seq?: number
  /** Client UUID of the operation (the server's idempotency key). */
  id: string
  kind: string
  payload: unknown
  /** Who queued it: only this user's session pushes it. */
  userId: number
  /** What it is about (a check id, a work order id), to link uploads and show it. */
  refId: string | null
  status: OutboxStatus
  attempts: number
  /** Epoch ms before which it is not sent again (back-off). */
  nextAttemptAt: number
  /** When it went to `sending` (a crash leaves it there; it is sent again later). */
  sendingSince: number | null
  lastError: string | null
  /** The server's rejection code, for rejected operations. */
  rejectCode: string | null
  createdAt: string
}

export type UploadStatus = 'pending' | 'sending' | 'rejected'

/** A file to upload for a check the server has accepted (the bytes stay in crops/frames). */
export interface UploadRecord {
  /** `<checkId>/<kind>/<source id>`: queuing the same file twice keeps one record. */
  id: string
  userId: number
  checkId: string
  kind: 'roi' | 'frame'
  measurementId: string | null
  /** Where the bytes are: the crops table (by crop id) or the frames table (by check id). */
  source: 'crop' | 'frame'
  sourceId: string
  encoding: string
  status: UploadStatus
  attempts: number
  nextAttemptAt: number
  lastError: string | null
  createdAt: string
}

export type { SyncRound, WorkOrder }
