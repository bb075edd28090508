import type { Express } from 'express'
import { SignJWT } from 'jose'
import request from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { JWT_AUDIENCE, JWT_ISSUER } from '../../server/services/tokens'
import { meResponseSchema, sessionResponseSchema } from '../../shared/schemas/auth'
import { errorBodySchema } from '../../shared/schemas/errors'
import { createUser, jwtKey, makeApp, signIn } from './helpers/app'
import type { TestUser } from './helpers/app'
import { createTestDatabase } from './helpers/db'
import type { TestDatabase } from './helpers/db'

let tdb: TestDatabase
let app: Express
let inspector: TestUser

beforeAll(async () => {
  tdb = await createTestDatabase()
  app = makeApp(tdb.db).app
  inspector = await createUser(tdb.db, 'inspector', { name: 'Ines Test' })
})
afterAll(() => tdb?.drop())

const errorCode = (body: unknown) => errorBodySchema.parse(body).error.code

function b64url(obj: unknown): string {
  return Buffer.from(JSON.stringify(obj)).toString('base64url')
}

async function signWith(
  claims: Record<string, unknown>,
  opts: { key?: Uint8Array; alg?: string; exp?: number; iss?: string; aud?: string } = {},
): Promise<string> {
  const nowS = Math.floor(Date.now() / 1000)
  return new SignJWT({ role: 'inspector', email: inspector.email, ...claims })
    .setProtectedHeader({ alg: opts.alg ?? 'HS256' })
    .setSubject(String(inspector.id))
    .setIssuer(opts.iss ?? JWT_ISSUER)
    .setAudience(opts.aud ?? JWT_AUDIENCE)
    .setIssuedAt(nowS - 3600)
    .setExpirationTime(opts.exp ?? nowS + 600)
    .sign(opts.key ?? jwtKey)
}

describe('sign-in', () => {
  it('returns an access token, a refresh token and the user, and sets the refresh cookie', async () => {
    const res = await request(app)
      .post('/api/auth/login')
      .send({ email: inspector.email, password: inspector.password })
    expect(res.status).toBe(200)
    const body = sessionResponseSchema.parse(res.body)
    expect(body.user).toEqual({
      id: inspector.id,
      email: inspector.email,
      name: 'Ines Test',
      role: 'inspector',
    })
    expect(body.expiresIn).toBe(900)
    const cookie = String(res.headers['set-cookie'])
    expect(cookie).toContain(`sf_refresh=${body.refreshToken}`)
    expect(cookie).toMatch(/HttpOnly/i)
    expect(cookie).toMatch(/SameSite=Strict/i)
    expect(cookie).toMatch(/Path=\/api\/auth/i)
  })

  it('accepts the e-mail in any letter case', async () => {
    const res = await request(app)
      .post('/api/auth/login')
      .send({ email: inspector.email.toUpperCase(), password: inspector.password })
    expect(res.status).toBe(200)
  })

  it('refuses a wrong password with 401 and the same answer as for an unknown e-mail', async () => {
    const wrong = await request(app)
      .post('/api/auth/login')
      .send({ email: inspector.email, password: 'not-it' })
    const unknown = await request(app)
      .post('/api/auth/login')
      .send({ email: 'nobody@sharpfield.test', password: 'whatever' })
    expect(wrong.status).toBe(401)
    expect(unknown.status).toBe(401)
    expect(errorCode(wrong.body)).toBe('auth.invalid_credentials')
    expect(unknown.body).toEqual(wrong.body)
  })

  it('refuses a deactivated account even with the right password', async () => {
    const former = await createUser(tdb.db, 'inspector', { active: false })
    const res = await request(app)
      .post('/api/auth/login')
      .send({ email: former.email, password: former.password })
    expect(res.status).toBe(403)
    expect(errorCode(res.body)).toBe('auth.account_inactive')
    expect(res.body.token).toBeUndefined()
  })
})

describe('me', () => {
  it('returns the signed-in user for a valid access token', async () => {
    const s = await signIn(app, inspector)
    const res = await request(app).get('/api/auth/me').set('Authorization', `Bearer ${s.token}`)
    expect(res.status).toBe(200)
    expect(meResponseSchema.parse(res.body).user).toEqual(s.user)
  })

  it('answers 401 auth.invalid_token without a token', async () => {
    const res = await request(app).get('/api/auth/me')
    expect(res.status).toBe(401)
    expect(errorCode(res.body)).toBe('auth.invalid_token')
  })
})

