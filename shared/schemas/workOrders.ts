import { z } from 'zod'
import { TRANSITIONS, WORK_ORDER_ACTIONS } from '../workOrders/transitions'
import { isoDateTime } from './common'
import { prioritySchema, workOrderStatusSchema } from './enums'

// Work orders: the API's contracts. The transition table (shared/workOrders/transitions.ts)
// decides what may happen; these shapes carry it.

export const workOrderActionSchema = z.enum(WORK_ORDER_ACTIONS)

const id = z.number().int().positive()
const when = isoDateTime.nullable()

export const workOrderSchema = z.object({
  id,
  cameraId: id,
  assetTag: z.string(),
  siteId: id,
  siteName: z.string(),
  locationText: z.string(),
  title: z.string(),
  description: z.string().nullable(),
  priority: prioritySchema,
  status: workOrderStatusSchema,
  assigneeId: id.nullable(),
  assigneeName: z.string().nullable(),
  dueAt: when,
  /** Due date passed while the order is neither closed nor cancelled. */
  overdue: z.boolean(),
  openedByCheckId: z.string().nullable(),
  closedByCheckId: z.string().nullable(),
  closedAt: when,
  createdAt: isoDateTime,
  updatedAt: isoDateTime,
  version: z.number().int().positive(),
})
export type WorkOrder = z.infer<typeof workOrderSchema>

/** One entry of the append-only history: who, when, what and why. */
export const workOrderHistoryEntrySchema = z.object({
  id,
  at: isoDateTime,
  actorId: id.nullable(),
  /** null: the system (e.g. a check recorded through sync). */
  actorName: z.string().nullable(),
  action: z.string(),
  fromStatus: workOrderStatusSchema.nullable(),
  toStatus: workOrderStatusSchema.nullable(),
  fromAssigneeId: id.nullable(),
  fromAssigneeName: z.string().nullable(),
  toAssigneeId: id.nullable(),
  toAssigneeName: z.string().nullable(),
  checkId: z.string().nullable(),
  reason: z.string().nullable(),
  note: z.string().nullable(),
  photoId: z.string().nullable(),
})
export type WorkOrderHistoryEntry = z.infer<typeof workOrderHistoryEntrySchema>

export const workOrderPhotoSchema = z.object({
  id: z.string(),
  mime: z.enum(['image/png', 'image/jpeg']),
  width: z.number().int().positive(),
  height: z.number().int().positive(),
  bytes: z.number().int().positive(),
  uploadedBy: id,
  createdAt: isoDateTime,
})
export type WorkOrderPhoto = z.infer<typeof workOrderPhotoSchema>

export const workOrderDetailSchema = workOrderSchema.extend({
  taskName: z.string(),
  history: z.array(workOrderHistoryEntrySchema),
  photos: z.array(workOrderPhotoSchema),
})
export type WorkOrderDetail = z.infer<typeof workOrderDetailSchema>

export const workOrderListSchema = z.object({
  items: z.array(workOrderSchema),
  total: z.number().int().nonnegative(),
  limit: z.number().int().positive(),
  offset: z.number().int().nonnegative(),
})
export type WorkOrderList = z.infer<typeof workOrderListSchema>

const flag = z.enum(['true', 'false']).transform((v) => v === 'true')

/** GET /api/work-orders filters. `status=active` means any status but closed and cancelled. */
export const workOrderListQuerySchema = z.object({
  status: z.union([workOrderStatusSchema, z.literal('active')]).optional(),
  assigneeId: z.coerce.number().int().positive().optional(),
  siteId: z.coerce.number().int().positive().optional(),
  cameraId: z.coerce.number().int().positive().optional(),
  overdue: flag.optional(),
  limit: z.coerce.number().int().min(1).max(500).default(100),
  offset: z.coerce.number().int().min(0).default(0),
})
export type WorkOrderListQuery = z.infer<typeof workOrderListQuerySchema>

const text = (max: number) => z.string().trim().min(1, 'must not be empty').max(max)

/** POST /api/work-orders (supervisor): open an order by hand. Priority and due date default from the camera's task. */
export const workOrderCreateSchema = z.object({
  cameraId: id,
  title: text(200).optional(),
  description: text(4000).optional(),
  priority: prioritySchema.optional(),
  dueAt: isoDateTime.optional(),
})
export type WorkOrderCreate = z.infer<typeof workOrderCreateSchema>

/** The fields of an action, without the checks that depend on which action it is. */
export const workOrderActionFieldsSchema = z.object({
  action: workOrderActionSchema,
  /** The order's version the user saw; a newer one on the server answers 409 with the current order. */
  version: z.number().int().positive(),
  assigneeId: id.optional(),
  reason: text(1000).optional(),
  note: text(4000).optional(),
})

type ActionFields = z.infer<typeof workOrderActionFieldsSchema>

/** What each action needs (from the table), as field messages. */
function checkNeeds(v: ActionFields, ctx: z.RefinementCtx): void {
  const needs = TRANSITIONS[v.action].needs
  if (needs.assignee && v.assigneeId === undefined)
    ctx.addIssue({ code: 'custom', path: ['assigneeId'], message: 'Choose who to assign it to.' })
  if (needs.reason && v.reason === undefined)
    ctx.addIssue({ code: 'custom', path: ['reason'], message: 'Give a reason.' })
  if (needs.note && v.note === undefined)
    ctx.addIssue({ code: 'custom', path: ['note'], message: 'Write the note.' })
  if (v.action === 'add_photo')
    ctx.addIssue({
      code: 'custom',
      path: ['action'],
      message: 'Photos upload as multipart to /api/work-orders/:id/photos.',
    })
}

/** POST /api/work-orders/:id/actions: the body, with what each action needs. */
export const workOrderActionRequestSchema = workOrderActionFieldsSchema.superRefine(checkNeeds)
export type WorkOrderActionRequest = z.infer<typeof workOrderActionRequestSchema>

/** Payload of the sync operation kind `workOrder.action` (offline updates from phones). */
export const workOrderSyncPayloadSchema = workOrderActionFieldsSchema
  .extend({ workOrderId: id })
  .superRefine(checkNeeds)
export type WorkOrderSyncPayload = z.infer<typeof workOrderSyncPayloadSchema>

/** A user work can be assigned to (GET /api/assignees). */
export const assigneeSchema = z.object({ id, name: z.string(), email: z.string() })
export type Assignee = z.infer<typeof assigneeSchema>
export const assigneeListSchema = z.object({ items: z.array(assigneeSchema) })

/** details of a 409 `work_order.stale`: the order as it is now. */
export const staleDetailsSchema = z.object({ current: workOrderDetailSchema })

export const WORK_ORDER_ERRORS = {
  notFound: 'work_order.not_found',
  stale: 'work_order.stale',
  notAllowed: 'work_order.not_allowed',
  invalidTransition: 'work_order.invalid_transition',
  alreadyOpen: 'work_order.already_open',
  badAssignee: 'work_order.bad_assignee',
  badPhoto: 'work_order.bad_photo',
  photoNotFound: 'work_order.photo_not_found',
} as const
