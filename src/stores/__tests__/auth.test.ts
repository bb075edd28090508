import { createPinia, setActivePinia } from 'pinia'
import { beforeEach, describe, expect, it } from 'vitest'
import { http } from '@/api/http'
import { SESSION_STORAGE_KEY, useAuthStore } from '../auth'
import { MemoryStorage } from './memoryStorage'

const USER = {
  id: 4,
  email: 'inspector@sharpfield.test',
  name: 'Ines Pector',
  role: 'inspector' as const,
}

interface Seen {
  url: string
  body: unknown
  auth: string | null
}

function json(status: number, body: unknown): Response {
  return new Response(JSON.stringify(body), {
    status,
    headers: { 'Content-Type': 'application/json' },
  })
}

/** Plugs a scripted server into the app's http instance and records what it was sent. */
function serve(handler: (url: string, body: unknown) => Response) {
  const seen: Seen[] = []
  http.configure({
    isOnline: () => true,
    fetch: (async (input: RequestInfo | URL, init?: RequestInit) => {
      const body = init?.body ? JSON.parse(String(init.body)) : undefined
      const headers = (init?.headers ?? {}) as Record<string, string>
      seen.push({ url: String(input), body, auth: headers.Authorization ?? null })
      return handler(String(input), body)
    }) as typeof fetch,
  })
  return seen
}

const loginOk = () =>
  json(200, { token: 'access-1', refreshToken: 'refresh-1', expiresIn: 900, user: USER })

beforeEach(() => {
  globalThis.localStorage = new MemoryStorage()
  setActivePinia(createPinia())
})