describe('refresh and logout', () => {
  it('rotates the refresh token: the new one works, the spent one does not', async () => {
    const s = await signIn(app, inspector)
    const r1 = await request(app).post('/api/auth/refresh').send({ refreshToken: s.refreshToken })
    expect(r1.status).toBe(200)
    const next = sessionResponseSchema.parse(r1.body)
    expect(next.refreshToken).not.toBe(s.refreshToken)
    const me = await request(app).get('/api/auth/me').set('Authorization', `Bearer ${next.token}`)
    expect(me.status).toBe(200)
    const r2 = await request(app)
      .post('/api/auth/refresh')
      .send({ refreshToken: next.refreshToken })
    expect(r2.status).toBe(200)
  })

  it('revokes the whole family when a rotated token is presented again', async () => {
    const s = await signIn(app, inspector)
    const rotated = sessionResponseSchema.parse(
      (await request(app).post('/api/auth/refresh').send({ refreshToken: s.refreshToken })).body,
    )
    const reuse = await request(app)
      .post('/api/auth/refresh')
      .send({ refreshToken: s.refreshToken })
    expect(reuse.status).toBe(401)
    expect(errorCode(reuse.body)).toBe('auth.refresh_reused')
    // The legitimate newest token of that family is dead too.
    const after = await request(app)
      .post('/api/auth/refresh')
      .send({ refreshToken: rotated.refreshToken })
    expect(after.status).toBe(401)
    // Another sign-in (another family) is unaffected.
    const other = await signIn(app, inspector)
    const ok = await request(app)
      .post('/api/auth/refresh')
      .send({ refreshToken: other.refreshToken })
    expect(ok.status).toBe(200)
  })

  it('takes the refresh token from the httpOnly cookie', async () => {
    const agent = request.agent(app)
    const login = await agent
      .post('/api/auth/login')
      .send({ email: inspector.email, password: inspector.password })
    expect(login.status).toBe(200)
    const res = await agent.post('/api/auth/refresh')
    expect(res.status).toBe(200)
    expect(sessionResponseSchema.parse(res.body).refreshToken).not.toBe(login.body.refreshToken)
  })

  it('refuses an unknown refresh token and a missing one', async () => {
    const bad = await request(app).post('/api/auth/refresh').send({ refreshToken: 'made-up-token' })
    expect(bad.status).toBe(401)
    expect(errorCode(bad.body)).toBe('auth.invalid_refresh')
    const none = await request(app).post('/api/auth/refresh').send({})
    expect(none.status).toBe(401)
  })

  it('logout revokes the refresh family and clears the cookie', async () => {
    const s = await signIn(app, inspector)
    const out = await request(app).post('/api/auth/logout').send({ refreshToken: s.refreshToken })
    expect(out.status).toBe(204)
    expect(String(out.headers['set-cookie'])).toMatch(/sf_refresh=;/)
    const res = await request(app).post('/api/auth/refresh').send({ refreshToken: s.refreshToken })
    expect(res.status).toBe(401)
  })
})

describe('access tokens that must be refused', () => {
  const me = (token: string) =>
    request(app).get('/api/auth/me').set('Authorization', `Bearer ${token}`)

  it('an expired token answers 401 auth.expired', async () => {
    const token = await signWith({}, { exp: Math.floor(Date.now() / 1000) - 60 })
    const res = await me(token)
    expect(res.status).toBe(401)
    expect(errorCode(res.body)).toBe('auth.expired')
  })

  it('a token whose payload was changed answers 401 auth.invalid_token', async () => {
    const [h, , sig] = (await signWith({})).split('.')
    const forged = `${h}.${b64url({ sub: String(inspector.id), role: 'admin', email: inspector.email, iss: JWT_ISSUER, aud: JWT_AUDIENCE, exp: Math.floor(Date.now() / 1000) + 600, iat: 1 })}.${sig}`
    const res = await me(forged)
    expect(res.status).toBe(401)
    expect(errorCode(res.body)).toBe('auth.invalid_token')
  })

  it('an unsigned token (alg none) answers 401', async () => {
    const nowS = Math.floor(Date.now() / 1000)
    const token = `${b64url({ alg: 'none', typ: 'JWT' })}.${b64url({ sub: String(inspector.id), role: 'admin', email: inspector.email, iss: JWT_ISSUER, aud: JWT_AUDIENCE, iat: nowS, exp: nowS + 600 })}.`
    const res = await me(token)
    expect(res.status).toBe(401)
    expect(errorCode(res.body)).toBe('auth.invalid_token')
  })

  it('a token signed with another key answers 401', async () => {
    const other = new TextEncoder().encode('some-other-secret-of-sufficient-length-000000000')
    const res = await me(await signWith({}, { key: other }))
    expect(res.status).toBe(401)
    expect(errorCode(res.body)).toBe('auth.invalid_token')
  })

  it('a token signed with the right key but another algorithm (HS512) answers 401', async () => {
    const res = await me(await signWith({}, { alg: 'HS512' }))
    expect(res.status).toBe(401)
  })

  it('a token for another audience or issuer answers 401', async () => {
    expect((await me(await signWith({}, { aud: 'someone-else' }))).status).toBe(401)
    expect((await me(await signWith({}, { iss: 'someone-else' }))).status).toBe(401)
  })

  it('a token with an unknown role answers 401', async () => {
    const res = await me(await signWith({ role: 'superuser' }))
    expect(res.status).toBe(401)
  })

  it('a correctly signed token passes (control for the cases above)', async () => {
    expect((await me(await signWith({}))).status).toBe(200)
  })
})
