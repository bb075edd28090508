import { createHash, randomUUID } from 'node:crypto'
import { existsSync, readdirSync } from 'node:fs'
import { join } from 'node:path'
import { count, eq } from 'drizzle-orm'
import type { Express } from 'express'
import request from 'supertest'
import { afterAll, beforeAll, expect } from 'vitest'
import type { Config } from '../../../server/config'
import { attachments } from '../../../server/db/schema'
import type { CheckCreatePayload } from '../../../shared/schemas/checks'
import { expectedMtf50 } from '../../fixtures/edges/analytic'
import type { Kernel } from '../../fixtures/edges/analytic'
import { encodePngGrey, renderEdgeCodes } from '../../fixtures/edges/render'
import { createUser, makeApp, signIn, testConfig } from './app'
import { createTestDatabase } from './db'
import type { TestDatabase } from './db'
import { checkPayload, createFleet, op } from './fleet'
import type { TestFleet } from './fleet'

// Shared set-up of the upload tests: a synced check with one measured region, a rendered crop of
// that region, and helpers to upload and to see what was stored.

export const KERNEL: Kernel = { type: 'gaussian', sigmaPx: 1 }
export const ANGLE_DEG = 5
// Analytic MTF50 of a Gaussian (σ = 1 px) edge over a 1-px square pixel at 5° (Gaussian OTF ×
// pixel sinc, tests/fixtures/edges/analytic.ts), about 0.18 cycles/pixel.
export const ANALYTIC_MTF50 = expectedMtf50(KERNEL, ANGLE_DEG)
export const ROI = 120

const crop = renderEdgeCodes({ kernel: KERNEL, angleDeg: ANGLE_DEG, widthPx: ROI, heightPx: ROI })
export const cropPng = Buffer.from(encodePngGrey(crop.width, crop.height, crop.codes))
export const sha = (b: Uint8Array) => createHash('sha256').update(b).digest('hex')

type Who = 'inspector' | 'other' | 'supervisor'

export interface UploadSession {
  tdb: TestDatabase
  app: Express
  config: Config
  fleet: TestFleet
  tokens: Record<Who, string>
}

/** Registers beforeAll/afterAll (2 MB upload limit, 30 days frame retention). */
export function useUploadSession(): UploadSession {
  const s = { tokens: {} } as UploadSession
  beforeAll(async () => {
    s.tdb = await createTestDatabase()
    ;({ app: s.app, config: s.config } = makeApp(s.tdb.db, {
      config: testConfig({ uploads: { maxBytes: 2 * 1024 * 1024, frameRetentionDays: 30 } }),
    }))
    s.fleet = await createFleet(s.tdb.db, 1)
    s.tokens.inspector = (await signIn(s.app, await createUser(s.tdb.db, 'inspector'))).token
    s.tokens.other = (await signIn(s.app, await createUser(s.tdb.db, 'inspector'))).token
    s.tokens.supervisor = (await signIn(s.app, await createUser(s.tdb.db, 'supervisor'))).token
  })
  afterAll(() => s.tdb?.drop())
  return s
}

/** Pushes a check whose one measurement (120 × 120 at 140, 90) has the device MTF50 `device`. */
export async function pushCheck(
  s: UploadSession,
  overrides: Partial<CheckCreatePayload> = {},
  device = ANALYTIC_MTF50,
) {
  const base = checkPayload(s.fleet.cameraIds[0], overrides, 1)
  const measurement = {
    ...base.measurements[0],
    id: randomUUID(),
    roi: { x: 140, y: 90, w: ROI, h: ROI },
    orientation: 'vertical' as const,
    mtf50CyPx: device,
  }
  const payload = { ...base, measurements: [measurement] }
  const res = await request(s.app)
    .post('/api/sync/push')
    .set('Authorization', `Bearer ${s.tokens.inspector}`)
    .send({ deviceId: 'phone-u', ops: [op('check.create', payload)] })
  expect(res.body.results[0].status).toBe('applied')
  return payload
}

export function upload(
  s: UploadSession,
  checkId: string,
  file: Buffer,
  fields: Record<string, string>,
  who: Who = 'inspector',
  options: { onApp?: Express } = {},
) {
  let req = request(options.onApp ?? s.app)
    .post(`/api/checks/${checkId}/attachments`)
    .set('Authorization', `Bearer ${s.tokens[who]}`)
  for (const [k, v] of Object.entries(fields)) req = req.field(k, v)
  return req.attach('file', file, { filename: 'crop.png', contentType: 'image/png' })
}

export async function attachmentRows(s: UploadSession, checkId?: string): Promise<number> {
  const [{ n }] = await s.tdb.db
    .select({ n: count() })
    .from(attachments)
    .where(checkId ? eq(attachments.checkId, checkId) : undefined)
  return Number(n)
}

export const uploadDir = (s: UploadSession) => join(s.config.dataDir, 'uploads')

export function storedFiles(s: UploadSession): string[] {
  return existsSync(uploadDir(s))
    ? readdirSync(uploadDir(s), { recursive: true, withFileTypes: true })
        .filter((d) => d.isFile())
        .map((d) => d.name)
    : []
}

/** A PNG whose IHDR claims width × height (and nothing else). */
export function pngHeaderOnly(width: number, height: number): Buffer {
  const ihdr = Buffer.alloc(25)
  ihdr.writeUInt32BE(13, 0)
  ihdr.write('IHDR', 4, 'ascii')
  ihdr.writeUInt32BE(width, 8)
  ihdr.writeUInt32BE(height, 12)
  ihdr.set([8, 0, 0, 0, 0], 16)
  return Buffer.concat([Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]), ihdr])
}
