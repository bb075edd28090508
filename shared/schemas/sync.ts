import { z } from 'zod'
import { cameraSchema } from './cameras'
import { cameraModelSchema, taskSchema } from './catalog'
import { isoDateTime } from './common'
import { roundStatusSchema } from './enums'
import { siteSchema } from './sites'
import { workOrderSchema } from './workOrders'

// The sync contract: POST /api/sync/push (a batch of operations, each with a client UUID) and
// GET /api/sync/pull?cursor= (what changed since the cursor). See server/services/sync/README.md.

export const SYNC_LIMITS = {
  /** Most operations in one push. */
  maxOpsPerPush: 100,
  /** Largest push body the server accepts, bytes (the client stays well below). */
  maxPushBytes: 8 * 1024 * 1024,
  /** Change rows read per pull page by default, and at most. */
  defaultPullLimit: 1000,
  maxPullLimit: 5000,
} as const

export const deviceIdSchema = z
  .string()
  .min(1)
  .max(64)
  .regex(/^[A-Za-z0-9._:-]+$/, 'letters, digits and . _ : - only')

/** One queued operation. The payload is checked against the schema of its kind, one by one. */
export const syncOpSchema = z.object({
  id: z.uuid(),
  kind: z
    .string()
    .min(1)
    .max(40)
    .regex(/^[A-Za-z][A-Za-z0-9]*(\.[A-Za-z][A-Za-z0-9]*)+$/, 'must look like noun.verb'),
  payload: z.unknown(),
})
export type SyncOp = z.infer<typeof syncOpSchema>

export const pushRequestSchema = z.object({
  deviceId: deviceIdSchema,
  ops: z.array(syncOpSchema).min(1).max(SYNC_LIMITS.maxOpsPerPush),
})
export type PushRequest = z.infer<typeof pushRequestSchema>

export const SYNC_OP_RESULTS = ['applied', 'duplicate', 'rejected'] as const
export type SyncOpResultStatus = (typeof SYNC_OP_RESULTS)[number]

export const syncOpResultSchema = z.object({
  id: z.uuid(),
  status: z.enum(SYNC_OP_RESULTS),
  /** Machine-readable reason code of a rejection, e.g. `camera.not_found`. */
  code: z.string().optional(),
  /** A sentence for people: why the operation was rejected. */
  reason: z.string().optional(),
})
export type SyncOpResult = z.infer<typeof syncOpResultSchema>

/** One result per operation, in the order sent. */
export const pushResponseSchema = z.object({
  results: z.array(syncOpResultSchema),
  serverTime: isoDateTime,
})
export type PushResponse = z.infer<typeof pushResponseSchema>

export const pullQuerySchema = z.object({
  /** The `cursor` of the previous pull; absent or 0 for a first (full) download. */
  cursor: z.coerce.number().int().min(0).default(0),
  limit: z.coerce
    .number()
    .int()
    .min(1)
    .max(SYNC_LIMITS.maxPullLimit)
    .default(SYNC_LIMITS.defaultPullLimit),
})
export type PullQuery = z.infer<typeof pullQuerySchema>

/** A camera as pulled: the same record as GET /api/cameras lists, baseline MTF50 included. */
export const syncCameraSchema = cameraSchema
export type SyncCamera = z.infer<typeof syncCameraSchema>

export const syncRoundSchema = z.object({
  id: z.number().int().positive(),
  name: z.string(),
  siteId: z.number().int().nullable(),
  assigneeId: z.number().int(),
  dueAt: isoDateTime,
  status: roundStatusSchema,
  cameras: z.array(z.object({ cameraId: z.number().int(), checkId: z.string().nullable() })),
  version: z.number().int(),
  updatedAt: isoDateTime,
})
export type SyncRound = z.infer<typeof syncRoundSchema>

/** Ids the device should drop: deleted, or no longer visible to this user. */
export const syncRemovedSchema = z.object({
  sites: z.array(z.number().int()),
  cameras: z.array(z.number().int()),
  tasks: z.array(z.string()),
  cameraModels: z.array(z.number().int()),
  rounds: z.array(z.number().int()),
  workOrders: z.array(z.number().int()),
})
export type SyncRemoved = z.infer<typeof syncRemovedSchema>

export const pullResponseSchema = z.object({
  /** Pass this back as `cursor` next time. */
  cursor: z.number().int().min(0),
  /** More changes are waiting: pull again at once. */
  hasMore: z.boolean(),
  /** A full download: the device should replace (not merge) what it holds. */
  full: z.boolean(),
  serverTime: isoDateTime,
  sites: z.array(siteSchema),
  cameras: z.array(syncCameraSchema),
  tasks: z.array(taskSchema),
  cameraModels: z.array(cameraModelSchema),
  rounds: z.array(syncRoundSchema),
  /** Work orders in the shape of GET /api/work-orders. */
  workOrders: z.array(workOrderSchema),
  removed: syncRemovedSchema,
})
export type PullResponse = z.infer<typeof pullResponseSchema>
