// One error type for everything the API layer throws. `code` is the server's error code
// ({ error: { code, message } }) or one of the client's own codes below; `status` is the HTTP
// status, 0 when no answer arrived.
export const CLIENT_ERROR_CODES = {
  /** The device is offline: the request was not sent. */
  offline: 'offline',
  /** The device is online but the server could not be reached. */
  network: 'network',
  /** The access token was rejected and could not be refreshed. */
  sessionExpired: 'session_expired',
  /** The server answered with something this app cannot read. */
  badResponse: 'bad_response',
} as const

export class ApiError extends Error {
  readonly code: string
  readonly status: number
  /** The server's `error.details`, when it sent any (field messages, the current record…). */
  readonly details: unknown

  constructor(code: string, message: string, status: number, details?: unknown) {
    super(message)
    this.name = 'ApiError'
    this.code = code
    this.status = status
    this.details = details
  }

  /** True when no answer came back: the app should fall back to its local data. */
  get isConnectivity(): boolean {
    return this.code === CLIENT_ERROR_CODES.offline || this.code === CLIENT_ERROR_CODES.network
  }
}

const STATUS_MESSAGES: Record<number, string> = {
  400: 'The request was not accepted.',
  401: 'Please sign in.',
  403: 'Your role does not allow this.',
  404: 'Not found.',
  409: 'This was changed by someone else. Reload and try again.',
  413: 'That is too large to send.',
  429: 'Too many attempts. Wait a while and try again.',
}

export function messageForStatus(status: number): string {
  if (STATUS_MESSAGES[status]) return STATUS_MESSAGES[status]
  if (status >= 500) return 'The server had a problem. Try again in a moment.'
  return `The server answered with status ${status}.`
}

/** A readable sentence for any thrown value, for toasts and error states. */
export function errorMessage(error: unknown): string {
  if (error instanceof ApiError) return error.message
  if (error instanceof Error && error.message) return error.message
  return 'Something went wrong.'
}
