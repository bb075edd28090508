import { mkdirSync, writeFileSync } from 'node:fs'
import { join } from 'node:path'
import type { Express } from 'express'
import request from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { createDb } from '../../server/db/client'
import { errorBodySchema, fieldErrorsSchema } from '../../shared/schemas/errors'
import { createUser, makeApp, signIn, testConfig } from './helpers/app'
import { createTestDatabase } from './helpers/db'
import type { TestDatabase } from './helpers/db'

let tdb: TestDatabase
let app: Express
let token: string

beforeAll(async () => {
  tdb = await createTestDatabase()
  app = makeApp(tdb.db).app
  token = (await signIn(app, await createUser(tdb.db, 'supervisor'))).token
})
afterAll(() => tdb?.drop())

const fields = (body: unknown) =>
  fieldErrorsSchema.parse(errorBodySchema.parse(body).error.details).fields

describe('bad input', () => {
  it('malformed JSON answers 400 request.malformed_json with a message', async () => {
    const res = await request(app)
      .post('/api/auth/login')
      .set('Content-Type', 'application/json')
      .send('{"email": "a@b.test", "password": ')
    expect(res.status).toBe(400)
    const body = errorBodySchema.parse(res.body)
    expect(body.error.code).toBe('request.malformed_json')
    expect(body.error.message).toMatch(/not valid JSON/)
  })

  it('a body that fails validation answers 400 with a message per field', async () => {
    const res = await request(app).post('/api/auth/login').send({ email: 'not-an-email' })
    expect(res.status).toBe(400)
    expect(res.body.error.code).toBe('request.invalid')
    const f = fields(res.body)
    expect(f.email[0]).toMatch(/e-mail/)
    expect(f.password.length).toBeGreaterThan(0)
  })

  it('a missing body is reported, not crashed on', async () => {
    const res = await request(app).post('/api/auth/login')
    expect(res.status).toBe(400)
    expect(res.body.error.code).toBe('request.invalid')
  })

  it('query parameters are validated too', async () => {
    const res = await request(app)
      .get('/api/cameras?limit=abc&state=broken')
      .set('Authorization', `Bearer ${token}`)
    expect(res.status).toBe(400)
    expect(Object.keys(fields(res.body)).sort()).toEqual(['limit', 'state'])
  })

  it('a path id that is not a number answers 400', async () => {
    const res = await request(app).get('/api/cameras/abc').set('Authorization', `Bearer ${token}`)
    expect(res.status).toBe(400)
    expect(fields(res.body).id).toBeDefined()
  })

  it('a body over 1 MB answers 413 request.too_large', async () => {
    const big = JSON.stringify({ email: 'a@b.test', password: 'x'.repeat(1024 * 1024 + 10) })
    const res = await request(app)
      .post('/api/auth/login')
      .set('Content-Type', 'application/json')
      .send(big)
    expect(res.status).toBe(413)
    expect(res.body.error.code).toBe('request.too_large')
  })

  it('an unknown /api route answers a JSON 404', async () => {
    const res = await request(app).get('/api/no-such-thing').set('Authorization', `Bearer ${token}`)
    expect(res.status).toBe(404)
    expect(res.headers['content-type']).toMatch(/json/)
    expect(res.body.error.code).toBe('request.not_found')
  })

  it('an unknown camera answers 404 camera.not_found', async () => {
    const res = await request(app)
      .get('/api/cameras/999999')
      .set('Authorization', `Bearer ${token}`)
    expect(res.status).toBe(404)
    expect(res.body.error.code).toBe('camera.not_found')
  })
})

describe('errors never leak internals', () => {
  it('an unexpected failure answers 500 with a plain message and no stack', async () => {
    const broken = createDb(tdb.url)
    await broken.close() // every query now throws "Pool is closed"
    const failing = makeApp(broken.db).app
    const t = (await signIn(app, await createUser(tdb.db, 'admin'))).token
    const res = await request(failing).get('/api/users').set('Authorization', `Bearer ${t}`)
    expect(res.status).toBe(500)
    expect(res.body).toEqual({
      error: { code: 'internal', message: 'Something went wrong on the server.' },
    })
    expect(res.text).not.toMatch(/at .*\.ts|Pool is closed/)
  })
})

describe('headers and the client', () => {
  it('sends secure headers with the PWA content security policy', async () => {
    const res = await request(app).get('/api/health')
    const csp = String(res.headers['content-security-policy'])
    for (const d of [
      "default-src 'self'",
      "script-src 'self'",
      "style-src 'self' 'unsafe-inline'",
      "img-src 'self' data: blob:",
      "worker-src 'self' blob:",
      "connect-src 'self'",
      "font-src 'self' data:",
      "manifest-src 'self'",
    ]) {
      expect(csp).toContain(d)
    }
    expect(csp).not.toContain('upgrade-insecure-requests')
    expect(res.headers['x-content-type-options']).toBe('nosniff')
    expect(res.headers['x-powered-by']).toBeUndefined()
    expect(res.headers['cache-control']).toBe('no-store')
  })

  it('without a built client, pages answer a clear 503', async () => {
    for (const path of ['/', '/rounds']) {
      const res = await request(app).get(path)
      expect(res.status).toBe(503)
      expect(res.text).toMatch(/not built/)
    }
  })

  it('serves the built client with a fallback to index.html for app routes', async () => {
    const config = testConfig()
    const dist = join(config.dataDir, 'dist')
    mkdirSync(join(dist, 'assets'), { recursive: true })
    writeFileSync(join(dist, 'index.html'), '<!doctype html><title>Sharpfield</title>')
    writeFileSync(join(dist, 'assets', 'app-abc123.js'), 'console.log(1)')
    const withClient = makeApp(tdb.db, { config: { ...config, staticDir: dist } }).app
    for (const path of ['/', '/cameras/12']) {
      const page = await request(withClient).get(path)
      expect(page.status).toBe(200)
      expect(page.text).toContain('<title>Sharpfield</title>')
    }
    const asset = await request(withClient).get('/assets/app-abc123.js')
    expect(asset.status).toBe(200)
    expect(asset.headers['cache-control']).toMatch(/immutable/)
    expect((await request(withClient).get('/assets/app-old999.js')).status).toBe(404)
    const api = await request(withClient).get('/api/nope')
    expect(api.status).toBe(404)
    expect(api.body.error.code).toBe('request.not_found')
  })
})
