// Plain sentences for what can go wrong at sign-in.
import { ERROR_CODES } from '@shared/schemas/errors'
import { ApiError, CLIENT_ERROR_CODES, errorMessage } from '@/api/errors'

export function signInErrorMessage(error: unknown): string {
  if (!(error instanceof ApiError)) return errorMessage(error)
  if (error.code === CLIENT_ERROR_CODES.offline) {
    return 'You are offline. Signing in needs a connection once; after that Sharpfield opens without one.'
  }
  if (error.code === CLIENT_ERROR_CODES.network) {
    return 'The Sharpfield server cannot be reached. Check the connection and try again.'
  }
  if (error.status === 429 || error.code === ERROR_CODES.rateLimited) {
    return 'Too many failed attempts for this account. Sign-in is locked for up to 15 minutes; try again later or ask an administrator.'
  }
  if (error.code === ERROR_CODES.invalidCredentials || error.status === 401) {
    return 'Wrong e-mail or password. Check both and try again.'
  }
  if (error.code === ERROR_CODES.accountInactive) {
    return 'This account is switched off. Ask an administrator.'
  }
  if (error.code === ERROR_CODES.invalid) {
    return 'Enter a valid e-mail address and your password.'
  }
  return error.message
}
