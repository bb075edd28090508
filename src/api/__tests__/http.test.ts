import { describe, expect, it } from 'vitest'
import { z } from 'zod'
import { ApiError } from '../errors'
import { createHttp, type SessionTokens, type TokenStore } from '../http'

interface Call {
  url: string
  method: string
  auth: string | null
  body: unknown
}

function json(status: number, body: unknown): Response {
  return new Response(JSON.stringify(body), {
    status,
    headers: { 'Content-Type': 'application/json' },
  })
}

/** A fake server: access token "fresh-N" is valid, anything else is refused with 401. */
function fakeServer(options: { refreshOk?: boolean; alwaysRefuse?: boolean } = {}) {
  const calls: Call[] = []
  let issued = 0
  const fetchFn = (async (input: RequestInfo | URL, init?: RequestInit) => {
    const url = String(input)
    const headers = (init?.headers ?? {}) as Record<string, string>
    const call: Call = {
      url,
      method: init?.method ?? 'GET',
      auth: headers.Authorization ?? null,
      body: init?.body ? JSON.parse(String(init.body)) : undefined,
    }
    calls.push(call)
    if (url.endsWith('/api/auth/refresh')) {
      if (options.refreshOk === false) {
        return json(401, {
          error: { code: 'auth.invalid_refresh', message: 'Refresh token is not valid.' },
        })
      }
      issued++
      return json(200, {
        token: `fresh-${issued}`,
        refreshToken: `refresh-${issued}`,
        expiresIn: 900,
      })
    }
    if (options.alwaysRefuse || !call.auth?.startsWith('Bearer fresh-')) {
      return json(401, { error: { code: 'auth.expired', message: 'Token expired.' } })
    }
    return json(200, { items: [1, 2, 3] })
  }) as typeof globalThis.fetch
  return {
    fetch: fetchFn,
    calls,
    refreshCalls: () => calls.filter((c) => c.url.endsWith('/api/auth/refresh')),
  }
}

async function failure(promise: Promise<unknown>): Promise<ApiError> {
  try {
    await promise
  } catch (error) {
    if (error instanceof ApiError) return error
    throw error
  }
  throw new Error('expected the request to fail')
}

function memoryTokens(initial: SessionTokens | null) {
  let current = initial
  let expired = 0
  const store: TokenStore = {
    get: () => current,
    set: (t) => (current = t),
    expire: () => {
      current = null
      expired++
    },
  }
  return { store, current: () => current, expiredCount: () => expired }
}

