import type { Express } from 'express'
import request from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { DEMO_PASSWORD } from '../../server/db/demo/people'
import { demoCounts, seedDemo } from '../../server/db/demo/seed'
import { cameraDetailSchema, cameraListSchema } from '../../shared/schemas/cameras'
import { cameraModelListSchema, taskListSchema } from '../../shared/schemas/catalog'
import { siteListSchema } from '../../shared/schemas/sites'
import { userListSchema } from '../../shared/schemas/users'
import { makeApp, signIn } from './helpers/app'
import { createTestDatabase } from './helpers/db'
import type { TestDatabase } from './helpers/db'

let tdb: TestDatabase
let app: Express
let token: string
const NOW = new Date('2026-03-15T12:00:00Z')

beforeAll(async () => {
  tdb = await createTestDatabase()
  const first = await seedDemo(tdb.db, { now: NOW })
  expect(first.seeded).toBe(true)
  app = makeApp(tdb.db, { now: () => NOW }).app
  token = (await signIn(app, { email: 'supervisor@sharpfield.test', password: DEMO_PASSWORD }))
    .token
})
afterAll(() => tdb?.drop())

const get = (path: string) => request(app).get(path).set('Authorization', `Bearer ${token}`)

describe('demo scenario', () => {
  it('loads only once: a second run changes nothing', async () => {
    const before = await demoCounts(tdb.db)
    const second = await seedDemo(tdb.db, { now: NOW })
    expect(second.seeded).toBe(false)
    expect(await demoCounts(tdb.db)).toEqual(before)
    expect(before.cameras).toBe(40)
    expect(before.sites).toBe(3)
    expect(before.checks).toBeGreaterThan(100)
    expect(before.measurements).toBe(before.checks * 4)
    expect(before.workOrders).toBeGreaterThanOrEqual(3)
  })

  it('every demo account signs in with the demo password', async () => {
    for (const role of ['inspector', 'supervisor', 'maintenance', 'admin']) {
      const s = await signIn(app, { email: `${role}@sharpfield.test`, password: DEMO_PASSWORD })
      expect(s.user.role).toBe(role)
    }
  })

  it('has cameras in every state a fleet view shows', async () => {
    const res = await get('/api/cameras?limit=500')
    const list = cameraListSchema.parse(res.body)
    expect(list.total).toBe(40)
    const states = new Set(list.items.map((c) => c.state))
    expect([...states].sort()).toEqual(['due', 'failing', 'in_repair', 'ok'])
    expect(list.items.every((c) => c.lastCheckAt && c.baselineCheckId)).toBe(true)
  })
})

describe('read routes on the demo data', () => {
  it('lists sites with their camera counts', async () => {
    const { items } = siteListSchema.parse((await get('/api/sites')).body)
    expect(items.map((s) => s.cameraCount).reduce((a, b) => a + b, 0)).toBe(40)
  })

  it('lists tasks with the IEC 62676-4 pixel densities', async () => {
    const { items } = taskListSchema.parse((await get('/api/tasks')).body)
    const pxPerM = Object.fromEntries(items.map((t) => [t.id, t.requiredPxPerM]))
    // IEC 62676-4:2014 levels [std]; plate reading 250 px/m is common practice [practice].
    expect(pxPerM).toMatchObject({
      observe: 62.5,
      recognise: 125,
      identify: 250,
      inspect: 1000,
      plate_reading: 250,
    })
  })

  it('lists camera models', async () => {
    const { items } = cameraModelListSchema.parse((await get('/api/camera-models')).body)
    expect(items).toHaveLength(5)
  })

  it('filters cameras by site, task, state and text, and pages them', async () => {
    const sites = siteListSchema.parse((await get('/api/sites')).body).items
    const yard = sites.find((s) => s.name === 'Fenwick Freight Yard')!
    const bySite = cameraListSchema.parse((await get(`/api/cameras?siteId=${yard.id}`)).body)
    expect(bySite.total).toBe(yard.cameraCount)
    expect(bySite.items.every((c) => c.siteName === 'Fenwick Freight Yard')).toBe(true)

    const plates = cameraListSchema.parse((await get('/api/cameras?taskId=plate_reading')).body)
    expect(
      plates.items.every((c) => c.taskId === 'plate_reading' && c.requiredPxPerM === 250),
    ).toBe(true)

    const failing = cameraListSchema.parse((await get('/api/cameras?state=failing')).body)
    expect(failing.items.every((c) => c.state === 'failing' && c.lastVerdict === 'fail')).toBe(true)

    const overdue = cameraListSchema.parse((await get('/api/cameras?overdue=true')).body)
    expect(overdue.total).toBeGreaterThan(0)
    expect(overdue.items.every((c) => c.overdue && Date.parse(c.nextDueAt!) < NOW.getTime())).toBe(
      true,
    )

    const text = cameraListSchema.parse((await get('/api/cameras?q=dock%20door')).body)
    expect(text.total).toBe(4)

    const page = cameraListSchema.parse((await get('/api/cameras?limit=10&offset=35')).body)
    expect(page.items).toHaveLength(5)
    expect(page.total).toBe(40)
  })

  it('returns one camera with its site, task and model', async () => {
    const [first] = cameraListSchema.parse((await get('/api/cameras?q=MTD-001')).body).items
    const detail = cameraDetailSchema.parse((await get(`/api/cameras/${first.id}`)).body)
    expect(detail.assetTag).toBe('MTD-001')
    expect(detail.site.name).toBe('Millbrook Tram Depot')
    expect(detail.task.id).toBe('plate_reading')
    expect(detail.model.name).toBe('Tern P8 plate camera')
  })

  it('lists users for an admin, deactivated ones included', async () => {
    const admin = await signIn(app, { email: 'admin@sharpfield.test', password: DEMO_PASSWORD })
    const res = await request(app).get('/api/users').set('Authorization', `Bearer ${admin.token}`)
    const { items } = userListSchema.parse(res.body)
    expect(items).toHaveLength(7)
    expect(items.filter((u) => !u.active).map((u) => u.email)).toEqual([
      'former.inspector@sharpfield.test',
    ])
    expect(JSON.stringify(res.body)).not.toMatch(/passwordHash|argon2/)
  })
})
