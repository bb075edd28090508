import { AppError } from '../errors'

export const STORAGE_ERRORS = {
  full: 'storage.full',
  unavailable: 'storage.unavailable',
} as const

const FULL = new Set(['ENOSPC', 'EDQUOT', 'EFBIG'])
const UNAVAILABLE = new Set([
  'EACCES',
  'EPERM',
  'EROFS',
  'ENOTDIR',
  'EEXIST', // a file where a folder should be
  'EISDIR',
  'EIO',
  'ENOENT',
  'EMFILE',
  'ENFILE',
  'EBUSY',
  'ETIMEDOUT',
  'ECONNREFUSED',
  'ECONNRESET',
])

/**
 * Turns a failure of the storage medium into a clear AppError: 507 when it is full, 503 when it
 * cannot be written or reached. Either way the check stays stored and the client retries later.
 * Anything else is returned unchanged (a programming error, logged as a 500).
 */
export function storageError(err: unknown, action: string): unknown {
  const code = (err as { code?: unknown } | null)?.code
  if (typeof code !== 'string') return err
  if (FULL.has(code)) {
    return new AppError(
      STORAGE_ERRORS.full,
      `The file store is full, so the server could not ${action}. The check is saved; the upload will be retried later.`,
      507,
      { cause: code },
    )
  }
  if (UNAVAILABLE.has(code)) {
    return new AppError(
      STORAGE_ERRORS.unavailable,
      `The file store cannot be written right now, so the server could not ${action}. The check is saved; the upload will be retried later.`,
      503,
      { cause: code },
      { 'Retry-After': '300' },
    )
  }
  return err
}
