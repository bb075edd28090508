// The server's own answers, fetched directly rather than through the app: to set up what a test
// needs (a pushed check) and to compare the screens with. Every call expects 200.
import { expect, inject } from 'vitest'
import { DEMO_PASSWORD } from './browser'

/** Signs a demo account in over the API and returns its access token. */
export async function tokenOf(email: string, password = DEMO_PASSWORD): Promise<string> {
  const res = await fetch(`${inject('baseUrl')}/api/auth/login`, {
    method: 'POST',
    headers: { 'Content-Type': 'application/json' },
    body: JSON.stringify({ email, password }),
  })
  expect(res.status).toBe(200)
  return ((await res.json()) as { token: string }).token
}

/** GET `path` (or POST `body` as JSON) with a token; returns the JSON answer. */
export async function apiWith<T>(token: string, path: string, body?: unknown): Promise<T> {
  const res = await fetch(`${inject('baseUrl')}${path}`, {
    method: body === undefined ? 'GET' : 'POST',
    headers: {
      Authorization: `Bearer ${token}`,
      ...(body === undefined ? {} : { 'Content-Type': 'application/json' }),
    },
    body: body === undefined ? undefined : JSON.stringify(body),
  })
  expect(res.status, `${path} answered ${res.status}`).toBe(200)
  return (await res.json()) as T
}

/** The same, signed in as a demo account. */
export async function apiAs<T>(email: string, path: string, body?: unknown): Promise<T> {
  return apiWith<T>(await tokenOf(email), path, body)
}
