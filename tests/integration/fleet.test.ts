// The fleet overview over HTTP against a known history (fleetFixture.ts): counts for a period,
// the camera table with server-side paging, a camera's history, a check with its curves, the
// chart series, and who may read them.
import { randomUUID } from 'node:crypto'
import type { Express } from 'express'
import request from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { fleetSummary } from '../../server/services/fleet/summary'
import { mtfDistribution, passRateTrend } from '../../server/services/fleet/trends'
import {
  cameraHistorySchema,
  checkDetailSchema,
  fleetCameraPageSchema,
  fleetSummarySchema,
  mtfDistributionSchema,
  passRateTrendSchema,
} from '../../shared/schemas/fleet'
import { FIXTURE, NOW, now, seedFleet } from './fleetFixture'
import type { Fleet } from './fleetFixture'
import { createUser, makeApp, signIn } from './helpers/app'
import { createTestDatabase } from './helpers/db'
import type { TestDatabase } from './helpers/db'

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
  request(app).get(path).set('Authorization', `Bearer ${token[role]}`)

describe('fleet counts', () => {
  it('count each camera by its latest check in the last 90 days, and overdue as of now', async () => {
    const res = await get('/api/fleet/summary')
    expect(res.status).toBe(200)
    const s = fleetSummarySchema.parse(res.body)
    expect(s.period).toEqual({ from: '2025-03-17T12:00:00.000Z', to: NOW.toISOString() })
    // 5 active cameras (S3 is retired); N1 (fail), N2 (pass), N3 (marginal) checked; N3 and S1 overdue.
    expect(s.overall).toEqual({
      cameras: 5,
      checked: 3,
      passed: 1,
      marginal: 1,
      failing: 1,
      passRate: 1 / 3,
      overdue: 2,
    })
    expect(
      s.bySite.map((x) => [x.siteName, x.cameras, x.checked, x.failing, x.overdue, x.passRate]),
    ).toEqual([
      ['North Depot', 3, 3, 1, 1, 1 / 3],
      ['South Yard', 2, 0, 0, 1, null],
    ])
    const byTask = Object.fromEntries(s.byTask.map((t) => [t.taskId, t]))
    expect(Object.keys(byTask).sort()).toEqual(['detect', 'identify', 'recognise'])
    expect(byTask.recognise).toMatchObject({
      cameras: 2,
      checked: 2,
      passed: 1,
      failing: 1,
      overdue: 0,
    })
    expect(byTask.identify).toMatchObject({ cameras: 1, checked: 1, marginal: 1, overdue: 1 })
    expect(byTask.detect).toMatchObject({ cameras: 2, checked: 0, overdue: 1, passRate: null })
  })

  it('use the latest check inside a past period, not the camera’s newest check', async () => {
    // May 2025: N1 passed on 1 May; its failing check of 1 June is after the period.
    const s = fleetSummarySchema.parse(
      (await get('/api/fleet/summary?from=2025-05-01&to=2025-05-31')).body,
    )
    expect(s.period).toEqual({ from: '2025-05-01T00:00:00.000Z', to: '2025-06-01T00:00:00.000Z' })
    expect(s.overall).toMatchObject({ cameras: 5, checked: 1, passed: 1, failing: 0, passRate: 1 })
  })

  it('give the same answer from the camera rows and from the check history for a period reaching now', async () => {
    const f = { siteId: undefined, from: '2025-01-01' }
    const fromRows = await fleetSummary(tdb.db, f, NOW, 'latest')
    const fromHistory = await fleetSummary(tdb.db, f, NOW, 'history')
    expect(fromHistory).toEqual(fromRows)
    expect(fromRows.overall.checked).toBe(3)
  })

  it('narrow the counts by site, task and model', async () => {
    const bySite = fleetSummarySchema.parse(
      (await get(`/api/fleet/summary?siteId=${fleet.siteIds.south}`)).body,
    )
    expect(bySite.overall).toMatchObject({ cameras: 2, checked: 0, overdue: 1 })
    expect(bySite.bySite.map((x) => x.siteName)).toEqual(['South Yard'])
    const byModel = fleetSummarySchema.parse(
      (await get(`/api/fleet/summary?cameraModelId=${fleet.modelIds.bravo}`)).body,
    )
    expect(byModel.overall).toMatchObject({ cameras: 2, checked: 1, marginal: 1, overdue: 2 })
    const byTask = fleetSummarySchema.parse((await get('/api/fleet/summary?taskId=recognise')).body)
    expect(byTask.overall).toMatchObject({ cameras: 2, checked: 2, passed: 1, failing: 1 })
  })

  it('refuse a period that ends before it starts, too long a period, and wrong types', async () => {
    const back = await get('/api/fleet/summary?from=2025-06-01&to=2025-05-01')
    expect(back.status).toBe(400)
    expect(back.body.error).toMatchObject({
      code: 'fleet.bad_period',
      message: 'The period must start before it ends.',
    })
    expect((await get('/api/fleet/summary?from=2010-01-01')).status).toBe(400)
    const bad = await get('/api/fleet/summary?siteId=north&from=yesterday')
    expect(bad.status).toBe(400)
    expect(Object.keys(bad.body.error.details.fields).sort()).toEqual(['from', 'siteId'])
  })
})

