import { z } from 'zod'
import { isoDateTime, listOf } from './common'
import { prioritySchema } from './enums'

/** A camera's purpose with its default thresholds. */
export const taskSchema = z.object({
  id: z.string(),
  name: z.string(),
  description: z.string(),
  requiredPxPerM: z.number(),
  minMtf50CyPx: z.number(),
  marginalBand: z.number(),
  driftWarnRatio: z.number(),
  driftFailRatio: z.number(),
  nightDayWarnRatio: z.number(),
  checkIntervalDays: z.number().int(),
  workOrderPriority: prioritySchema,
  workOrderDueDays: z.number().int(),
  version: z.number().int(),
  updatedAt: isoDateTime,
})
export type Task = z.infer<typeof taskSchema>
export const taskListSchema = listOf(taskSchema)

export const cameraModelSchema = z.object({
  id: z.number().int().positive(),
  name: z.string(),
  sensorWidthPx: z.number().int(),
  sensorHeightPx: z.number().int(),
  pixelPitchUm: z.number(),
  focalLengthMinMm: z.number(),
  focalLengthMaxMm: z.number(),
  fNumber: z.number(),
  updatedAt: isoDateTime,
})
export type CameraModel = z.infer<typeof cameraModelSchema>
export const cameraModelListSchema = listOf(cameraModelSchema)
