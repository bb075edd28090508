// Exports and printable records over HTTP: CSV of checks and measurements (filters applied,
// units in the column names, formula cells neutralised) and PDFs (acceptance record, summary).
import type { Express } from 'express'
import Papa from 'papaparse'
import request from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { CHECK_CSV_COLUMNS, MEASUREMENT_CSV_COLUMNS } from '../../shared/schemas/reports'
import { now, seedFleet } from './fleetFixture'
import type { Fleet } from './fleetFixture'
import { createUser, makeApp, signIn } from './helpers/app'
import { createTestDatabase } from './helpers/db'
import type { TestDatabase } from './helpers/db'
import { lineSegments, pdfText } from './pdfText'

let tdb: TestDatabase
let app: Express
let fleet: Fleet
const token: Record<string, string> = {}

beforeAll(async () => {
  tdb = await createTestDatabase()
  fleet = await seedFleet(tdb.db)
  app = makeApp(tdb.db, { now }).app
  for (const role of ['supervisor', 'admin', 'maintenance'] as const)
    token[role] = (await signIn(app, await createUser(tdb.db, role))).token
  token.inspector = (await signIn(app, fleet.inspector)).token
})
afterAll(() => tdb?.drop())

const get = (path: string, role = 'supervisor') =>
  request(app)
    .get(path)
    .set('Authorization', `Bearer ${token[role]}`)
    .buffer(true)
    .parse((res, cb) => {
      const chunks: Buffer[] = []
      res.on('data', (c: Buffer) => chunks.push(c))
      res.on('end', () => cb(null, Buffer.concat(chunks)))
    })

function csvRows(body: Buffer): { fields: string[]; rows: Record<string, string>[] } {
  const text = body.toString('utf8')
  expect(text.startsWith('\uFEFF')).toBe(true) // BOM: spreadsheets read the file as UTF-8
  const parsed = Papa.parse<Record<string, string>>(text.slice(1), {
    header: true,
    skipEmptyLines: true,
  })
  expect(parsed.errors).toEqual([])
  return { fields: parsed.meta.fields ?? [], rows: parsed.data }
}

describe('CSV of checks', () => {
  it('has units in its column names and one row per check in the period', async () => {
    const res = await get('/api/reports/checks.csv?from=2024-01-01')
    expect(res.status).toBe(200)
    expect(res.headers['content-type']).toBe('text/csv; charset=utf-8')
    expect(res.headers['content-disposition']).toMatch(
      /^attachment; filename="sharpfield-checks-2024-01-01-to-2025-06-15\.csv"$/,
    )
    const { fields, rows } = csvRows(res.body)
    expect(fields).toEqual([...CHECK_CSV_COLUMNS])
    for (const unit of [
      'median_mtf50_cy_px',
      'min_mtf50_cy_px',
      'pixel_density_px_per_m',
      'required_px_per_m',
    ])
      expect(fields).toContain(unit)
    // Every check since 2024, retired camera S3 included (its history is still history).
    expect(rows.map((r) => r.asset_tag)).toEqual(['S1', 'N3', 'N1', 'N1', 'S3', 'N2'])
    expect(res.headers['x-row-count']).toBe('6')
    const n1fail = rows.find((r) => r.check_id === fleet.checkIds.N1[1])!
    expect(n1fail).toMatchObject({
      verdict: 'fail',
      median_mtf50_cy_px: '0.12',
      measurement_count: '2',
      site: 'North Depot',
      inspector: 'Ida Inspector',
    })
    expect(n1fail.captured_at_utc).toBe('2025-06-01T09:00:00.000Z')
  })

  it('neutralises cells a spreadsheet would run as formulas, and keeps numbers numbers', async () => {
    const { rows } = csvRows((await get('/api/reports/checks.csv?from=2024-01-01')).body)
    const n1fail = rows.find((r) => r.check_id === fleet.checkIds.N1[1])!
    // A formula with a line break after it is still caught (the whole cell is one value).
    expect(n1fail.notes).toBe(`'=HYPERLINK("http://example.test","click")\nsecond line`)
    const n1pass = rows.find((r) => r.check_id === fleet.checkIds.N1[0])!
    expect(n1pass.target_id).toBe("'@T-7")
    const n2 = rows.find((r) => r.asset_tag === 'N2')!
    expect(n2.location).toBe("'-north mast")
    for (const r of rows) for (const v of Object.values(r)) expect(v).not.toMatch(/^[=+@\t\r]/)
  })

  it('applies the filters: site, verdict, camera, task, state and period', async () => {
    const tags = async (q: string) =>
      csvRows((await get(`/api/reports/checks.csv?${q}`)).body).rows.map((r) => r.asset_tag)
    expect(await tags(`from=2024-01-01&siteId=${fleet.siteIds.south}`)).toEqual(['S1', 'S3'])
    expect(await tags('from=2024-01-01&verdict=fail')).toEqual(['N1', 'S3'])
    expect(await tags(`from=2024-01-01&cameraId=${fleet.cameraIds.N1}`)).toEqual(['N1', 'N1'])
    expect(await tags('from=2024-01-01&taskId=identify')).toEqual(['N3'])
    expect(await tags('from=2024-01-01&state=failing')).toEqual(['N1', 'N1', 'S3'])
    expect(await tags('from=2025-05-01&to=2025-05-31')).toEqual(['N1'])
    // Nothing matches: still a file with its header line.
    const empty = csvRows((await get('/api/reports/checks.csv?from=2020-01-01&to=2020-12-31')).body)
    expect(empty.fields).toEqual([...CHECK_CSV_COLUMNS])
    expect(empty.rows).toEqual([])
  })

  it('refuses bad filters with field messages', async () => {
    const res = await request(app)
      .get('/api/reports/checks.csv?verdict=great&cameraId=x&from=13/13/2025')
      .set('Authorization', `Bearer ${token.supervisor}`)
    expect(res.status).toBe(400)
    expect(Object.keys(res.body.error.details.fields).sort()).toEqual([
      'cameraId',
      'from',
      'verdict',
    ])
  })
})

