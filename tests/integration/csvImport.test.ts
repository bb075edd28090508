// Camera inventory CSV import over HTTP: template, preview with row-level errors, and a commit
// that imports every row or none (checked again inside the transaction).
import { and, count, eq } from 'drizzle-orm'
import type { Express } from 'express'
import Papa from 'papaparse'
import request from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { auditLog, cameras, changes } from '../../server/db/schema'
import { CAMERA_CSV_COLUMNS, csvCommitSchema, csvPreviewSchema } from '../../shared/schemas/csv'
import { now, seedFleet } from './fleetFixture'
import { createUser, makeApp, signIn } from './helpers/app'
import { createTestDatabase } from './helpers/db'
import type { TestDatabase } from './helpers/db'

let tdb: TestDatabase
let app: Express
const token: Record<string, string> = {}

beforeAll(async () => {
  tdb = await createTestDatabase()
  await seedFleet(tdb.db)
  app = makeApp(tdb.db, { now }).app
  for (const role of ['admin', 'supervisor'] as const)
    token[role] = (await signIn(app, await createUser(tdb.db, role))).token
})
afterAll(() => tdb?.drop())

const HEADER = 'asset_tag,site,camera_model,task,location,min_mtf50_cy_px,check_interval_days'
const GOOD = [
  'GATE-01,North Depot,Alpha dome,recognise,"North gate, pole 2",0.22,60',
  'GATE-02,north depot,ALPHA DOME,Recognise,Side gate,,',
  'YARD-01,South Yard,Bravo bullet,detect,Fence,,',
]

function upload(path: string, csv: string | Buffer, name = 'cameras.csv', role = 'admin') {
  return request(app)
    .post(path)
    .set('Authorization', `Bearer ${token[role]}`)
    .attach('file', Buffer.isBuffer(csv) ? csv : Buffer.from(csv, 'utf8'), {
      filename: name,
      contentType: 'text/csv',
    })
}
const preview = (csv: string | Buffer, name?: string) =>
  upload('/api/setup/camera-import/preview', csv, name)
const commit = (csv: string | Buffer) => upload('/api/setup/camera-import/commit', csv)

async function cameraCount(): Promise<number> {
  const [{ n }] = await tdb.db.select({ n: count() }).from(cameras)
  return Number(n)
}

describe('the template', () => {
  it('downloads with every column the import accepts', async () => {
    const res = await request(app)
      .get('/api/setup/camera-import/template')
      .set('Authorization', `Bearer ${token.admin}`)
    expect(res.status).toBe(200)
    expect(res.headers['content-type']).toBe('text/csv; charset=utf-8')
    expect(res.headers['content-disposition']).toContain('sharpfield-cameras-template.csv')
    const parsed = Papa.parse<string[]>(res.text.trim())
    expect(parsed.data[0]).toEqual([...CAMERA_CSV_COLUMNS])
    expect(parsed.data.length).toBeGreaterThan(1)
  })
})