describe('the camera table', () => {
  it('sorts, filters and pages on the server', async () => {
    const page = fleetCameraPageSchema.parse(
      (await get('/api/fleet/cameras?sort=lastMtf50CyPx&order=desc&limit=2')).body,
    )
    expect(page.total).toBe(5)
    // Nulls sort lowest: S2 (never checked) comes last in descending order.
    expect(page.items.map((c) => c.assetTag)).toEqual(['N2', 'S1']) // 0.31, 0.28
    const next = fleetCameraPageSchema.parse(
      (await get('/api/fleet/cameras?sort=lastMtf50CyPx&order=desc&limit=2&offset=2')).body,
    )
    expect(next.items.map((c) => c.assetTag)).toEqual(['N3', 'N1']) // 0.19, 0.12
    const last = fleetCameraPageSchema.parse(
      (await get('/api/fleet/cameras?sort=lastMtf50CyPx&order=desc&limit=2&offset=4')).body,
    )
    expect(last.items.map((c) => c.assetTag)).toEqual(['S2'])
  })

  it('filters by state, overdue, site, task, model and text; retired cameras only on request', async () => {
    const tags = async (q: string) =>
      fleetCameraPageSchema
        .parse((await get(`/api/fleet/cameras?${q}`)).body)
        .items.map((c) => c.assetTag)
    expect(await tags('state=failing')).toEqual(['N1'])
    expect(await tags('state=failing&includeRetired=true')).toEqual(['N1', 'S3'])
    expect(await tags('overdue=true')).toEqual(['N3', 'S1'])
    expect(await tags('overdue=false')).toEqual(['N1', 'N2', 'S2'])
    expect(await tags(`siteId=${fleet.siteIds.south}`)).toEqual(['S1', 'S2'])
    expect(await tags('taskId=recognise&sort=lastCheckAt&order=desc')).toEqual(['N2', 'N1'])
    expect(await tags(`cameraModelId=${fleet.modelIds.bravo}`)).toEqual(['N3', 'S1'])
    expect(await tags('q=mast')).toEqual(['N2'])
    expect(await tags('lastVerdict=marginal')).toEqual(['N3'])
    expect(await tags('sort=site&order=desc')).toEqual(['S2', 'S1', 'N3', 'N2', 'N1'])
  })

  it('gives each row its effective threshold and overdue flag', async () => {
    const page = fleetCameraPageSchema.parse((await get('/api/fleet/cameras?q=N3')).body)
    expect(page.items[0]).toMatchObject({
      assetTag: 'N3',
      taskId: 'identify',
      overdue: true,
      lastVerdict: 'marginal',
      siteName: 'North Depot',
      cameraModelName: 'Bravo bullet',
    })
    expect(page.items[0].minMtf50CyPx).toBeGreaterThan(0)
  })

  it('refuses unknown sorts, huge pages and wrong types with field messages', async () => {
    const res = await get('/api/fleet/cameras?sort=password&limit=5000&state=broken&overdue=maybe')
    expect(res.status).toBe(400)
    expect(Object.keys(res.body.error.details.fields).sort()).toEqual([
      'limit',
      'overdue',
      'sort',
      'state',
    ])
  })
})

