import { z } from 'zod'
import { roleSchema } from './enums'

export const loginRequestSchema = z.object({
  email: z.email('must be an e-mail address').max(254),
  password: z.string().min(1, 'is required').max(512),
})
export type LoginRequest = z.infer<typeof loginRequestSchema>

export const sessionUserSchema = z.object({
  id: z.number().int().positive(),
  email: z.string(),
  name: z.string(),
  role: roleSchema,
})
export type SessionUser = z.infer<typeof sessionUserSchema>

/** Login and refresh both answer with a fresh access token, refresh token and the user. */
export const sessionResponseSchema = z.object({
  token: z.string().min(1),
  /** Seconds until the access token expires. */
  expiresIn: z.number().int().positive(),
  refreshToken: z.string().min(1),
  user: sessionUserSchema,
})
export type SessionResponse = z.infer<typeof sessionResponseSchema>

/** The refresh token comes in the body or in the httpOnly cookie. */
export const refreshRequestSchema = z
  .object({ refreshToken: z.string().min(1).max(200).optional() })
  .optional()
export type RefreshRequest = z.infer<typeof refreshRequestSchema>

export const meResponseSchema = z.object({ user: sessionUserSchema })
export type MeResponse = z.infer<typeof meResponseSchema>
