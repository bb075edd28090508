import { randomUUID } from 'node:crypto'
import request from 'supertest'
import { describe, expect, it } from 'vitest'
import { encodePngGrey } from '../fixtures/edges/render'
import {
  attachmentRows,
  cropPng,
  pngHeaderOnly,
  pushCheck,
  storedFiles,
  upload,
  useUploadSession,
} from './helpers/uploadSession'

// POST /api/checks/:id/attachments with bad input: each gets a clear 4xx and nothing is stored.

const s = useUploadSession()

describe('bad files', () => {
  it('answers each with a clear 4xx and stores nothing', async () => {
    const check = await pushCheck(s)
    const fields = { kind: 'roi', measurementId: check.measurements[0].id }
    const cases: [string, Buffer, number, string][] = [
      ['zero bytes', Buffer.alloc(0), 400, 'upload.empty'],
      [
        'text claiming image/png',
        Buffer.from('this is not an image at all'),
        415,
        'upload.unsupported_type',
      ],
      [
        'truncated PNG',
        cropPng.subarray(0, Math.floor(cropPng.length / 2)),
        422,
        'upload.undecodable',
      ],
      [
        'header claiming 100000 × 100000',
        pngHeaderOnly(100_000, 100_000),
        422,
        'upload.too_many_pixels',
      ],
      ['cut before the header ends', cropPng.subarray(0, 20), 422, 'upload.bad_header'],
      [
        'crop of another size',
        Buffer.from(encodePngGrey(60, 60, new Uint8Array(3600))),
        422,
        'upload.roi_mismatch',
      ],
    ]
    for (const [what, bytes, status, code] of cases) {
      const res = await upload(s, check.id, bytes, fields)
      expect({ what, status: res.status, code: res.body.error?.code }).toEqual({
        what,
        status,
        code,
      })
      expect(res.body.error.message.length).toBeGreaterThan(10)
    }
    expect(await attachmentRows(s, check.id)).toBe(0)
    expect(storedFiles(s)).toEqual([])
  })

  it('refuses a file over the size limit with 413', async () => {
    const check = await pushCheck(s)
    const res = await upload(s, check.id, Buffer.alloc(3 * 1024 * 1024, 7), {
      kind: 'roi',
      measurementId: check.measurements[0].id,
    })
    expect(res.status).toBe(413)
    expect(res.body.error.code).toBe('upload.too_large')
    expect(await attachmentRows(s, check.id)).toBe(0)
  })

  it('needs multipart, a measurement id for a crop, a synced check and the right person', async () => {
    const check = await pushCheck(s)
    const json = await request(s.app)
      .post(`/api/checks/${check.id}/attachments`)
      .set('Authorization', `Bearer ${s.tokens.inspector}`)
      .send({ kind: 'roi' })
    expect(json.status).toBe(415)
    expect((await upload(s, check.id, cropPng, { kind: 'roi' })).status).toBe(400)
    const missing = await upload(s, randomUUID(), cropPng, {
      kind: 'roi',
      measurementId: randomUUID(),
    })
    expect(missing.status).toBe(404)
    expect(missing.body.error.code).toBe('check.not_found')
    const foreign = await upload(
      s,
      check.id,
      cropPng,
      { kind: 'roi', measurementId: check.measurements[0].id },
      'other',
    )
    expect(foreign.status).toBe(403)
  })
})
