import { z } from 'zod'

// Every API error has this shape: { error: { code, message, details? } }.
export const errorBodySchema = z.object({
  error: z.object({
    code: z.string(),
    message: z.string(),
    details: z.unknown().optional(),
  }),
})
export type ErrorBody = z.infer<typeof errorBodySchema>

/** Field messages of a 400 `request.invalid`: dotted path (or `_` for the whole value) → messages. */
export const fieldErrorsSchema = z.object({
  fields: z.record(z.string(), z.array(z.string())),
})
export type FieldErrors = z.infer<typeof fieldErrorsSchema>

/** Error codes shared by server and client (resources add `<resource>.not_found` etc.). */
export const ERROR_CODES = {
  malformedJson: 'request.malformed_json',
  invalid: 'request.invalid',
  tooLarge: 'request.too_large',
  unsupportedMedia: 'request.unsupported_media',
  routeNotFound: 'request.not_found',
  invalidToken: 'auth.invalid_token',
  expired: 'auth.expired',
  forbidden: 'auth.forbidden',
  invalidCredentials: 'auth.invalid_credentials',
  accountInactive: 'auth.account_inactive',
  rateLimited: 'auth.rate_limited',
  invalidRefresh: 'auth.invalid_refresh',
  refreshReused: 'auth.refresh_reused',
  dbUnavailable: 'db.unavailable',
  internal: 'internal',
} as const
export type ErrorCode = (typeof ERROR_CODES)[keyof typeof ERROR_CODES]
