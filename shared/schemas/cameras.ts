import { z } from 'zod'
import { cameraModelSchema, taskSchema } from './catalog'
import { isoDateTime } from './common'
import { cameraStateSchema, verdictSchema } from './enums'

const positiveIdQuery = z.coerce.number().int('must be a whole number').positive('must be positive')

/** GET /api/cameras query: every filter optional, paginated. */
export const cameraListQuerySchema = z.object({
  siteId: positiveIdQuery.optional(),
  taskId: z.string().min(1).max(32).optional(),
  cameraModelId: positiveIdQuery.optional(),
  state: cameraStateSchema.optional(),
  /** true: next check date has passed. */
  overdue: z.stringbool().optional(),
  /** Matches asset tag or location text. */
  q: z.string().trim().min(1).max(100).optional(),
  sort: z.enum(['assetTag', 'nextDueAt', 'lastCheckAt', 'state', 'site']).default('assetTag'),
  order: z.enum(['asc', 'desc']).default('asc'),
  limit: z.coerce.number().int().min(1).max(500).default(100),
  offset: z.coerce.number().int().min(0).default(0),
})
export type CameraListQuery = z.infer<typeof cameraListQuerySchema>

/**
 * A camera as listed (and as pulled by sync): thresholds are the effective values (override or
 * task default); the baseline's MTF50 lets a device judge drift offline.
 */
export const cameraSchema = z.object({
  id: z.number().int().positive(),
  assetTag: z.string(),
  siteId: z.number().int(),
  siteName: z.string(),
  locationText: z.string(),
  cameraModelId: z.number().int(),
  cameraModelName: z.string(),
  taskId: z.string(),
  taskName: z.string(),
  requiredPxPerM: z.number(),
  minMtf50CyPx: z.number(),
  checkIntervalDays: z.number().int(),
  overrides: z.object({
    requiredPxPerM: z.number().nullable(),
    minMtf50CyPx: z.number().nullable(),
    checkIntervalDays: z.number().int().nullable(),
  }),
  focalLengthMm: z.number().nullable(),
  targetDistanceM: z.number().nullable(),
  baselineCheckId: z.string().nullable(),
  /** The baseline check's median MTF50 (null: no baseline, or it measured nothing). */
  baselineMtf50CyPx: z.number().nullable(),
  state: cameraStateSchema,
  lastCheckId: z.string().nullable(),
  lastCheckAt: isoDateTime.nullable(),
  lastVerdict: verdictSchema.nullable(),
  lastMtf50CyPx: z.number().nullable(),
  nextDueAt: isoDateTime.nullable(),
  overdue: z.boolean(),
  active: z.boolean(),
  version: z.number().int(),
  updatedAt: isoDateTime,
})
export type Camera = z.infer<typeof cameraSchema>

export const cameraListSchema = z.object({
  items: z.array(cameraSchema),
  total: z.number().int().nonnegative(),
  limit: z.number().int(),
  offset: z.number().int(),
})
export type CameraList = z.infer<typeof cameraListSchema>

/** GET /api/cameras/:id: the camera with its site, task and model. */
export const cameraDetailSchema = cameraSchema.extend({
  site: z.object({
    id: z.number().int(),
    name: z.string(),
    address: z.string(),
    timeZone: z.string(),
  }),
  task: taskSchema,
  model: cameraModelSchema,
})
export type CameraDetail = z.infer<typeof cameraDetailSchema>