describe('auth store', () => {
  it('signing in keeps user and tokens, in the store and in localStorage', async () => {
    const seen = serve(loginOk)
    const auth = useAuthStore()
    expect(await auth.signIn(' inspector@sharpfield.test ', 'sharpfield-demo')).toBe(true)
    expect(seen[0]).toMatchObject({
      url: '/api/auth/login',
      body: { email: 'inspector@sharpfield.test', password: 'sharpfield-demo' },
      auth: null,
    })
    expect(auth.isSignedIn).toBe(true)
    expect(auth.user).toEqual(USER)
    expect(auth.home).toBe('/rounds')
    expect(auth.tabs.map((t) => t.label)).toEqual(['Rounds', 'Sync', 'Tools', 'Me'])
    const stored = JSON.parse(localStorage.getItem(SESSION_STORAGE_KEY)!)
    expect(stored).toMatchObject({
      version: 1,
      user: USER,
      token: 'access-1',
      refreshToken: 'refresh-1',
    })
    expect(stored).not.toHaveProperty('password')
  })

  it('a new store (app reopened, no network) restores the saved session', async () => {
    serve(loginOk)
    await useAuthStore().signIn(USER.email, 'sharpfield-demo')
    serve(() => {
      throw new TypeError('Failed to fetch')
    })
    setActivePinia(createPinia())
    const reopened = useAuthStore()
    expect(reopened.isSignedIn).toBe(true)
    expect(reopened.user).toEqual(USER)
    expect(reopened.tokens).toEqual({ token: 'access-1', refreshToken: 'refresh-1' })
  })

  it('signing out clears the session and storage, and revokes the refresh token on the server', async () => {
    serve(loginOk)
    const auth = useAuthStore()
    await auth.signIn(USER.email, 'sharpfield-demo')
    const seen = serve(() => new Response(null, { status: 204 }))
    await auth.signOut()
    expect(auth.isSignedIn).toBe(false)
    expect(auth.user).toBeNull()
    expect(localStorage.getItem(SESSION_STORAGE_KEY)).toBeNull()
    expect(seen).toEqual([
      { url: '/api/auth/logout', body: { refreshToken: 'refresh-1' }, auth: 'Bearer access-1' },
    ])
  })

  it('signing out offline still ends the session on this device', async () => {
    serve(loginOk)
    const auth = useAuthStore()
    await auth.signIn(USER.email, 'sharpfield-demo')
    serve(() => {
      throw new TypeError('Failed to fetch')
    })
    await auth.signOut()
    expect(auth.isSignedIn).toBe(false)
    expect(localStorage.getItem(SESSION_STORAGE_KEY)).toBeNull()
  })

  it('a corrupt or outdated saved session is discarded and the user is signed out', () => {
    localStorage.setItem(SESSION_STORAGE_KEY, '{"version":0,"user":{"id":"x"}}')
    expect(useAuthStore().isSignedIn).toBe(false)
    expect(localStorage.getItem(SESSION_STORAGE_KEY)).toBeNull()
    setActivePinia(createPinia())
    localStorage.setItem(SESSION_STORAGE_KEY, 'not json')
    expect(useAuthStore().isSignedIn).toBe(false)
  })

  it('wrong credentials leave the user signed out with a plain message', async () => {
    serve(() =>
      json(401, {
        error: { code: 'auth.invalid_credentials', message: 'E-mail or password is wrong.' },
      }),
    )
    const auth = useAuthStore()
    expect(await auth.signIn(USER.email, 'nope')).toBe(false)
    expect(auth.isSignedIn).toBe(false)
    expect(auth.error).toEqual({
      code: 'auth.invalid_credentials',
      message: 'Wrong e-mail or password. Check both and try again.',
    })
    expect(localStorage.getItem(SESSION_STORAGE_KEY)).toBeNull()
  })

  it('a 429 lock-out says the account is locked for a while', async () => {
    serve(() => json(429, { error: { code: 'auth.rate_limited', message: 'Too many attempts.' } }))
    const auth = useAuthStore()
    await auth.signIn(USER.email, 'nope')
    expect(auth.error?.code).toBe('auth.rate_limited')
    expect(auth.error?.message).toMatch(/locked for up to 15 minutes/)
  })

  it('signing in while offline explains that a connection is needed once', async () => {
    http.configure({
      isOnline: () => false,
      fetch: (async () => {
        throw new TypeError('Failed to fetch')
      }) as typeof fetch,
    })
    const auth = useAuthStore()
    await auth.signIn(USER.email, 'sharpfield-demo')
    expect(auth.error?.code).toBe('offline')
    expect(auth.error?.message).toMatch(/needs a connection once/)
  })

  it('a refused token refresh signs the user out and marks the session as expired', async () => {
    serve(loginOk)
    const auth = useAuthStore()
    await auth.signIn(USER.email, 'sharpfield-demo')
    serve((url) =>
      url.endsWith('/refresh')
        ? json(401, { error: { code: 'auth.refresh_reused', message: 'Refresh token reused.' } })
        : json(401, { error: { code: 'auth.expired', message: 'Token expired.' } }),
    )
    await auth.revalidate()
    expect(auth.isSignedIn).toBe(false)
    expect(auth.expired).toBe(true)
    expect(localStorage.getItem(SESSION_STORAGE_KEY)).toBeNull()
  })

  it('a refreshed token is saved, so the next app start uses it', async () => {
    serve(loginOk)
    await useAuthStore().signIn(USER.email, 'sharpfield-demo')
    // The first /me call is refused (expired access token), then retried after the refresh.
    let first = true
    const inner = serve((url) => {
      if (url.endsWith('/refresh'))
        return json(200, {
          token: 'access-2',
          refreshToken: 'refresh-2',
          expiresIn: 900,
          user: USER,
        })
      if (first) {
        first = false
        return json(401, { error: { code: 'auth.expired', message: 'Token expired.' } })
      }
      return json(200, { user: { ...USER, name: 'Ines P.' } })
    })
    await useAuthStore().revalidate()
    expect(inner.map((s) => s.url)).toEqual(['/api/auth/me', '/api/auth/refresh', '/api/auth/me'])
    const stored = JSON.parse(localStorage.getItem(SESSION_STORAGE_KEY)!)
    expect(stored).toMatchObject({
      token: 'access-2',
      refreshToken: 'refresh-2',
      user: { name: 'Ines P.' },
    })
  })
})
