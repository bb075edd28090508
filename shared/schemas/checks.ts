import { z } from 'zod'
import { isoDateTime } from './common'
import {
  attachmentKindSchema,
  checkModeSchema,
  edgeOrientationSchema,
  psfModelSchema,
  verdictSchema,
} from './enums'

// One reason behind a verdict, in plain words, with the numbers it rests on.
// `severity` and string/null values let the device send the engine's reasons as they are.
export const verdictReasonSchema = z.object({
  code: z.string().min(1).max(64),
  text: z.string().min(1).max(500),
  severity: z.enum(['ok', 'info', 'marginal', 'fail']).optional(),
  values: z.record(z.string(), z.union([z.number(), z.string(), z.null()])).optional(),
})
export type VerdictReason = z.infer<typeof verdictReasonSchema>

// A point of an MTF curve: [frequency in cycles/pixel, modulation 0..1+].
export const mtfPointSchema = z.tuple([z.number(), z.number()])
export type MtfPoint = z.infer<typeof mtfPointSchema>

/** A region of a frame in pixels (top-left x, y and size). */
export const roiSchema = z.object({
  x: z.number().int().min(0),
  y: z.number().int().min(0),
  w: z.number().int().min(1).max(20_000),
  h: z.number().int().min(1).max(20_000),
})
export type RoiInput = z.infer<typeof roiSchema>

const cyPx = z.number().min(0).max(1)
const optionalNumber = (schema: z.ZodNumber) => schema.nullable().optional()

/** One measured edge region as the device sends it (frequencies in cycles/pixel). */
export const measurementInputSchema = z.object({
  id: z.uuid(),
  roi: roiSchema,
  orientation: edgeOrientationSchema,
  angleDeg: z.number().min(-90).max(90),
  mtf50CyPx: cyPx,
  mtf50pCyPx: optionalNumber(cyPx),
  mtf10CyPx: optionalNumber(cyPx),
  mtfNyquist: optionalNumber(z.number().min(-1).max(5)),
  rise1090Px: optionalNumber(z.number().min(0).max(10_000)),
  overshoot: optionalNumber(z.number().min(-10).max(10)),
  noise: optionalNumber(z.number().min(0).max(10)),
  psf: z
    .object({
      model: psfModelSchema,
      sigmaPx: optionalNumber(z.number().min(0).max(1000)),
      radiusPx: optionalNumber(z.number().min(0).max(1000)),
      rmsResidual: optionalNumber(z.number().min(0).max(100)),
    })
    .nullable()
    .optional(),
  mtfCurve: z.array(mtfPointSchema).max(512),
  warnings: z.array(z.string().min(1).max(64)).max(20),
})
export type MeasurementInput = z.infer<typeof measurementInputSchema>

/**
 * Payload of the `check.create` sync operation: one check made on the device (client UUID),
 * its measurements and the verdict the device reached. `cameraVersion` is the camera record's
 * version the device judged against (recorded when the server's record has moved on).
 */
export const checkCreatePayloadSchema = z
  .object({
    id: z.uuid(),
    cameraId: z.number().int().positive(),
    roundId: z.number().int().positive().nullable().optional(),
    capturedAt: isoDateTime,
    mode: checkModeSchema,
    verdict: verdictSchema,
    reasons: z.array(verdictReasonSchema).max(30),
    medianMtf50CyPx: cyPx.nullable(),
    pixelDensityPxPerM: optionalNumber(z.number().positive().max(1_000_000)),
    baselineRatio: optionalNumber(z.number().min(0).max(100)),
    targetId: z.string().trim().min(1).max(64).nullable().optional(),
    notes: z.string().max(2000).nullable().optional(),
    /** The inspector agreed to upload the full frame (it may show people or plates). */
    shareFrame: z.boolean().default(false),
    cameraVersion: z.number().int().positive().optional(),
    measurements: z.array(measurementInputSchema).max(50),
  })
  .refine((c) => new Set(c.measurements.map((m) => m.id)).size === c.measurements.length, {
    message: 'Each measurement needs its own id.',
    path: ['measurements'],
  })
export type CheckCreatePayload = z.infer<typeof checkCreatePayloadSchema>

/** Payload of `check.markBaseline`: make a check the camera's commissioning baseline. */
export const markBaselinePayloadSchema = z.object({
  checkId: z.uuid(),
  cameraId: z.number().int().positive(),
  cameraVersion: z.number().int().positive().optional(),
})
export type MarkBaselinePayload = z.infer<typeof markBaselinePayloadSchema>

/** Multipart text fields of POST /api/checks/:id/attachments (the file is the `file` part). */
export const attachmentUploadFieldsSchema = z
  .object({
    kind: attachmentKindSchema.default('roi'),
    /** The measurement a region crop belongs to (required for `roi`). */
    measurementId: z.uuid().optional(),
    /** How the frame's code values map to light: srgb (default), linear or gamma:G. */
    encoding: z
      .string()
      .trim()
      .regex(/^(srgb|linear|gamma:\d+(\.\d+)?)$/i, 'must be srgb, linear or gamma:G')
      .default('srgb'),
  })
  .refine((f) => f.kind !== 'roi' || f.measurementId !== undefined, {
    message: 'A region crop needs the id of its measurement.',
    path: ['measurementId'],
  })
export type AttachmentUploadFields = z.infer<typeof attachmentUploadFieldsSchema>

/** The server's re-measurement of one region, compared with the device's. */
export const remeasureSchema = z.object({
  measurementId: z.uuid(),
  deviceMtf50CyPx: z.number(),
  serverMtf50CyPx: z.number().nullable(),
  /** |server − device| / device; null when the server could not measure the region. */
  relativeDifference: z.number().nullable(),
  disagreement: z.boolean(),
  /** Why the server could not measure the region. */
  error: z.string().optional(),
})
export type Remeasure = z.infer<typeof remeasureSchema>

export const attachmentSchema = z.object({
  id: z.uuid(),
  checkId: z.uuid(),
  measurementId: z.uuid().nullable(),
  kind: attachmentKindSchema,
  sha256: z.string().length(64),
  bytes: z.number().int().nonnegative(),
  mime: z.string(),
  width: z.number().int().positive(),
  height: z.number().int().positive(),
  deleteAfter: isoDateTime.nullable(),
  createdAt: isoDateTime,
})
export type Attachment = z.infer<typeof attachmentSchema>

/** Answer of an upload: 201 for a new file, 200 (duplicate: true) for bytes already stored. */
export const attachmentUploadResponseSchema = z.object({
  attachment: attachmentSchema,
  duplicate: z.boolean(),
  remeasure: z.array(remeasureSchema),
})
export type AttachmentUploadResponse = z.infer<typeof attachmentUploadResponseSchema>
