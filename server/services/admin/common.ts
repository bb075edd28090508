// Helpers shared by the admin use cases: field errors in the same shape as a zod 400, the
// before/after detail of an audit entry, and stale-version refusals.
import { ERROR_CODES } from '../../../shared/schemas/errors'
import { AppError } from '../../errors'
import { isDuplicateEntry } from '../../db/mysqlErrors'

export const SETUP_ERRORS = {
  notFound: 'setup.not_found',
  conflict: 'setup.conflict',
  stale: 'setup.stale',
  notAllowed: 'setup.not_allowed',
} as const

/** A 400 (or given status) whose details name the fields, like a zod validation error. */
export function fieldError(
  field: string,
  message: string,
  status = 400,
  code: string = ERROR_CODES.invalid,
): AppError {
  return new AppError(code, message, status, { fields: { [field]: [message] } })
}

export function notFound(what: string, id: number | string): AppError {
  return new AppError(SETUP_ERRORS.notFound, `There is no ${what} with id ${id}.`, 404)
}

export function staleVersion(what: string): AppError {
  return new AppError(
    SETUP_ERRORS.stale,
    `This ${what} was changed by someone else meanwhile; reload it and try again.`,
    409,
  )
}

/** Runs an insert/update; a duplicate on `key` becomes a 409 on `field`. */
export async function uniqueOr<T>(
  work: () => Promise<T>,
  key: string,
  field: string,
  message: string,
): Promise<T> {
  try {
    return await work()
  } catch (err) {
    if (isDuplicateEntry(err, key)) throw fieldError(field, message, 409, SETUP_ERRORS.conflict)
    throw err
  }
}

type Plain = Record<string, unknown>

const same = (a: unknown, b: unknown) =>
  a instanceof Date && b instanceof Date ? a.getTime() === b.getTime() : a === b

/** The fields of `patch` that differ from `before`: `{ before: {...}, after: {...} }`. */
export function diff(before: Plain, patch: Plain): { before: Plain; after: Plain } {
  const b: Plain = {}
  const a: Plain = {}
  for (const [k, v] of Object.entries(patch)) {
    if (v === undefined || k === 'version') continue
    if (!same(before[k], v)) {
      b[k] = before[k] ?? null
      a[k] = v
    }
  }
  return { before: b, after: a }
}

/** Only the named keys of a row (for an audit entry's `after` on create). */
export function pick<T extends Plain, K extends keyof T>(row: T, keys: readonly K[]): Pick<T, K> {
  const out = {} as Pick<T, K>
  for (const k of keys) out[k] = row[k]
  return out
}
