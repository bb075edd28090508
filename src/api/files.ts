// File transfers the JSON wrapper does not cover: downloads (CSV, PDF) and multipart uploads.
// They send the session's token; a 401 refreshes the session once through the wrapper (an
// authenticated JSON call) and tries again.
import { useAuthStore } from '@/stores/auth'
import { downloadBlob } from '@/utils/saveBlob'
import { ApiError, CLIENT_ERROR_CODES, messageForStatus } from './errors'
import { http, type Query } from './http'

function urlOf(path: string, query?: Query): string {
  const params = new URLSearchParams()
  for (const [k, v] of Object.entries(query ?? {}))
    if (v !== undefined && v !== '') params.set(k, String(v))
  const qs = params.toString()
  return `${import.meta.env.VITE_API_BASE_URL ?? ''}${path}${qs ? `?${qs}` : ''}`
}

async function errorOf(res: Response): Promise<ApiError> {
  let body: { error?: { code?: string; message?: string; details?: unknown } } | undefined
  try {
    body = await res.json()
  } catch {
    body = undefined
  }
  return new ApiError(
    body?.error?.code ?? `http_${res.status}`,
    body?.error?.message ?? messageForStatus(res.status),
    res.status,
    body?.error?.details,
  )
}

/** An authenticated fetch with one session refresh on 401; errors become ApiError. */
export async function authedFetch(
  method: string,
  path: string,
  options: { query?: Query; body?: BodyInit } = {},
): Promise<Response> {
  const auth = useAuthStore()
  const send = async () => {
    const token = auth.tokens?.token
    try {
      return await fetch(urlOf(path, options.query), {
        method,
        body: options.body,
        headers: token ? { Authorization: `Bearer ${token}` } : {},
      })
    } catch {
      throw new ApiError(
        navigator.onLine === false ? CLIENT_ERROR_CODES.offline : CLIENT_ERROR_CODES.network,
        navigator.onLine === false
          ? 'You are offline; this needs a connection.'
          : 'The server cannot be reached. Check the connection and try again.',
        0,
      )
    }
  }
  let res = await send()
  if (res.status === 401) {
    await http.get('/api/auth/me') // refreshes the tokens, or ends the session with a clear error
    res = await send()
  }
  if (!res.ok) throw await errorOf(res)
  return res
}

/** The file name the server suggests in Content-Disposition, or a fallback. */
export function fileNameOf(res: Response, fallback: string): string {
  const m = /filename="([^"]+)"/.exec(res.headers.get('Content-Disposition') ?? '')
  return m ? m[1] : fallback
}

/** Downloads a file the server makes and hands it to the browser. */
export async function download(
  path: string,
  query: Query | undefined,
  fallbackName: string,
): Promise<string> {
  const res = await authedFetch('GET', path, { query })
  const blob = await res.blob()
  const name = fileNameOf(res, fallbackName)
  downloadBlob(blob, name)
  return name
}
