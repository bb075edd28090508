import { readFileSync, writeFileSync } from 'node:fs'
import { join } from 'node:path'
import { eq } from 'drizzle-orm'
import request from 'supertest'
import { describe, expect, it } from 'vitest'
import { attachments, auditLog, checks, measurements } from '../../server/db/schema'
import { createAttachmentService } from '../../server/services/attachments'
import { createLocalStorage } from '../../server/storage'
import { attachmentUploadResponseSchema } from '../../shared/schemas/checks'
import { encodePngGrey, renderEdgeCodes } from '../fixtures/edges/render'
import { makeApp } from './helpers/app'
import {
  ANALYTIC_MTF50,
  ANGLE_DEG,
  attachmentRows,
  cropPng,
  KERNEL,
  pushCheck,
  ROI,
  sha,
  storedFiles,
  upload,
  uploadDir,
  useUploadSession,
} from './helpers/uploadSession'

// POST /api/checks/:id/attachments: a good region crop is stored by its SHA-256 (once) and
// re-measured with the same engine as the device; shared frames expire; a store that cannot be
// written answers 503 and keeps the check.

const s = useUploadSession()

describe('a good region crop', () => {
  it('is stored under its SHA-256, re-measured, and stored once when sent again', async () => {
    const check = await pushCheck(s)
    const measurementId = check.measurements[0].id
    const res = await upload(s, check.id, cropPng, { kind: 'roi', measurementId })
    expect(res.status).toBe(201)
    const body = attachmentUploadResponseSchema.parse(res.body)
    expect(body.attachment).toMatchObject({
      sha256: sha(cropPng),
      bytes: cropPng.length,
      mime: 'image/png',
      width: ROI,
      height: ROI,
      deleteAfter: null,
    })
    const [row] = await s.tdb.db
      .select()
      .from(attachments)
      .where(eq(attachments.id, body.attachment.id))
    expect(readFileSync(join(uploadDir(s), ...row.storageKey.split('/')))).toEqual(cropPng)

    const [m] = await s.tdb.db.select().from(measurements).where(eq(measurements.id, measurementId))
    expect(m.serverMtf50CyPx).not.toBeNull()
    // Same engine, same pixels: within 2 % of the analytic value (the engine's 1 % median bar).
    expect(Math.abs(m.serverMtf50CyPx! - ANALYTIC_MTF50) / ANALYTIC_MTF50).toBeLessThan(0.02)
    expect(m.disagreement).toBe(false)
    expect(body.remeasure[0]).toMatchObject({ measurementId, disagreement: false })

    const again = await upload(s, check.id, cropPng, { kind: 'roi', measurementId })
    expect(again.status).toBe(200)
    expect(again.body.duplicate).toBe(true)
    expect(again.body.attachment.id).toBe(body.attachment.id)
    expect(await attachmentRows(s, check.id)).toBe(1)

    const content = await request(s.app)
      .get(`/api/attachments/${body.attachment.id}/content`)
      .set('Authorization', `Bearer ${s.tokens.supervisor}`)
      .buffer(true)
      .parse((r, cb) => {
        const parts: Buffer[] = []
        r.on('data', (d: Buffer) => parts.push(d))
        r.on('end', () => cb(null, Buffer.concat(parts)))
      })
    expect(content.status).toBe(200)
    expect(content.headers['content-type']).toBe('image/png')
    expect(Buffer.compare(content.body as Buffer, cropPng)).toBe(0)
  })

  it('records a disagreement when the device’s MTF50 is more than 2 % off the server’s', async () => {
    const check = await pushCheck(s, {}, ANALYTIC_MTF50 * 1.1)
    const measurementId = check.measurements[0].id
    const res = await upload(s, check.id, cropPng, { kind: 'roi', measurementId })
    expect(res.status).toBe(201)
    const [m] = await s.tdb.db.select().from(measurements).where(eq(measurements.id, measurementId))
    expect(m.disagreement).toBe(true)
    expect(res.body.remeasure[0].relativeDifference).toBeGreaterThan(0.02)
    const [note] = await s.tdb.db.select().from(auditLog).where(eq(auditLog.entityId, check.id))
    expect(note.action).toBe('check.disagreement')
  })
})

describe('full frames', () => {
  const frame = renderEdgeCodes({
    kernel: KERNEL,
    angleDeg: ANGLE_DEG,
    widthPx: 400,
    heightPx: 300,
  })
  const framePng = Buffer.from(encodePngGrey(frame.width, frame.height, frame.codes))

  it('are refused unless the inspector chose to share the frame', async () => {
    const check = await pushCheck(s, { shareFrame: false })
    const res = await upload(s, check.id, framePng, { kind: 'frame' })
    expect(res.status).toBe(422)
    expect(res.body.error.code).toBe('upload.frame_not_shared')
  })

  it('are kept until the retention date, re-measured at the stored regions, then purged', async () => {
    const check = await pushCheck(s, { shareFrame: true })
    const res = await upload(s, check.id, framePng, { kind: 'frame' })
    expect(res.status).toBe(201)
    const deleteAfter = new Date(res.body.attachment.deleteAfter).getTime()
    expect(Math.abs(deleteAfter - (Date.now() + 30 * 86_400_000))).toBeLessThan(60_000)
    const [m] = await s.tdb.db.select().from(measurements).where(eq(measurements.checkId, check.id))
    expect(Math.abs(m.serverMtf50CyPx! - ANALYTIC_MTF50) / ANALYTIC_MTF50).toBeLessThan(0.02)

    const service = createAttachmentService({
      db: s.tdb.db,
      storage: createLocalStorage(uploadDir(s)),
      now: () => new Date(),
      frameRetentionDays: 30,
      maxBytes: s.config.uploads.maxBytes,
    })
    expect(await service.purgeExpired(new Date(Date.now() + 29 * 86_400_000))).toBe(0)
    expect(await service.purgeExpired(new Date(Date.now() + 31 * 86_400_000))).toBe(1)
    expect(await attachmentRows(s, check.id)).toBe(0)
    expect(storedFiles(s).some((f) => f.startsWith('frame-'))).toBe(false)
    const [kept] = await s.tdb.db.select().from(checks).where(eq(checks.id, check.id))
    expect(kept).toBeDefined()
  })
})

describe('a store that cannot be written', () => {
  it('answers 503, keeps the check, and stores no attachment row', async () => {
    const blocked = join(s.config.dataDir, 'blocked-store')
    writeFileSync(blocked, 'a file where the upload folder should be')
    const broken = makeApp(s.tdb.db, { config: s.config, storage: createLocalStorage(blocked) }).app
    const check = await pushCheck(s)
    const res = await upload(
      s,
      check.id,
      cropPng,
      { kind: 'roi', measurementId: check.measurements[0].id },
      'inspector',
      { onApp: broken },
    )
    expect(res.status).toBe(503)
    expect(res.body.error.code).toBe('storage.unavailable')
    expect(res.headers['retry-after']).toBe('300')
    expect(await attachmentRows(s, check.id)).toBe(0)
    const [kept] = await s.tdb.db.select().from(checks).where(eq(checks.id, check.id))
    expect(kept.id).toBe(check.id)
  })
})
