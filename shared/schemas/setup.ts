import { z } from 'zod'
import { isoDateTime } from './common'
import { prioritySchema, roleSchema } from './enums'

// Setup (admin; supervisors may change task thresholds): the forms' contracts. The client runs
// the same schemas to show field errors before sending; the server runs them again.

export const PASSWORD_MIN_LENGTH = 12

const name = (max: number, what: string) =>
  z.string().trim().min(1, `Enter ${what}.`).max(max, `At most ${max} characters.`)

export const passwordSchema = z
  .string()
  .min(PASSWORD_MIN_LENGTH, `At least ${PASSWORD_MIN_LENGTH} characters.`)
  .max(200, 'At most 200 characters.')

export const userCreateSchema = z.object({
  email: z
    .string({ error: 'Enter an e-mail address.' })
    .trim()
    .toLowerCase()
    .pipe(z.email('Enter an e-mail address.').max(254, 'At most 254 characters.')),
  name: name(120, 'a name'),
  role: roleSchema,
  password: passwordSchema,
})
export type UserCreate = z.infer<typeof userCreateSchema>

export const userUpdateSchema = z
  .object({
    name: name(120, 'a name').optional(),
    role: roleSchema.optional(),
    active: z.boolean().optional(),
  })
  .refine((u) => Object.keys(u).length > 0, { message: 'Nothing to change.', path: ['_'] })
export type UserUpdate = z.infer<typeof userUpdateSchema>

export const passwordResetSchema = z.object({ password: passwordSchema })
export type PasswordReset = z.infer<typeof passwordResetSchema>

/** True for an IANA time zone name this runtime knows (e.g. Europe/London, UTC). */
export function isTimeZone(tz: string): boolean {
  try {
    new Intl.DateTimeFormat('en', { timeZone: tz })
    return true
  } catch {
    return false
  }
}

export const timeZoneSchema = z
  .string()
  .trim()
  .min(1, 'Enter a time zone.')
  .max(64)
  .refine(isTimeZone, 'Not a known time zone (e.g. Europe/London, UTC).')

const siteFields = {
  name: name(120, 'the site name'),
  address: z.string().trim().max(255, 'At most 255 characters.'),
  timeZone: timeZoneSchema,
}

export const siteInputSchema = z.object({
  ...siteFields,
  address: siteFields.address.default(''),
  timeZone: siteFields.timeZone.default('UTC'),
})
export type SiteInput = z.infer<typeof siteInputSchema>
/** A change to a site: only the fields sent (no defaults filled in). */
export const siteUpdateSchema = z.object(siteFields).partial()

const positive = (what: string, max: number) =>
  z
    .number({ error: `Enter ${what} as a number.` })
    .positive(`${what[0].toUpperCase()}${what.slice(1)} must be more than 0.`)
    .max(max, `At most ${max}.`)
const wholePx = (what: string) =>
  z
    .number({ error: `Enter ${what} as a number.` })
    .int('A whole number of pixels.')
    .min(16, 'At least 16 px.')
    .max(20_000, 'At most 20 000 px.')

export const cameraModelInputSchema = z
  .object({
    name: name(120, 'the model name'),
    sensorWidthPx: wholePx('the sensor width'),
    sensorHeightPx: wholePx('the sensor height'),
    pixelPitchUm: positive('the pixel pitch', 50),
    focalLengthMinMm: positive('the focal length', 2000),
    focalLengthMaxMm: positive('the longest focal length', 2000),
    fNumber: positive('the f-number', 64).min(0.5, 'At least f/0.5.'),
  })
  .refine((m) => m.focalLengthMaxMm >= m.focalLengthMinMm, {
    message: 'The longest focal length cannot be shorter than the shortest.',
    path: ['focalLengthMaxMm'],
  })
export type CameraModelInput = z.infer<typeof cameraModelInputSchema>

const ratio = (what: string) =>
  z
    .number({ error: `Enter ${what} as a number.` })
    .gt(0, 'More than 0.')
    .lt(1, 'Less than 1.')