describe('http wrapper', () => {
  it('refreshes once on a 401 and retries the request with the new token', async () => {
    const server = fakeServer()
    const tokens = memoryTokens({ token: 'stale', refreshToken: 'refresh-0' })
    const http = createHttp({
      baseUrl: 'http://api.test',
      fetch: server.fetch,
      tokens: tokens.store,
    })

    const answer = await http.get('/api/cameras')

    expect(answer).toEqual({ items: [1, 2, 3] })
    expect(server.calls.map((c) => `${c.method} ${c.url} ${c.auth ?? '-'}`)).toEqual([
      'GET http://api.test/api/cameras Bearer stale',
      'POST http://api.test/api/auth/refresh -',
      'GET http://api.test/api/cameras Bearer fresh-1',
    ])
    expect(server.refreshCalls()[0].body).toEqual({ refreshToken: 'refresh-0' })
    expect(tokens.current()).toEqual({ token: 'fresh-1', refreshToken: 'refresh-1' })
  })

  it('concurrent 401s share a single refresh (refresh tokens rotate)', async () => {
    const server = fakeServer()
    const tokens = memoryTokens({ token: 'stale', refreshToken: 'refresh-0' })
    const http = createHttp({ fetch: server.fetch, tokens: tokens.store })

    await Promise.all([http.get('/api/a'), http.get('/api/b'), http.get('/api/c')])

    expect(server.refreshCalls()).toHaveLength(1)
    expect(tokens.current()?.token).toBe('fresh-1')
  })

  it('a refused refresh ends the session and throws session_expired', async () => {
    const server = fakeServer({ refreshOk: false })
    const tokens = memoryTokens({ token: 'stale', refreshToken: 'revoked' })
    const http = createHttp({ fetch: server.fetch, tokens: tokens.store })

    const error = await http.get('/api/cameras').catch((e: unknown) => e)

    expect(error).toBeInstanceOf(ApiError)
    expect(error).toMatchObject({ code: 'session_expired', status: 401 })
    expect(tokens.current()).toBeNull()
    expect(tokens.expiredCount()).toBe(1)
  })

  it('refreshes only once: a second 401 after the retry ends the session instead of looping', async () => {
    const server = fakeServer({ alwaysRefuse: true })
    const tokens = memoryTokens({ token: 'stale', refreshToken: 'refresh-0' })
    const http = createHttp({ fetch: server.fetch, tokens: tokens.store })

    await expect(http.get('/api/cameras')).rejects.toMatchObject({ code: 'session_expired' })
    expect(server.refreshCalls()).toHaveLength(1)
    expect(server.calls).toHaveLength(3)
  })

  it('without a session a 401 is passed on as the server said it, with no refresh', async () => {
    const server = fakeServer()
    const http = createHttp({ fetch: server.fetch, tokens: memoryTokens(null).store })
    await expect(
      http.post('/api/auth/login', { email: 'x', password: 'y' }, { auth: false }),
    ).rejects.toMatchObject({
      code: 'auth.expired',
      status: 401,
      message: 'Token expired.',
    })
    expect(server.refreshCalls()).toHaveLength(0)
  })

  it('maps error bodies to ApiError code and message, and bare statuses to a sentence', async () => {
    const answers = [
      json(429, { error: { code: 'auth.rate_limited', message: 'Too many attempts.' } }),
      new Response('<html>bad gateway</html>', { status: 502 }),
    ]
    const http = createHttp({ fetch: (async () => answers.shift()!) as typeof fetch })
    await expect(http.get('/api/x', { auth: false })).rejects.toMatchObject({
      code: 'auth.rate_limited',
      status: 429,
      message: 'Too many attempts.',
    })
    await expect(http.get('/api/x', { auth: false })).rejects.toMatchObject({
      code: 'http_502',
      status: 502,
      message: 'The server had a problem. Try again in a moment.',
    })
  })

  it('a failed fetch is "offline" when the device is offline and "network" when it is not', async () => {
    const failing = (async () => {
      throw new TypeError('Failed to fetch')
    }) as typeof fetch
    const offline = createHttp({ fetch: failing, isOnline: () => false })
    const online = createHttp({ fetch: failing, isOnline: () => true })
    const e1 = await failure(offline.get('/api/x'))
    const e2 = await failure(online.get('/api/x'))
    expect([e1.code, e1.status, e1.isConnectivity]).toEqual(['offline', 0, true])
    expect([e2.code, e2.status, e2.isConnectivity]).toEqual(['network', 0, true])
  })

  it('checks answers against the schema and rejects ones it cannot read', async () => {
    const http = createHttp({
      fetch: (async () => json(200, { items: ['not a number'] })) as typeof fetch,
    })
    const schema = z.object({ items: z.array(z.number()) })
    await expect(http.get('/api/x', { schema })).rejects.toMatchObject({ code: 'bad_response' })
  })

  it('sends query parameters, skipping undefined ones, and a JSON body', async () => {
    const server = fakeServer()
    const tokens = memoryTokens({ token: 'fresh-0', refreshToken: 'r' })
    const http = createHttp({ fetch: server.fetch, tokens: tokens.store })
    await http.get('/api/cameras', {
      query: { limit: 500, offset: 0, q: undefined, overdue: true },
    })
    await http.post('/api/things', { a: 1 })
    expect(server.calls[0].url).toBe('/api/cameras?limit=500&offset=0&overdue=true')
    expect(server.calls[1]).toMatchObject({
      method: 'POST',
      body: { a: 1 },
      auth: 'Bearer fresh-0',
    })
  })
})