describe('a camera and its checks', () => {
  it('the history lists checks newest first with threshold and baseline', async () => {
    const res = await get(`/api/fleet/cameras/${fleet.cameraIds.N1}/history`)
    expect(res.status).toBe(200)
    const h = cameraHistorySchema.parse(res.body)
    expect(h.camera.assetTag).toBe('N1')
    expect(h.checks.map((c) => [c.verdict, c.medianMtf50CyPx])).toEqual([
      ['fail', 0.12],
      ['pass', 0.305],
    ])
    expect(h.checks[0].inspectorName).toBe('Ida Inspector')
    expect(h.baseline).toBeNull()
    expect(h.truncated).toBe(false)
    const one = cameraHistorySchema.parse(
      (await get(`/api/fleet/cameras/${fleet.cameraIds.N1}/history?limit=1`)).body,
    )
    expect(one.checks).toHaveLength(1)
    expect(one.truncated).toBe(true)
  })

  it('a check carries its reasons and every edge’s MTF curve', async () => {
    const id = fleet.checkIds.N1[1]
    const res = await get(`/api/fleet/checks/${id}`)
    expect(res.status).toBe(200)
    const c = checkDetailSchema.parse(res.body)
    expect(c).toMatchObject({ id, verdict: 'fail', medianMtf50CyPx: 0.12, mode: 'day' })
    expect(c.camera).toMatchObject({
      assetTag: 'N1',
      siteName: 'North Depot',
      siteTimeZone: 'Europe/London',
    })
    expect(c.measurements).toHaveLength(2)
    // The stored curve crosses 0.5 at the MTF50 it was made for: exp(-2π²σ²f²) = 0.5 at
    // f = 0.187391/σ (DOMAIN.md, Gaussian MTF50·σ).
    const curve = c.measurements[0].mtfCurve
    const i = curve.findIndex(([, m]) => m < 0.5)
    const [f0, m0] = curve[i - 1]
    const [f1, m1] = curve[i]
    const crossing = f0 + ((m0 - 0.5) / (m0 - m1)) * (f1 - f0)
    expect(crossing).toBeCloseTo(0.12, 2)
  })

  it('unknown cameras and checks are 404; a malformed check id is 400', async () => {
    expect((await get('/api/fleet/cameras/999999/history')).status).toBe(404)
    expect((await get('/api/fleet/checks/6b1c7d9e-4c59-4e0e-9d55-0a5b6e2e4f10')).status).toBe(404)
    expect((await get('/api/fleet/checks/not-a-uuid')).status).toBe(400)
  })
})