/** What a supervisor or admin may change on a task (its thresholds and follow-up). */
export const taskUpdateSchema = z
  .object({
    name: name(80, 'the task name').optional(),
    description: z.string().trim().max(500).optional(),
    requiredPxPerM: positive('the pixel density', 100_000).optional(),
    minMtf50CyPx: z
      .number({ error: 'Enter MTF50 as a number.' })
      .gt(0, 'More than 0 cycles/pixel.')
      .max(1, 'At most 1 cycle/pixel.')
      .optional(),
    marginalBand: z
      .number({ error: 'Enter the band as a number.' })
      .min(0, 'At least 0.')
      .max(0.5, 'At most 0.5 (50 %).')
      .optional(),
    driftWarnRatio: ratio('the drift warning ratio').optional(),
    driftFailRatio: ratio('the drift failure ratio').optional(),
    nightDayWarnRatio: ratio('the night/day ratio').optional(),
    checkIntervalDays: z
      .number({ error: 'Enter days as a number.' })
      .int('Whole days.')
      .min(1, 'At least 1 day.')
      .max(3650, 'At most 3650 days.')
      .optional(),
    workOrderPriority: prioritySchema.optional(),
    workOrderDueDays: z.number().int('Whole days.').min(1).max(365).optional(),
    /** The version the form was loaded with; a stale one is refused (409). */
    version: z.number().int().positive().optional(),
  })
  .refine(
    (t) =>
      t.driftWarnRatio === undefined ||
      t.driftFailRatio === undefined ||
      t.driftFailRatio < t.driftWarnRatio,
    { message: 'The failure ratio must be below the warning ratio.', path: ['driftFailRatio'] },
  )
export type TaskUpdate = z.infer<typeof taskUpdateSchema>

export const ASSET_TAG_PATTERN = /^[A-Za-z0-9][A-Za-z0-9._/-]*$/

export const assetTagSchema = z
  .string()
  .trim()
  .min(1, 'Enter the asset tag.')
  .max(64, 'At most 64 characters.')
  .regex(ASSET_TAG_PATTERN, 'Letters, digits and . _ / - only, starting with a letter or digit.')

const optionalPositive = (what: string, max: number) => positive(what, max).nullable().optional()

const cameraFields = {
  assetTag: assetTagSchema,
  siteId: z.number({ error: 'Choose a site.' }).int().positive('Choose a site.'),
  locationText: z.string().trim().max(255, 'At most 255 characters.'),
  cameraModelId: z
    .number({ error: 'Choose a camera model.' })
    .int()
    .positive('Choose a camera model.'),
  taskId: z.string({ error: 'Choose a task.' }).trim().min(1, 'Choose a task.').max(32),
  /** Overrides of the task's defaults; null = use the task's value. */
  requiredPxPerM: optionalPositive('the pixel density', 100_000),
  minMtf50CyPx: z.number().gt(0, 'More than 0.').max(1, 'At most 1.').nullable().optional(),
  checkIntervalDays: z
    .number()
    .int('Whole days.')
    .min(1, 'At least 1 day.')
    .max(3650)
    .nullable()
    .optional(),
  focalLengthMm: optionalPositive('the focal length', 2000),
  targetDistanceM: optionalPositive('the target distance', 10_000),
  active: z.boolean(),
}

export const cameraInputSchema = z.object({
  ...cameraFields,
  locationText: cameraFields.locationText.default(''),
  active: cameraFields.active.default(true),
})
export type CameraInput = z.infer<typeof cameraInputSchema>

/** A change to a camera: only the fields sent (no defaults filled in), and the version seen. */
export const cameraUpdateSchema = z
  .object(cameraFields)
  .partial()
  .extend({ version: z.number().int().positive().optional() })
export type CameraUpdate = z.infer<typeof cameraUpdateSchema>

export const auditQuerySchema = z.object({
  entity: z.string().trim().min(1).max(40).optional(),
  actorId: z.coerce.number().int().positive().optional(),
  limit: z.coerce.number().int().min(1).max(200).default(50),
  offset: z.coerce.number().int().min(0).default(0),
})
export type AuditQuery = z.infer<typeof auditQuerySchema>

export const auditEntrySchema = z.object({
  id: z.number().int(),
  at: isoDateTime,
  actorId: z.number().int().nullable(),
  actorName: z.string().nullable(),
  action: z.string(),
  entity: z.string(),
  entityId: z.string().nullable(),
  detail: z.record(z.string(), z.unknown()).nullable(),
})
export type AuditEntry = z.infer<typeof auditEntrySchema>

export const auditPageSchema = z.object({
  items: z.array(auditEntrySchema),
  total: z.number().int().nonnegative(),
  limit: z.number().int(),
  offset: z.number().int(),
})
export type AuditPage = z.infer<typeof auditPageSchema>
