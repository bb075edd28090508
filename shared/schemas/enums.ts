import { z } from 'zod'

// Value lists shared by the database schema, the API contracts and the client.
// Changing one of these is a schema change: it needs a migration.

export const ROLES = ['inspector', 'supervisor', 'maintenance', 'admin'] as const
export const roleSchema = z.enum(ROLES)
export type Role = z.infer<typeof roleSchema>

export const CAMERA_STATES = ['ok', 'due', 'failing', 'in_repair'] as const
export const cameraStateSchema = z.enum(CAMERA_STATES)
export type CameraState = z.infer<typeof cameraStateSchema>

export const CHECK_MODES = ['day', 'night'] as const
export const checkModeSchema = z.enum(CHECK_MODES)
export type CheckMode = z.infer<typeof checkModeSchema>

export const VERDICTS = ['pass', 'marginal', 'fail'] as const
export const verdictSchema = z.enum(VERDICTS)
export type Verdict = z.infer<typeof verdictSchema>

export const EDGE_ORIENTATIONS = ['vertical', 'horizontal'] as const
export const edgeOrientationSchema = z.enum(EDGE_ORIENTATIONS)
export type EdgeOrientation = z.infer<typeof edgeOrientationSchema>

export const PSF_MODELS = ['gaussian', 'disk'] as const
export const psfModelSchema = z.enum(PSF_MODELS)
export type PsfModel = z.infer<typeof psfModelSchema>

export const ATTACHMENT_KINDS = ['roi', 'frame'] as const
export const attachmentKindSchema = z.enum(ATTACHMENT_KINDS)
export type AttachmentKind = z.infer<typeof attachmentKindSchema>

export const WORK_ORDER_STATUSES = [
  'open',
  'assigned',
  'in_progress',
  'awaiting_recheck',
  'closed',
  'cancelled',
] as const
export const workOrderStatusSchema = z.enum(WORK_ORDER_STATUSES)
export type WorkOrderStatus = z.infer<typeof workOrderStatusSchema>

export const PRIORITIES = ['low', 'normal', 'high', 'urgent'] as const
export const prioritySchema = z.enum(PRIORITIES)
export type Priority = z.infer<typeof prioritySchema>

export const ROUND_STATUSES = ['open', 'done', 'cancelled'] as const
export const roundStatusSchema = z.enum(ROUND_STATUSES)
export type RoundStatus = z.infer<typeof roundStatusSchema>

export const MAIL_STATUSES = ['pending', 'sent', 'failed'] as const
export type MailStatus = (typeof MAIL_STATUSES)[number]

export const SYNC_OP_STATUSES = ['applied', 'rejected'] as const
export type SyncOpStatus = (typeof SYNC_OP_STATUSES)[number]

export const CHANGE_ACTIONS = ['upsert', 'delete'] as const
export type ChangeAction = (typeof CHANGE_ACTIONS)[number]
