import { rmSync } from 'node:fs'
import { join } from 'node:path'
import { eq } from 'drizzle-orm'
import { decode, encode } from 'image-js'
import request from 'supertest'
import { beforeAll, describe, expect, it } from 'vitest'
import { attachments } from '../../server/db/schema'
import { attachmentSchema } from '../../shared/schemas/checks'
import { createUser, signIn } from './helpers/app'
import { cropPng, pushCheck, upload, uploadDir, useUploadSession } from './helpers/uploadSession'

// GET /api/attachments/:id/content and GET /api/checks/:id/attachments over HTTP with a real
// MariaDB: a supervisor's screen lists a check's region crops and fetches one to make the
// restoration preview. Who may read them: the inspector who made the check, supervisors and
// admins — not another inspector, not maintenance, not anyone without a session.

const s = useUploadSession()
const extra = {} as Record<'admin' | 'maintenance', string>
beforeAll(async () => {
  extra.admin = (await signIn(s.app, await createUser(s.tdb.db, 'admin'))).token
  extra.maintenance = (await signIn(s.app, await createUser(s.tdb.db, 'maintenance'))).token
})

type Caller = 'no token' | 'inspector' | 'other' | 'supervisor' | 'admin' | 'maintenance'
const tokenOf = (who: Caller): string | null =>
  who === 'no token' ? null : who === 'admin' || who === 'maintenance' ? extra[who] : s.tokens[who]

/** GET with the caller's token; the body is kept as bytes whatever its type. */
function get(path: string, who: Caller, headers: Record<string, string> = {}) {
  let req = request(s.app).get(path)
  const token = tokenOf(who)
  if (token) req = req.set('Authorization', `Bearer ${token}`)
  for (const [k, v] of Object.entries(headers)) req = req.set(k, v)
  return req.buffer(true).parse((r, cb) => {
    const parts: Buffer[] = []
    r.on('data', (d: Buffer) => parts.push(d))
    r.on('end', () => cb(null, Buffer.concat(parts)))
  })
}
const json = (body: unknown) => JSON.parse((body as Buffer).toString('utf8'))

/** A synced check with its uploaded region crop (by its inspector). */
async function checkWithCrop(file: Buffer = cropPng) {
  const check = await pushCheck(s)
  const res = await upload(s, check.id, file, {
    kind: 'roi',
    measurementId: check.measurements[0].id,
  })
  expect(res.status).toBe(201)
  return { check, attachmentId: res.body.attachment.id as string }
}

describe('the region crop of a synced check', () => {
  it('is readable by its inspector, supervisors and admins only', async () => {
    const { attachmentId } = await checkWithCrop()
    const path = `/api/attachments/${attachmentId}/content`
    const matrix: [Caller, number, string | null][] = [
      ['no token', 401, 'auth.invalid_token'],
      ['inspector', 200, null],
      ['other', 403, 'auth.forbidden'],
      ['maintenance', 403, 'auth.forbidden'],
      ['supervisor', 200, null],
      ['admin', 200, null],
    ]
    for (const [who, status, code] of matrix) {
      const res = await get(path, who)
      expect(res.status, who).toBe(status)
      if (status === 200) {
        // The stored bytes exactly as uploaded, as a PNG only this user's browser may keep.
        expect(res.headers['content-type'], who).toBe('image/png')
        expect(res.headers['cache-control'], who).toMatch(/^private\b/)
        expect(res.headers['cache-control'], who).not.toMatch(/public|no-store/)
        expect(Buffer.compare(res.body as Buffer, cropPng), who).toBe(0)
      } else {
        expect(res.headers['content-type'], who).toMatch(/^application\/json/)
        expect(json(res.body).error.code, who).toBe(code)
        expect(res.headers['cache-control'], who).not.toMatch(/private/)
      }
    }
  })

  it('is listed, with its measurement, for the same people', async () => {
    const { check, attachmentId } = await checkWithCrop()
    const path = `/api/checks/${check.id}/attachments`
    for (const who of ['inspector', 'supervisor', 'admin'] as const) {
      const res = await get(path, who)
      expect(res.status, who).toBe(200)
      const items = attachmentSchema.array().parse(json(res.body).items)
      expect(
        items.map((a) => [a.id, a.kind, a.measurementId]),
        who,
      ).toEqual([[attachmentId, 'roi', check.measurements[0].id]])
    }
    for (const [who, status] of [
      ['no token', 401],
      ['other', 403],
      ['maintenance', 403],
    ] as const) {
      expect((await get(path, who)).status, who).toBe(status)
    }
  })

  it('answers 304 to a browser that already holds the same bytes', async () => {
    const { attachmentId } = await checkWithCrop()
    const path = `/api/attachments/${attachmentId}/content`
    const first = await get(path, 'supervisor')
    const etag = first.headers.etag as string
    expect(etag).toBeTruthy()
    const again = await get(path, 'supervisor', { 'If-None-Match': etag })
    expect(again.status).toBe(304)
    expect((again.body as Buffer).length).toBe(0)
    // The role is checked before any 304: another inspector's copy does not make it readable.
    expect((await get(path, 'other', { 'If-None-Match': etag })).status).toBe(403)
  })

  it('is served with the type of the stored bytes (a JPEG crop as image/jpeg)', async () => {
    const jpeg = Buffer.from(
      encode(decode(cropPng), { format: 'jpeg', encoderOptions: { quality: 95 } }),
    )
    expect([...jpeg.subarray(0, 3)]).toEqual([0xff, 0xd8, 0xff]) // JPEG SOI + marker (JFIF spec)
    const { attachmentId } = await checkWithCrop(jpeg)
    const res = await get(`/api/attachments/${attachmentId}/content`, 'supervisor')
    expect(res.status).toBe(200)
    expect(res.headers['content-type']).toBe('image/jpeg')
    expect(Buffer.compare(res.body as Buffer, jpeg)).toBe(0)
  })
})

describe('an attachment that cannot be served', () => {
  it('unknown id: 404 JSON; not an id: 400 naming the field', async () => {
    const unknown = await get(
      '/api/attachments/6f1c2d3e-4b5a-4c6d-8e9f-0a1b2c3d4e5f/content',
      'supervisor',
    )
    expect(unknown.status).toBe(404)
    expect(unknown.headers['content-type']).toMatch(/^application\/json/)
    expect(json(unknown.body).error.code).toBe('attachment.not_found')

    const bad = await get('/api/attachments/not-an-id/content', 'supervisor')
    expect(bad.status).toBe(400)
    expect(bad.headers['content-type']).toMatch(/^application\/json/)
    expect(JSON.stringify(json(bad.body).error)).toContain('must be an attachment id (UUID)')
  })

  it('file gone from the store: 410 JSON saying so', async () => {
    const { attachmentId } = await checkWithCrop()
    const [row] = await s.tdb.db.select().from(attachments).where(eq(attachments.id, attachmentId))
    rmSync(join(uploadDir(s), ...row.storageKey.split('/')))
    const res = await get(`/api/attachments/${attachmentId}/content`, 'supervisor')
    expect(res.status).toBe(410)
    expect(res.headers['content-type']).toMatch(/^application\/json/)
    expect(json(res.body).error.code).toBe('attachment.missing')
  })
})
