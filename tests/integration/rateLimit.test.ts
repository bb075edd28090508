import type { Express } from 'express'
import request from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { createUser, makeApp, testConfig } from './helpers/app'
import type { TestUser } from './helpers/app'
import { createTestDatabase } from './helpers/db'
import type { TestDatabase } from './helpers/db'

// Ten failed sign-ins for one account from one address within 15 minutes lock that pair out,
// counted in the database so every server process sees them; other accounts and other addresses keep working. The test app trusts the loopback
// proxy so X-Forwarded-For can stand for different client addresses.

let tdb: TestDatabase
let app: Express

beforeAll(async () => {
  tdb = await createTestDatabase()
  app = makeApp(tdb.db, { config: testConfig({ trustProxy: 'loopback' }) }).app
})
afterAll(() => tdb?.drop())

const login = (user: { email: string }, password: string, ip: string) =>
  request(app)
    .post('/api/auth/login')
    .set('X-Forwarded-For', ip)
    .send({ email: user.email, password })

async function failTimes(user: TestUser, ip: string, n: number) {
  for (let i = 0; i < n; i++) {
    const res = await login(user, 'wrong-password', ip)
    expect(res.status).toBe(401)
  }
}

describe('sign-in rate limit', () => {
  it('locks one account from one address after 10 failures, even for the right password', async () => {
    const victim = await createUser(tdb.db, 'inspector')
    const bystander = await createUser(tdb.db, 'supervisor')
    await failTimes(victim, '203.0.113.7', 10)

    const locked = await login(victim, victim.password, '203.0.113.7')
    expect(locked.status).toBe(429)
    expect(locked.body.error.code).toBe('auth.rate_limited')
    const retryAfter = Number(locked.headers['retry-after'])
    expect(retryAfter).toBeGreaterThan(0)
    expect(retryAfter).toBeLessThanOrEqual(15 * 60)

    // Another account from the same address is unaffected.
    expect((await login(bystander, bystander.password, '203.0.113.7')).status).toBe(200)
    // The same account from another address is unaffected.
    expect((await login(victim, victim.password, '198.51.100.20')).status).toBe(200)
  })

  it('nine failures do not lock, and a success starts the count again', async () => {
    const user = await createUser(tdb.db, 'maintenance')
    await failTimes(user, '203.0.113.9', 9)
    expect((await login(user, user.password, '203.0.113.9')).status).toBe(200)
    await failTimes(user, '203.0.113.9', 9)
    expect((await login(user, user.password, '203.0.113.9')).status).toBe(200)
  })

  it('counts attempts on unknown e-mails too', async () => {
    const ghost = { email: 'ghost@sharpfield.test' }
    for (let i = 0; i < 10; i++) expect((await login(ghost, 'x', '203.0.113.11')).status).toBe(401)
    expect((await login(ghost, 'x', '203.0.113.11')).status).toBe(429)
  })

  it('counts failures across server processes sharing the database', async () => {
    // Two apps on one database stand for two workers or replicas behind a load balancer.
    const other = makeApp(tdb.db, { config: testConfig({ trustProxy: 'loopback' }) }).app
    const user = await createUser(tdb.db, 'inspector')
    const via = (a: Express, password: string) =>
      request(a)
        .post('/api/auth/login')
        .set('X-Forwarded-For', '203.0.113.21')
        .send({ email: user.email, password })
    for (let i = 0; i < 5; i++) {
      expect((await via(app, 'wrong-password')).status).toBe(401)
      expect((await via(other, 'wrong-password')).status).toBe(401)
    }
    expect((await via(app, user.password)).status).toBe(429)
    expect((await via(other, user.password)).status).toBe(429)
  })
})