describe('chart series', () => {
  it('pass rate per ISO week (Monday start, UTC), overall and by site, retired cameras’ checks included', async () => {
    const res = await get('/api/fleet/trends/pass-rate')
    expect(res.status).toBe(200)
    const t = passRateTrendSchema.parse(res.body)
    expect(t.weeks[0]).toBe('2025-03-17') // the period starts on Monday 17 March
    expect(t.weeks.at(-1)).toBe('2025-06-09')
    const nonEmpty = t.overall.filter((p) => p.checks > 0).map((p) => [p.week, p.checks, p.passed])
    // N3 1 Apr (Tue), N1 1 May (Thu), N1 1 Jun (a Sunday: still the week of 26 May),
    // S3 5 Jun (retired since, but checked then), N2 10 Jun.
    expect(nonEmpty).toEqual([
      ['2025-03-31', 1, 0],
      ['2025-04-28', 1, 1],
      ['2025-05-26', 1, 0],
      ['2025-06-02', 1, 0],
      ['2025-06-09', 1, 1],
    ])
    // Lowest pass rate first.
    expect(t.sites.map((s) => [s.siteName, s.checks, s.passRate])).toEqual([
      ['South Yard', 1, 0],
      ['North Depot', 4, 0.5],
    ])
    const one = passRateTrendSchema.parse((await get('/api/fleet/trends/pass-rate?sites=1')).body)
    expect(one.sites.map((s) => s.siteName)).toEqual(['South Yard'])
    expect(one.sitesLeftOut).toBe(1)
  })

  it('MTF50 distribution by camera model in 0.025 cycles/pixel bins', async () => {
    const d = mtfDistributionSchema.parse((await get('/api/fleet/distribution/mtf50')).body)
    expect(d.binWidthCyPx).toBe(0.025)
    const byName = Object.fromEntries(d.models.map((m) => [m.name, m]))
    // Alpha: 0.305 and 0.31 fall in bin 12 (0.300–0.325), 0.12 and 0.10 in bin 4; Bravo: 0.19 in bin 7.
    expect(byName['Alpha dome'].total).toBe(4)
    expect(byName['Alpha dome'].counts[12]).toBe(2)
    expect(byName['Alpha dome'].counts[4]).toBe(2)
    expect(byName['Bravo bullet'].counts[7]).toBe(1)
    expect(byName['Bravo bullet'].total).toBe(1)
  })

  it('the weekly aggregates give the same series as counting the checks, with and without filters', async () => {
    for (const f of [{}, { siteId: fleet.siteIds.north }, { from: '2024-06-01' }]) {
      const q = { sites: 8, ...f }
      expect(await passRateTrend(tdb.db, q, NOW, 'aggregates')).toEqual(
        await passRateTrend(tdb.db, q, NOW, 'checks'),
      )
    }
    for (const f of [{}, { cameraModelId: fleet.modelIds.alpha }, { from: '2024-06-01' }]) {
      expect(await mtfDistribution(tdb.db, f, NOW, 'aggregates')).toEqual(
        await mtfDistribution(tdb.db, f, NOW, 'checks'),
      )
    }
  })

  it('a check recorded through sync is added to the weekly aggregates at once', async () => {
    const before = passRateTrendSchema.parse((await get('/api/fleet/trends/pass-rate')).body)
    const week = (t: typeof before) => t.overall.find((p) => p.week === '2025-06-09')!
    expect(week(before)).toMatchObject({ checks: 1, passed: 1 })
    const checkId = randomUUID()
    const push = await request(app)
      .post('/api/sync/push')
      .set('Authorization', `Bearer ${token.inspector}`)
      .send({
        deviceId: 'fleet-test-device',
        ops: [
          {
            id: randomUUID(),
            kind: 'check.create',
            payload: {
              id: checkId,
              cameraId: fleet.cameraIds.S1,
              capturedAt: '2025-06-14T10:00:00.000Z',
              mode: 'day',
              verdict: 'marginal',
              reasons: [{ code: 'sharpness', text: 'Median MTF50 0.140 cycles/pixel.' }],
              medianMtf50CyPx: 0.14,
              measurements: [],
            },
          },
        ],
      })
    expect(push.status).toBe(200)
    expect(push.body.results[0].status).toBe('applied')
    const after = passRateTrendSchema.parse((await get('/api/fleet/trends/pass-rate')).body)
    expect(week(after)).toMatchObject({ checks: 2, passed: 1 })
    const d = mtfDistributionSchema.parse((await get('/api/fleet/distribution/mtf50')).body)
    expect(d.models.find((m) => m.name === 'Bravo bullet')!.counts[5]).toBe(1) // 0.14 / 0.025 = 5.6
    expect(await passRateTrend(tdb.db, { sites: 8 }, NOW, 'aggregates')).toEqual(
      await passRateTrend(tdb.db, { sites: 8 }, NOW, 'checks'),
    )
  })
})

describe('who may read the fleet', () => {
  const paths = [
    '/api/fleet/summary',
    '/api/fleet/cameras',
    '/api/fleet/trends/pass-rate',
    '/api/fleet/distribution/mtf50',
  ]
  it('supervisors and admins may; inspectors and maintenance may not; no token is 401', async () => {
    for (const p of paths) {
      expect((await get(p, 'supervisor')).status).toBe(200)
      expect((await get(p, 'admin')).status).toBe(200)
      expect((await get(p, 'inspector')).status).toBe(403)
      expect((await get(p, 'maintenance')).status).toBe(403)
      expect((await request(app).get(p)).status).toBe(401)
    }
    expect(
      (await get(`/api/fleet/cameras/${fleet.cameraIds.N1}/history`, 'inspector')).status,
    ).toBe(403)
    expect(FIXTURE.length).toBe(6)
  })
})
