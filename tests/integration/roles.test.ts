import type { Express } from 'express'
import request from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { routeTable } from '../../server/routes/table'
import type { RouteTableEntry } from '../../server/routes/table'
import { ROLES } from '../../shared/schemas/enums'
import type { Role } from '../../shared/schemas/enums'
import { createUser, makeApp, signIn, testConfig } from './helpers/app'
import { createTestDatabase } from './helpers/db'
import type { TestDatabase } from './helpers/db'

// Every route in the route table, called with no token and as every role: the server alone
// decides, whatever the client shows or hides.

let tdb: TestDatabase
let app: Express
const tokens = {} as Record<Role, string>

beforeAll(async () => {
  tdb = await createTestDatabase()
  app = makeApp(tdb.db, { config: testConfig({ demoMode: true }) }).app
  for (const role of ROLES) tokens[role] = (await signIn(app, await createUser(tdb.db, role))).token
})
afterAll(() => tdb?.drop())

const AUTH_CODES = ['auth.invalid_token', 'auth.expired', 'auth.forbidden']

function call(route: RouteTableEntry, token?: string) {
  const path = route.path.replace(/:[A-Za-z]+/g, '1')
  const method = route.method.toLowerCase() as 'get' | 'post' | 'put' | 'patch' | 'delete'
  let req = request(app)[method](path)
  if (token) req = req.set('Authorization', `Bearer ${token}`)
  return method === 'get' || method === 'delete' ? req : req.send({})
}

type Caller = 'no token' | Role
const callers: Caller[] = ['no token', ...ROLES]
const cases = routeTable.flatMap((route) => callers.map((caller) => ({ route, caller })))

describe('role matrix', () => {
  it('covers the routes the product promises', () => {
    const keys = routeTable.map((r) => `${r.method} ${r.path}`)
    for (const k of [
      'GET /api/health',
      'POST /api/auth/login',
      'GET /api/auth/me',
      'GET /api/users',
      'GET /api/cameras',
      'GET /api/work-orders',
      'POST /api/work-orders',
      'GET /api/work-orders/:id',
      'POST /api/work-orders/:id/actions',
      'POST /api/work-orders/:id/photos',
      'GET /api/assignees',
    ]) {
      expect(keys).toContain(k)
    }
    expect(routeTable.find((r) => r.path === '/api/users')?.roles).toEqual(['admin'])
    const woRoles = (method: string, path: string) =>
      routeTable.find((r) => r.method === method && r.path === path)?.roles
    expect(woRoles('POST', '/api/work-orders')).toEqual(['supervisor'])
    expect(woRoles('POST', '/api/work-orders/:id/actions')).toEqual(['supervisor', 'maintenance'])
    expect(woRoles('GET', '/api/assignees')).toEqual(['supervisor'])
  })

  it('the app mounts exactly the routes of the table (nothing bypasses it)', () => {
    const stack = (
      app as unknown as {
        router: { stack: { route?: { path: string; methods: Record<string, boolean> } }[] }
      }
    ).router.stack
    const mounted = stack
      .filter((l) => l.route && l.route.path.startsWith('/api'))
      .flatMap((l) =>
        Object.keys(l.route!.methods).map((m) => `${m.toUpperCase()} ${l.route!.path}`),
      )
    expect(mounted.sort()).toEqual(routeTable.map((r) => `${r.method} ${r.path}`).sort())
  })

  it.each(cases)('$route.method $route.path as $caller', async ({ route, caller }) => {
    const res = await call(route, caller === 'no token' ? undefined : tokens[caller])
    const code: string | undefined = res.body?.error?.code
    expect(res.status).toBeLessThan(500)
    if (route.roles === 'public') {
      expect(res.status).not.toBe(403)
      expect(AUTH_CODES).not.toContain(code)
    } else if (caller === 'no token') {
      expect(res.status).toBe(401)
      expect(code).toBe('auth.invalid_token')
    } else if (route.roles.includes(caller)) {
      expect([401, 403]).not.toContain(res.status)
    } else {
      expect(res.status).toBe(403)
      expect(code).toBe('auth.forbidden')
    }
  })
})
