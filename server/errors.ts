import type { ErrorRequestHandler, RequestHandler } from 'express'
import { ZodError } from 'zod'
import { ERROR_CODES } from '../shared/schemas/errors'
import type { ErrorBody } from '../shared/schemas/errors'
import { isConnectivity } from './db/mysqlErrors'

/** The one error type services throw: a stable code, a sentence for people, an HTTP status. */
export class AppError extends Error {
  override name = 'AppError'
  constructor(
    readonly code: string,
    message: string,
    readonly status = 400,
    readonly details?: unknown,
    readonly headers?: Record<string, string>,
  ) {
    super(message)
  }
}

export interface Logger {
  info(message: string): void
  error(message: string, err?: unknown): void
}

export const consoleLogger: Logger = {
  info: (message) => console.log(message),
  error: (message, err) => console.error(message, err ?? ''),
}

/** Turns a zod error into `{ fields: { 'a.b': [messages] } }`. */
export function zodFieldErrors(err: ZodError): { fields: Record<string, string[]> } {
  const fields: Record<string, string[]> = {}
  for (const issue of err.issues) {
    const key = issue.path.length ? issue.path.map(String).join('.') : '_'
    ;(fields[key] ??= []).push(issue.message)
  }
  return { fields }
}

/** Maps anything thrown to a status and a body; never exposes a stack or internal message. */
export function toErrorResponse(err: unknown): {
  status: number
  body: ErrorBody
  headers?: Record<string, string>
} {
  if (err instanceof AppError) {
    const body: ErrorBody = { error: { code: err.code, message: err.message } }
    if (err.details !== undefined) body.error.details = err.details
    return { status: err.status, body, headers: err.headers }
  }
  if (err instanceof ZodError) {
    return {
      status: 400,
      body: {
        error: {
          code: ERROR_CODES.invalid,
          message: 'Some fields are missing or invalid.',
          details: zodFieldErrors(err),
        },
      },
    }
  }
  // body-parser errors carry a `type` and a `status`.
  const type = (err as { type?: unknown } | null)?.type
  if (type === 'entity.parse.failed') {
    return {
      status: 400,
      body: {
        error: { code: ERROR_CODES.malformedJson, message: 'The request body is not valid JSON.' },
      },
    }
  }
  if (type === 'entity.too.large') {
    const limit = (err as { limit?: unknown }).limit
    const mb = typeof limit === 'number' ? Math.round(limit / 1024 / 1024) || 1 : 1
    return {
      status: 413,
      body: {
        error: { code: ERROR_CODES.tooLarge, message: `The request body is larger than ${mb} MB.` },
      },
    }
  }
  if (type === 'charset.unsupported' || type === 'encoding.unsupported') {
    return {
      status: 415,
      body: {
        error: {
          code: ERROR_CODES.unsupportedMedia,
          message: 'The request encoding is not supported.',
        },
      },
    }
  }
  if (isConnectivity(err)) {
    return {
      status: 503,
      body: {
        error: {
          code: ERROR_CODES.dbUnavailable,
          message: 'The database is not reachable; try again shortly.',
        },
      },
    }
  }
  return {
    status: 500,
    body: { error: { code: ERROR_CODES.internal, message: 'Something went wrong on the server.' } },
  }
}

/** The single error middleware: logs unexpected errors, answers with the error shape. */
export function errorHandler(logger: Logger): ErrorRequestHandler {
  return (err, req, res, next) => {
    if (res.headersSent) return next(err)
    const { status, body, headers } = toErrorResponse(err)
    if (status >= 500) logger.error(`${req.method} ${req.originalUrl} failed:`, err)
    if (headers) res.set(headers)
    res.status(status).json(body)
  }
}

/** Unknown /api routes: a JSON 404 instead of the SPA page. */
export const apiNotFound: RequestHandler = (req, res) => {
  const body: ErrorBody = {
    error: { code: ERROR_CODES.routeNotFound, message: `No API route ${req.method} ${req.path}.` },
  }
  res.status(404).json(body)
}