describe('preview', () => {
  it('a good file: every row valid, names matched without regard to case, nothing written', async () => {
    const before = await cameraCount()
    const res = await preview([HEADER, ...GOOD].join('\r\n'))
    expect(res.status).toBe(200)
    const p = csvPreviewSchema.parse(res.body)
    expect(p).toMatchObject({ valid: true, rowCount: 3, errorRowCount: 0 })
    expect(p.rows.map((r) => r.line)).toEqual([2, 3, 4])
    expect(p.rows[0].values.location).toBe('North gate, pole 2')
    expect(await cameraCount()).toBe(before)
  })

  it('names each wrong row by line and column', async () => {
    const csv = [
      HEADER,
      GOOD[0],
      'GATE-03,Atlantis,Alpha dome,recognise,Nowhere,,', // unknown site
      'N1,North Depot,Alpha dome,recognise,Exists,,', // asset tag taken
      'GATE-01,North Depot,Alpha dome,recognise,Twice,,', // same tag as line 2
      'GATE-04,North Depot,Alpha dome,juggling,Bad task,"0,25",abc',
      '=cmd|calc,North Depot,Alpha dome,recognise,@SUM(A1),,', // formula cells
      'GATE-05,North Depot,Alpha dome,recognise,Too,many,cells,here',
      'GATE-06,North Depot,Alpha dome,recognise,Out of range,1.5,0',
    ].join('\n')
    const p = csvPreviewSchema.parse((await preview(csv)).body)
    expect(p).toMatchObject({ valid: false, rowCount: 8, errorRowCount: 7 })
    const at = (line: number) => p.rows.find((r) => r.line === line)!.errors
    expect(at(3)).toEqual([{ column: 'site', message: 'There is no site named "Atlantis".' }])
    expect(at(4)).toEqual([
      { column: 'asset_tag', message: 'A camera with this asset tag exists already.' },
    ])
    expect(at(5)).toEqual([{ column: 'asset_tag', message: 'The same asset tag as line 2.' }])
    expect(
      at(6)
        .map((e) => e.column)
        .sort(),
    ).toEqual(['check_interval_days', 'min_mtf50_cy_px', 'task'])
    expect(at(6).find((e) => e.column === 'min_mtf50_cy_px')?.message).toBe(
      'Use a dot as the decimal separator (e.g. 0.25).',
    )
    expect(
      at(7)
        .map((e) => e.column)
        .sort(),
    ).toEqual(['asset_tag', 'location'])
    expect(at(7)[0].message).toMatch(/formula/)
    expect(at(8)).toEqual([{ column: null, message: 'The row has 8 cells; the header has 7.' }])
    expect(
      at(9)
        .map((e) => e.column)
        .sort(),
    ).toEqual(['check_interval_days', 'min_mtf50_cy_px'])
    // Error rows first, then the valid ones.
    expect(p.rows.at(-1)!.line).toBe(2)
  })

  it('counts lines the way a text editor does (blank lines, quoted line breaks)', async () => {
    const csv = `${HEADER}\n\n${GOOD[0]}\n"GATE-09",North Depot,Alpha dome,recognise,"two\nlines",,\nGATE-10,Mars Base,Alpha dome,recognise,x,,\n`
    const p = csvPreviewSchema.parse((await preview(csv)).body)
    expect(p.rows.find((r) => r.errors.length)!.line).toBe(6)
  })

  it('refuses files that are not the camera CSV, with a sentence saying why', async () => {
    const cases: [string | Buffer, number, RegExp][] = [
      [
        'asset_tag,site,camera_model,colour\nA,B,C,D',
        400,
        /missing column: task; unknown column: colour/,
      ],
      ['asset_tag,site,site,camera_model,task\nA,B,B,C,D', 400, /repeated column: site/],
      [HEADER, 400, /no camera rows/],
      ['', 400, /empty/],
      [Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x00, 0x01]), 400, /not a text CSV/],
      [Buffer.from([0x61, 0x2c, 0xff, 0xfe, 0x0a]), 400, /not UTF-8/],
      [`${HEADER}\n"GATE-01,North Depot,Alpha dome,recognise,,,`, 400, /malformed/],
    ]
    for (const [csv, status, message] of cases) {
      const res = await preview(csv)
      expect(res.status, String(csv)).toBe(status)
      expect(res.body.error.message).toMatch(message)
    }
  })

  it('refuses more than 2 MB and more than 10 000 rows', async () => {
    const big = `${HEADER}\n${'X'.repeat(2 * 1024 * 1024)}`
    const huge = await preview(big)
    expect(huge.status).toBe(413)
    expect(huge.body.error).toMatchObject({ code: 'import.too_large' })
    expect(huge.body.error.message).toMatch(/larger than 2 MB/)
    const rows = Array.from({ length: 10_001 }, (_, i) => `T-${i},North Depot,Alpha dome,detect,,,`)
    const many = await preview([HEADER, ...rows].join('\n'))
    expect(many.status).toBe(413)
    expect(many.body.error.message).toBe(
      'The file has 10001 rows; at most 10000 can be imported at once.',
    )
  })

  it('needs a file, as an admin', async () => {
    const none = await request(app)
      .post('/api/setup/camera-import/preview')
      .set('Authorization', `Bearer ${token.admin}`)
      .send({})
    expect(none.status).toBe(400)
    expect(none.body.error.message).toMatch(/Attach the CSV file/)
    expect(
      (await upload('/api/setup/camera-import/preview', HEADER, 'x.csv', 'supervisor')).status,
    ).toBe(403)
    expect(
      (await upload('/api/setup/camera-import/commit', HEADER, 'x.csv', 'supervisor')).status,
    ).toBe(403)
    expect((await preview('a,b', 'cameras.exe')).status).toBe(400)
  })
})