describe('CSV of measurements', () => {
  it('one row per measured edge, units in the names, negative angles stay numbers', async () => {
    const res = await get(
      `/api/reports/measurements.csv?from=2024-01-01&cameraId=${fleet.cameraIds.N1}`,
    )
    expect(res.status).toBe(200)
    const { fields, rows } = csvRows(res.body)
    expect(fields).toEqual([...MEASUREMENT_CSV_COLUMNS])
    for (const unit of [
      'mtf50_cy_px',
      'edge_angle_deg',
      'roi_width_px',
      'rise_10_90_px',
      'psf_sigma_px',
    ])
      expect(fields).toContain(unit)
    expect(rows).toHaveLength(4) // two checks × two edges
    expect(rows.map((r) => r.edge_angle_deg).sort()).toEqual(['-4.8', '-4.8', '5.2', '5.2'])
    // σ = 0.187391 / MTF50 for a Gaussian blur (DOMAIN.md); 0.187391 / 0.12 = 1.561592 (6 decimals).
    const fail = rows.filter((r) => r.check_id === fleet.checkIds.N1[1])
    expect(fail.map((r) => r.psf_sigma_px)).toEqual(['1.561592', '1.561592'])
    expect(res.headers['x-row-count']).toBe('4')
  })
})

describe('PDF records', () => {
  it('an acceptance record per check: a PDF with the camera, the result, a vector MTF chart and signature lines', async () => {
    const res = await get(`/api/reports/checks/${fleet.checkIds.N1[1]}/acceptance.pdf`)
    expect(res.status).toBe(200)
    expect(res.headers['content-type']).toBe('application/pdf')
    expect(res.headers['content-disposition']).toBe(
      'attachment; filename="sharpfield-acceptance-N1-2025-06-01.pdf"',
    )
    const pdf = res.body as Buffer
    expect(pdf.subarray(0, 5).toString('latin1')).toBe('%PDF-')
    const text = pdfText(pdf)
    for (const s of [
      'Camera acceptance record',
      'N1',
      'North Depot',
      'Main gate',
      'Recognise',
      'Ida Inspector',
      'FAIL',
      'Median MTF50 0.12 cycles/pixel.',
      'Signature (inspector)',
      fleet.checkIds.N1[1],
    ])
      expect(text).toContain(s)
    // Two curves of 26 points (25 segments each, 0 to 0.5 cycles/pixel) plus the grid: lines, not pictures.
    expect(lineSegments(pdf)).toBeGreaterThan(50)
    expect(pdf.toString('latin1')).not.toContain('/Subtype /Image')
  })

  it('the target id appears when the check recorded one', async () => {
    const text = pdfText(
      (await get(`/api/reports/checks/${fleet.checkIds.N1[0]}/acceptance.pdf`)).body,
    )
    expect(text).toContain('@T-7')
    expect(text).toContain('PASS')
  })

  it('a summary per site and period', async () => {
    const res = await get(`/api/reports/summary.pdf?siteId=${fleet.siteIds.north}&from=2025-03-17`)
    expect(res.status).toBe(200)
    expect(res.headers['content-type']).toBe('application/pdf')
    const pdf = res.body as Buffer
    expect(pdf.subarray(0, 5).toString('latin1')).toBe('%PDF-')
    const text = pdfText(pdf)
    for (const s of [
      'Camera fleet summary',
      'North Depot',
      '2025-03-17 to 2025-06-15',
      'Failing in the period',
      'Overdue for a check',
      'N3',
      'Signature (reviewed by)',
    ])
      expect(text).toContain(s)
  })

  it('unknown checks are 404 and bad ids 400, as JSON errors', async () => {
    const missing = await request(app)
      .get('/api/reports/checks/6b1c7d9e-4c59-4e0e-9d55-0a5b6e2e4f10/acceptance.pdf')
      .set('Authorization', `Bearer ${token.supervisor}`)
    expect(missing.status).toBe(404)
    expect(missing.body.error.code).toBe('check.not_found')
    const bad = await request(app)
      .get('/api/reports/checks/42/acceptance.pdf')
      .set('Authorization', `Bearer ${token.supervisor}`)
    expect(bad.status).toBe(400)
  })
})

describe('who may export', () => {
  it('supervisors and admins; not inspectors or maintenance; not without a token', async () => {
    const paths = [
      '/api/reports/checks.csv',
      '/api/reports/measurements.csv',
      '/api/reports/summary.pdf',
      `/api/reports/checks/${fleet.checkIds.N2[0]}/acceptance.pdf`,
    ]
    for (const p of paths) {
      expect((await get(p, 'supervisor')).status).toBe(200)
      expect((await get(p, 'admin')).status).toBe(200)
      expect((await get(p, 'inspector')).status).toBe(403)
      expect((await get(p, 'maintenance')).status).toBe(403)
      expect((await request(app).get(p)).status).toBe(401)
    }
  })
})
