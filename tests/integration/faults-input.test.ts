import { randomUUID } from 'node:crypto'
import { existsSync, readdirSync } from 'node:fs'
import { join } from 'node:path'
import { count, eq } from 'drizzle-orm'
import request from 'supertest'
import { describe, expect, it } from 'vitest'
import { attachments, checks } from '../../server/db/schema'
import type { Logger } from '../../server/errors'
import { createUser, makeApp, signIn } from './helpers/app'
import { checkPayload, op } from './helpers/fleet'
import { cropPng, pushCheck, uploadDir, useUploadSession } from './helpers/uploadSession'

// Hostile input not covered elsewhere: deeply nested and huge JSON, path tricks in upload file
// names, script in notes, and secrets in the server log.

const s = useUploadSession()
const bearer = (who: 'inspector' | 'supervisor') => `Bearer ${s.tokens[who]}`

function nested(depth: number): string {
  return '['.repeat(depth) + ']'.repeat(depth)
}

describe('deeply nested or huge JSON', () => {
  it.each([[40], [100_000]])(
    'a push whose payload is nested %i levels deep is refused with a reason',
    async (depth) => {
      const before = await s.tdb.db.select({ n: count() }).from(checks)
      const body = `{"deviceId":"phone-deep","ops":[{"id":"${randomUUID()}","kind":"check.create","payload":${nested(depth)}}]}`
      const res = await request(s.app)
        .post('/api/sync/push')
        .set('Authorization', bearer('inspector'))
        .set('Content-Type', 'application/json')
        .send(body)
      expect(res.status).toBe(200)
      expect(res.body.results[0]).toMatchObject({ status: 'rejected', code: 'op.invalid' })
      expect(res.body.results[0].reason).toMatch(/\w+/)
      const after = await s.tdb.db.select({ n: count() }).from(checks)
      expect(after).toEqual(before)
    },
  )

  it('a sign-in body nested 100 000 levels deep answers 400 with field messages', async () => {
    const res = await request(s.app)
      .post('/api/auth/login')
      .set('Content-Type', 'application/json')
      .send(`{"email":${nested(100_000)},"password":"x"}`)
    expect(res.status).toBe(400)
    expect(res.body.error.code).toBe('request.invalid')
    expect(res.body.error.message).toBe('Some fields are missing or invalid.')
  })

  it('a push over 8 MB answers 413 request.too_large and stores nothing', async () => {
    const before = await s.tdb.db.select({ n: count() }).from(checks)
    const huge = checkPayload(s.fleet.cameraIds[0], { notes: 'x'.repeat(9 * 1024 * 1024) })
    const res = await request(s.app)
      .post('/api/sync/push')
      .set('Authorization', bearer('inspector'))
      .send({ deviceId: 'phone-huge', ops: [op('check.create', huge)] })
    expect(res.status).toBe(413)
    expect(res.body.error).toEqual({
      code: 'request.too_large',
      message: 'The request body is larger than 8 MB.',
    })
    expect(await s.tdb.db.select({ n: count() }).from(checks)).toEqual(before)
  })
})

describe('path tricks in upload file names', () => {
  it.each([
    ['../../../../outside.png'],
    ['..\\..\\..\\outside.png'],
    ['/etc/cron.d/outside.png'],
    ['%2e%2e%2foutside.png'],
  ])('a crop named %s is stored under a generated key inside the upload folder', async (name) => {
    const check = await pushCheck(s)
    const res = await request(s.app)
      .post(`/api/checks/${check.id}/attachments`)
      .set('Authorization', bearer('inspector'))
      .field('kind', 'roi')
      .field('measurementId', check.measurements[0].id)
      .attach('file', cropPng, { filename: name, contentType: 'image/png' })
    expect(res.status).toBe(201)
    const [row] = await s.tdb.db
      .select({ key: attachments.storageKey })
      .from(attachments)
      .where(eq(attachments.id, res.body.attachment.id))
    expect(row.key).toMatch(new RegExp(`^checks/${check.id}/roi-[0-9a-f]{64}\\.png$`))
    const files = readdirSync(uploadDir(s), { recursive: true }).map(String)
    expect(files.some((f) => f.includes('outside'))).toBe(false)
    expect(existsSync(join(s.config.dataDir, '..', 'outside.png'))).toBe(false)
    expect(JSON.stringify(res.body)).not.toContain('outside')
  })

  it('an attachment id made of dots and slashes answers 400 or 404, never a file', async () => {
    for (const id of ['..%2F..%2Fetc%2Fpasswd', '..', '%2e%2e']) {
      const res = await request(s.app)
        .get(`/api/attachments/${id}/content`)
        .set('Authorization', bearer('inspector'))
      expect([400, 404]).toContain(res.status)
      expect(res.headers['content-type']).toMatch(/application\/json/)
    }
  })
})

describe('script in notes', () => {
  it('is stored verbatim and served as JSON data, never as markup', async () => {
    const notes = '<script>alert("x")</script><img src=x onerror=alert(1)>'
    const check = await pushCheck(s, { notes })
    const res = await request(s.app)
      .get(`/api/fleet/checks/${check.id}`)
      .set('Authorization', bearer('supervisor'))
    expect(res.status).toBe(200)
    expect(res.headers['content-type']).toMatch(/^application\/json/)
    expect(res.headers['x-content-type-options']).toBe('nosniff')
    expect(res.body.notes).toBe(notes)
  })
})

describe('secrets in the log', () => {
  it('a failed sign-in and a failing request log neither the password nor the token', async () => {
    const lines: string[] = []
    const logger: Logger = {
      info: (m) => lines.push(m),
      error: (m, err) =>
        lines.push(`${m} ${err instanceof Error ? `${err.message} ${err.stack}` : String(err)}`),
    }
    const { app } = makeApp(s.tdb.db, { logger })
    const user = await createUser(s.tdb.db, 'inspector', { password: 'correct-horse-battery-9' })
    const wrong = await request(app)
      .post('/api/auth/login')
      .send({ email: user.email, password: 'WrongSecret-Pw-12345' })
    expect(wrong.status).toBe(401)
    const { token, refreshToken } = await signIn(app, user)
    await request(app)
      .get('/api/fleet/summary')
      .set('Authorization', `Bearer ${token}`)
      .query({ from: 'not-a-date' })
    const all = lines.join('\n')
    for (const secret of ['WrongSecret-Pw-12345', 'correct-horse-battery-9', token, refreshToken])
      expect(all).not.toContain(secret)
  })
})
