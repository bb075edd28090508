// The fetch wrapper every API module uses: base URL, bearer token, one transparent refresh when
// the access token is rejected, error mapping to ApiError, offline detection and zod validation
// of answers. `createHttp` is pure (fetch passed in) so it can be tested without a browser.
import type { ZodType } from 'zod'
import { ApiError, CLIENT_ERROR_CODES, messageForStatus } from './errors'

export interface SessionTokens {
  token: string
  refreshToken: string
}

/** Where the wrapper reads and writes the session's tokens (the auth store in the app). */
export interface TokenStore {
  get(): SessionTokens | null
  set(tokens: SessionTokens): void
  /** Called when the refresh token was refused: the session is over. */
  expire(): void
}

export interface HttpOptions {
  baseUrl: string
  fetch: typeof fetch
  tokens: TokenStore | null
  isOnline: () => boolean
  refreshPath: string
}

export type Query = Record<string, string | number | boolean | undefined>

export interface RequestOptions<T> {
  body?: unknown
  query?: Query
  schema?: ZodType<T>
  /** Send the session's bearer token and refresh on 401 (default true). */
  auth?: boolean
  /** A bearer token to send as is, with no refresh (e.g. signing out a session already cleared). */
  bearer?: string
  signal?: AbortSignal
  /** `blob` returns the body as a Blob (images); default `json`. */
  responseType?: 'json' | 'blob'
}

export interface Http {
  request<T = unknown>(method: string, path: string, options?: RequestOptions<T>): Promise<T>
  get<T = unknown>(path: string, options?: RequestOptions<T>): Promise<T>
  post<T = unknown>(path: string, body?: unknown, options?: RequestOptions<T>): Promise<T>
  configure(options: Partial<HttpOptions>): void
}

const refreshAnswer = (data: unknown): SessionTokens | null => {
  const d = data as Partial<SessionTokens> | null
  return d && typeof d.token === 'string' && typeof d.refreshToken === 'string'
    ? { token: d.token, refreshToken: d.refreshToken }
    : null
}

function buildUrl(baseUrl: string, path: string, query?: Query): string {
  let url = baseUrl.replace(/\/$/, '') + path
  if (query) {
    const params = new URLSearchParams()
    for (const [key, value] of Object.entries(query)) {
      if (value !== undefined) params.set(key, String(value))
    }
    const qs = params.toString()
    if (qs) url += (url.includes('?') ? '&' : '?') + qs
  }
  return url
}

async function readJson(res: Response): Promise<unknown> {
  if (res.status === 204) return undefined
  const text = await res.text()
  if (!text) return undefined
  try {
    return JSON.parse(text)
  } catch {
    return undefined
  }
}

async function toApiError(res: Response): Promise<ApiError> {
  const data = (await readJson(res)) as
    { error?: { code?: unknown; message?: unknown; details?: unknown } } | undefined
  const code = typeof data?.error?.code === 'string' ? data.error.code : `http_${res.status}`
  const message =
    typeof data?.error?.message === 'string' && data.error.message
      ? data.error.message
      : messageForStatus(res.status)
  return new ApiError(code, message, res.status, data?.error?.details)
}

export function createHttp(initial: Partial<HttpOptions> = {}): Http {
  const o: HttpOptions = {
    baseUrl: '',
    fetch: (...args) => globalThis.fetch(...args),
    tokens: null,
    isOnline: () => typeof navigator === 'undefined' || navigator.onLine !== false,
    refreshPath: '/api/auth/refresh',
    ...initial,
  }
  // One refresh at a time: concurrent 401s wait for the same answer (refresh tokens rotate).
  let refreshing: Promise<SessionTokens | null> | null = null

  async function send(
    method: string,
    url: string,
    body: unknown,
    token?: string,
    signal?: AbortSignal,
  ) {
    const headers: Record<string, string> = { Accept: 'application/json' }
    // FormData (multipart uploads) goes as is: the browser sets its own boundary header.
    const multipart = typeof FormData !== 'undefined' && body instanceof FormData
    if (body !== undefined && !multipart) headers['Content-Type'] = 'application/json'
    if (token) headers.Authorization = `Bearer ${token}`
    try {
      return await o.fetch(url, {
        method,
        headers,
        body: body === undefined ? undefined : multipart ? (body as FormData) : JSON.stringify(body),
        signal,
      })
    } catch (error) {
      if (error instanceof DOMException && error.name === 'AbortError') throw error
      if (!o.isOnline()) {
        throw new ApiError(
          CLIENT_ERROR_CODES.offline,
          'You are offline. Showing what is saved on this device.',
          0,
        )
      }
      throw new ApiError(
        CLIENT_ERROR_CODES.network,
        'The server cannot be reached. Check the connection and try again.',
        0,
      )
    }
  }

  async function doRefresh(refreshToken: string): Promise<SessionTokens | null> {
    const res = await send('POST', buildUrl(o.baseUrl, o.refreshPath), { refreshToken })
    if (!res.ok) return null
    const tokens = refreshAnswer(await readJson(res))
    if (tokens) o.tokens?.set(tokens)
    return tokens
  }

  async function refreshOnce(used: SessionTokens): Promise<SessionTokens | null> {
    const current = o.tokens?.get() ?? null
    // Someone else already refreshed while this request was in flight: use their token.
    if (current && current.token !== used.token) return current
    if (!current) return null
    refreshing ??= doRefresh(current.refreshToken).finally(() => {
      refreshing = null
    })
    return refreshing
  }

  async function request<T>(
    method: string,
    path: string,
    options: RequestOptions<T> = {},
  ): Promise<T> {
    const url = buildUrl(o.baseUrl, path, options.query)
    const useAuth = options.auth !== false
    const tokens = useAuth ? (o.tokens?.get() ?? null) : null
    let res = await send(method, url, options.body, tokens?.token ?? options.bearer, options.signal)
    if (res.status === 401 && tokens) {
      const fresh = await refreshOnce(tokens)
      if (fresh) res = await send(method, url, options.body, fresh.token, options.signal)
      if (!fresh || res.status === 401) {
        o.tokens?.expire()
        throw new ApiError(
          CLIENT_ERROR_CODES.sessionExpired,
          'Your session has expired. Please sign in again.',
          401,
        )
      }
    }
    if (!res.ok) throw await toApiError(res)
    if (options.responseType === 'blob') return (await res.blob()) as T
    const data = await readJson(res)
    if (!options.schema) return data as T
    const parsed = options.schema.safeParse(data)
    if (!parsed.success) {
      throw new ApiError(
        CLIENT_ERROR_CODES.badResponse,
        'The server sent an answer this version of the app cannot read. Reload to update.',
        res.status,
      )
    }
    return parsed.data
  }

  return {
    request,
    get: (path, options) => request('GET', path, options),
    post: (path, body, options) => request('POST', path, { ...options, body }),
    configure(options) {
      Object.assign(o, options)
    },
  }
}

/** The app's shared instance; the auth store plugs its token store in. */
export const http = createHttp({ baseUrl: import.meta.env.VITE_API_BASE_URL ?? '' })