describe('commit', () => {
  it('imports nothing when any row is wrong, then everything once it is fixed', async () => {
    const before = await cameraCount()
    const bad = [HEADER, ...GOOD, 'YARD-02,Nowhere Yard,Bravo bullet,detect,,,'].join('\n')
    const refused = await commit(bad)
    expect(refused.status).toBe(422)
    expect(refused.body.error.code).toBe('import.invalid_rows')
    expect(refused.body.error.message).toBe(
      '1 of 4 rows have errors; nothing was imported. Fix them and try again.',
    )
    expect(refused.body.error.details.rows[0]).toMatchObject({
      line: 5,
      errors: [{ column: 'site' }],
    })
    expect(await cameraCount()).toBe(before)

    const fixed = [HEADER, ...GOOD, 'YARD-02,South Yard,Bravo bullet,detect,,,'].join('\n')
    const res = await commit(fixed)
    expect(res.status).toBe(201)
    const out = csvCommitSchema.parse(res.body)
    expect(out.imported).toBe(4)
    expect(await cameraCount()).toBe(before + 4)
    const [gate] = await tdb.db.select().from(cameras).where(eq(cameras.assetTag, 'GATE-01'))
    expect(gate).toMatchObject({
      locationText: 'North gate, pole 2',
      minMtf50CyPx: 0.22,
      checkIntervalDays: 60,
      taskId: 'recognise',
      state: 'due',
      active: true,
    })
    const [entry] = await tdb.db.select().from(auditLog).where(eq(auditLog.action, 'camera.import'))
    expect(entry.detail).toMatchObject({
      fileName: 'cameras.csv',
      imported: 4,
      assetTags: ['GATE-01', 'GATE-02', 'YARD-01', 'YARD-02'],
    })
    const feed = await tdb.db
      .select({ n: count() })
      .from(changes)
      .where(and(eq(changes.entity, 'camera')))
    expect(Number(feed[0].n)).toBeGreaterThanOrEqual(4)

    // The same file again: every tag exists now, so nothing more is imported.
    const again = await commit(fixed)
    expect(again.status).toBe(422)
    expect(again.body.error.details.errorRowCount).toBe(4)
    expect(await cameraCount()).toBe(before + 4)
  })

  it('checks again at commit time: a tag added after the preview stops the whole import', async () => {
    const csv = [
      HEADER,
      'LATE-01,North Depot,Alpha dome,detect,,,',
      'LATE-02,North Depot,Alpha dome,detect,,,',
    ].join('\n')
    expect(csvPreviewSchema.parse((await preview(csv)).body).valid).toBe(true)
    const created = await request(app)
      .post('/api/cameras')
      .set('Authorization', `Bearer ${token.admin}`)
      .send({ assetTag: 'LATE-02', siteId: 1, cameraModelId: 1, taskId: 'detect' })
    expect(created.status).toBe(201)
    const before = await cameraCount()
    const res = await commit(csv)
    expect(res.status).toBe(422)
    expect(res.body.error.details.rows[0]).toMatchObject({
      line: 3,
      errors: [{ column: 'asset_tag' }],
    })
    expect(await cameraCount()).toBe(before)
  })
})
