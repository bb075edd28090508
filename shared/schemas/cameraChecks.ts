import { z } from 'zod'
import { historyCheckSchema } from './fleet'

/** GET /api/cameras/:id/checks query: how many of the newest checks to send. */
export const cameraChecksQuerySchema = z.object({
  limit: z.coerce.number().int().min(1).max(500).default(100),
})
export type CameraChecksQuery = z.infer<typeof cameraChecksQuerySchema>

/**
 * GET /api/cameras/:id/checks: the camera's checks on the server, newest first, with its
 * baseline — what the camera screen and an offline check need (every role that sees cameras).
 */
export const cameraChecksSchema = z.object({
  cameraId: z.number().int().positive(),
  baseline: z.object({ checkId: z.string(), mtf50CyPx: z.number().nullable() }).nullable(),
  checks: z.array(historyCheckSchema),
  /** More checks exist than were sent. */
  truncated: z.boolean(),
})
export type CameraChecks = z.infer<typeof cameraChecksSchema>
