import { z } from 'zod'
import { isoDateTime } from './common'
import { roundStatusSchema } from './enums'

// Rounds: a supervisor assigns cameras, or every active camera of a site, to an inspector with a
// due date. Inspectors receive them through sync (entity `round` in the change feed).

export const ROUND_LIMITS = { maxCameras: 2000 } as const

const id = z.number().int('must be a whole number').positive('must be positive')

export const roundCreateSchema = z
  .object({
    name: z.string().trim().min(1, 'Give the round a name.').max(120),
    assigneeId: z.number({ error: 'Choose an inspector.' }).int().positive('Choose an inspector.'),
    dueAt: z.iso.datetime({ offset: true, error: 'Choose a due date.' }),
    /** A whole site: every active camera there (unless cameraIds narrows it). */
    siteId: id.optional(),
    cameraIds: z
      .array(id)
      .min(1, 'Choose at least one camera.')
      .max(ROUND_LIMITS.maxCameras, `A round may hold at most ${ROUND_LIMITS.maxCameras} cameras.`)
      .optional(),
  })
  .refine((r) => r.siteId !== undefined || r.cameraIds !== undefined, {
    message: 'Choose a site or some cameras.',
    path: ['cameraIds'],
  })
export type RoundCreate = z.infer<typeof roundCreateSchema>

export const roundListQuerySchema = z.object({
  status: roundStatusSchema.optional(),
  assigneeId: z.coerce.number().int().positive().optional(),
  siteId: z.coerce.number().int().positive().optional(),
  limit: z.coerce.number().int().min(1).max(200).default(50),
  offset: z.coerce.number().int().min(0).default(0),
})
export type RoundListQuery = z.infer<typeof roundListQuerySchema>

export const roundSchema = z.object({
  id: z.number().int().positive(),
  name: z.string(),
  siteId: z.number().int().nullable(),
  siteName: z.string().nullable(),
  assigneeId: z.number().int(),
  assigneeName: z.string(),
  dueAt: isoDateTime,
  overdue: z.boolean(),
  status: roundStatusSchema,
  cameraCount: z.number().int().nonnegative(),
  doneCount: z.number().int().nonnegative(),
  createdById: z.number().int(),
  createdByName: z.string(),
  createdAt: isoDateTime,
  version: z.number().int(),
})
export type Round = z.infer<typeof roundSchema>

export const roundListSchema = z.object({
  items: z.array(roundSchema),
  total: z.number().int().nonnegative(),
  limit: z.number().int(),
  offset: z.number().int(),
})
export type RoundList = z.infer<typeof roundListSchema>

export const roundDetailSchema = roundSchema.extend({
  cameras: z.array(
    z.object({
      cameraId: z.number().int(),
      assetTag: z.string(),
      siteName: z.string(),
      locationText: z.string(),
      checkId: z.string().nullable(),
    }),
  ),
})
export type RoundDetail = z.infer<typeof roundDetailSchema>

export const roundCancelSchema = z.object({
  reason: z.string().trim().max(500).optional(),
})

/** An inspector a round can be given to. */
export const assigneeSchema = z.object({
  id: z.number().int(),
  name: z.string(),
  email: z.string(),
})
export const assigneeListSchema = z.object({ items: z.array(assigneeSchema) })
export type RoundAssignee = z.infer<typeof assigneeSchema>
