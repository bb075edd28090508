// Setup over HTTP: users, sites, camera models, task thresholds and cameras — validated with
// the shared schemas, refused for the wrong roles, and every change written to the audit log.
import { and, desc, eq } from 'drizzle-orm'
import type { Express } from 'express'
import request from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { auditLog, changes, users } from '../../server/db/schema'
import { auditPageSchema } from '../../shared/schemas/setup'
import { now, seedFleet } from './fleetFixture'
import type { Fleet } from './fleetFixture'
import { createUser, makeApp, signIn } from './helpers/app'
import type { TestUser } from './helpers/app'
import { createTestDatabase } from './helpers/db'
import type { TestDatabase } from './helpers/db'

let tdb: TestDatabase
let app: Express
let fleet: Fleet
let admin: TestUser
const token: Record<string, string> = {}

beforeAll(async () => {
  tdb = await createTestDatabase()
  fleet = await seedFleet(tdb.db)
  app = makeApp(tdb.db, { now }).app
  admin = await createUser(tdb.db, 'admin', { name: 'Ada Admin' })
  token.admin = (await signIn(app, admin)).token
  for (const role of ['supervisor', 'maintenance'] as const)
    token[role] = (await signIn(app, await createUser(tdb.db, role))).token
  token.inspector = (await signIn(app, fleet.inspector)).token
})
afterAll(() => tdb?.drop())

const as = (role: string) => {
  const auth = (r: request.Test) => r.set('Authorization', `Bearer ${token[role]}`)
  return {
    get: (p: string) => auth(request(app).get(p)),
    post: (p: string, body: unknown) => auth(request(app).post(p)).send(body as object),
    patch: (p: string, body: unknown) => auth(request(app).patch(p)).send(body as object),
    put: (p: string, body: unknown) => auth(request(app).put(p)).send(body as object),
  }
}

async function lastAudit(entity: string, entityId: string | number) {
  const [row] = await tdb.db
    .select()
    .from(auditLog)
    .where(and(eq(auditLog.entity, entity), eq(auditLog.entityId, String(entityId))))
    .orderBy(desc(auditLog.id))
    .limit(1)
  return row
}

const fieldsOf = (res: request.Response) =>
  Object.keys(res.body.error?.details?.fields ?? {}).sort()

describe('users', () => {
  let userId: number
  const password = 'a-long-first-password'

  it('an admin creates a user who can then sign in; the audit log has no password', async () => {
    const res = await as('admin').post('/api/users', {
      email: ' New.Person@Sharpfield.TEST ',
      name: 'New Person',
      role: 'inspector',
      password,
    })
    expect(res.status).toBe(201)
    expect(res.body).toMatchObject({
      email: 'new.person@sharpfield.test',
      role: 'inspector',
      active: true,
    })
    expect(res.body).not.toHaveProperty('passwordHash')
    userId = res.body.id
    await signIn(app, { email: 'new.person@sharpfield.test', password })
    const entry = await lastAudit('user', userId)
    expect(entry).toMatchObject({ action: 'user.create', actorId: admin.id })
    expect(JSON.stringify(entry.detail)).not.toContain(password)
    expect(JSON.stringify(entry.detail)).not.toContain('argon2')
  })

  it('refuses a taken e-mail (409 on the field) and invalid fields (400, every field named)', async () => {
    const dup = await as('admin').post('/api/users', {
      email: 'new.person@sharpfield.test',
      name: 'X',
      role: 'inspector',
      password,
    })
    expect(dup.status).toBe(409)
    expect(fieldsOf(dup)).toEqual(['email'])
    const bad = await as('admin').post('/api/users', {
      email: 'not-an-email',
      name: '',
      role: 'boss',
      password: 'short',
    })
    expect(bad.status).toBe(400)
    expect(fieldsOf(bad)).toEqual(['email', 'name', 'password', 'role'])
    expect(bad.body.error.details.fields.password).toEqual(['At least 12 characters.'])
  })

  it('a role change ends the user’s sessions and is audited with before and after', async () => {
    const session = await signIn(app, { email: 'new.person@sharpfield.test', password })
    const res = await as('admin').patch(`/api/users/${userId}`, { role: 'supervisor' })
    expect(res.status).toBe(200)
    expect(res.body.role).toBe('supervisor')
    const refresh = await request(app)
      .post('/api/auth/refresh')
      .send({ refreshToken: session.refreshToken })
    expect(refresh.status).toBe(401)
    expect((await lastAudit('user', userId)).detail).toEqual({
      before: { role: 'inspector' },
      after: { role: 'supervisor' },
    })
    expect((await lastAudit('user', userId)).action).toBe('user.role_change')
  })

  it('a new password works, the old one does not, and the log records only that it was set', async () => {
    const newPassword = 'another-long-password-2'
    const res = await as('admin').post(`/api/users/${userId}/password`, { password: newPassword })
    expect(res.status).toBe(200)
    const old = await request(app)
      .post('/api/auth/login')
      .send({ email: 'new.person@sharpfield.test', password })
    expect(old.status).toBe(401)
    await signIn(app, { email: 'new.person@sharpfield.test', password: newPassword })
    const entry = await lastAudit('user', userId)
    expect(entry.action).toBe('user.password_reset')
    expect(JSON.stringify(entry.detail)).not.toContain(newPassword)
    expect(
      (await as('admin').post(`/api/users/${userId}/password`, { password: 'short' })).status,
    ).toBe(400)
  })

  it('a switched-off user cannot sign in; an admin cannot switch off or demote themself', async () => {
    const off = await as('admin').patch(`/api/users/${userId}`, { active: false })
    expect(off.status).toBe(200)
    expect((await lastAudit('user', userId)).action).toBe('user.deactivate')
    const login = await request(app)
      .post('/api/auth/login')
      .send({ email: 'new.person@sharpfield.test', password: 'another-long-password-2' })
    expect(login.status).not.toBe(200)
    const self = await as('admin').patch(`/api/users/${admin.id}`, { active: false })
    expect(self.status).toBe(403)
    expect((await as('admin').patch(`/api/users/${admin.id}`, { role: 'inspector' })).status).toBe(
      403,
    )
    const [me] = await tdb.db.select().from(users).where(eq(users.id, admin.id))
    expect(me).toMatchObject({ active: true, role: 'admin' })
    expect((await as('admin').patch(`/api/users/${userId}`, {})).status).toBe(400)
    expect((await as('admin').patch('/api/users/999999', { name: 'Nobody' })).status).toBe(404)
  })

  it('only admins manage users', async () => {
    for (const role of ['supervisor', 'inspector', 'maintenance']) {
      expect(
        (
          await as(role).post('/api/users', {
            email: 'x@y.test',
            name: 'X',
            role: 'admin',
            password,
          })
        ).status,
      ).toBe(403)
      expect((await as(role).patch(`/api/users/${userId}`, { role: 'admin' })).status).toBe(403)
      expect((await as(role).post(`/api/users/${userId}/password`, { password })).status).toBe(403)
    }
  })
})

describe('sites and camera models', () => {
  it('creates and changes a site; the change feed and audit log record it', async () => {
    const res = await as('admin').post('/api/sites', {
      name: 'East Works',
      address: '9 Quay',
      timeZone: 'Europe/Amsterdam',
    })
    expect(res.status).toBe(201)
    const id = res.body.id
    const upd = await as('admin').patch(`/api/sites/${id}`, { address: '10 Quay' })
    expect(upd.status).toBe(200)
    expect(upd.body).toMatchObject({ name: 'East Works', address: '10 Quay', cameraCount: 0 })
    expect((await lastAudit('site', id)).detail).toEqual({
      before: { address: '9 Quay' },
      after: { address: '10 Quay' },
    })
    const feed = await tdb.db
      .select()
      .from(changes)
      .where(and(eq(changes.entity, 'site'), eq(changes.entityId, String(id))))
    expect(feed).toHaveLength(2)
  })

  it('refuses a taken name, an unknown time zone and wrong types', async () => {
    const dup = await as('admin').post('/api/sites', { name: 'North Depot' })
    expect(dup.status).toBe(409)
    expect(fieldsOf(dup)).toEqual(['name'])
    const tz = await as('admin').post('/api/sites', { name: 'Nowhere', timeZone: 'Mars/Olympus' })
    expect(tz.status).toBe(400)
    expect(tz.body.error.details.fields.timeZone[0]).toMatch(/time zone/)
    expect(fieldsOf(await as('admin').post('/api/sites', { name: 42, address: [] }))).toEqual([
      'address',
      'name',
    ])
  })

  it('camera models: created, replaced, and a longest focal length below the shortest refused', async () => {
    const model = {
      name: 'Charlie box',
      sensorWidthPx: 2592,
      sensorHeightPx: 1944,
      pixelPitchUm: 2,
      focalLengthMinMm: 4,
      focalLengthMaxMm: 4,
      fNumber: 1.8,
    }
    const res = await as('admin').post('/api/camera-models', model)
    expect(res.status).toBe(201)
    const upd = await as('admin').put(`/api/camera-models/${res.body.id}`, { ...model, fNumber: 2 })
    expect(upd.status).toBe(200)
    expect(upd.body.fNumber).toBe(2)
    expect((await lastAudit('camera_model', res.body.id)).detail).toEqual({
      before: { fNumber: 1.8 },
      after: { fNumber: 2 },
    })
    const bad = await as('admin').post('/api/camera-models', {
      ...model,
      name: 'Delta',
      sensorWidthPx: 12.5,
      pixelPitchUm: 'small',
    })
    expect(bad.status).toBe(400)
    expect(fieldsOf(bad)).toEqual(['pixelPitchUm', 'sensorWidthPx'])
    const lens = await as('admin').post('/api/camera-models', {
      ...model,
      name: 'Delta',
      focalLengthMaxMm: 2,
    })
    expect(lens.body.error.details.fields).toEqual({
      focalLengthMaxMm: ['The longest focal length cannot be shorter than the shortest.'],
    })
  })

  it('only admins', async () => {
    expect((await as('supervisor').post('/api/sites', { name: 'S' })).status).toBe(403)
    expect((await as('supervisor').post('/api/camera-models', {})).status).toBe(403)
    expect(
      (await as('inspector').patch(`/api/sites/${fleet.siteIds.north}`, { name: 'S' })).status,
    ).toBe(403)
  })
})

describe('task thresholds', () => {
  it('a supervisor changes a task’s thresholds; the version moves on and a stale one is refused', async () => {
    const tasks = (await as('supervisor').get('/api/tasks')).body.items as {
      id: string
      version: number
      minMtf50CyPx: number
    }[]
    const t = tasks.find((x) => x.id === 'recognise')!
    const res = await as('supervisor').patch('/api/tasks/recognise', {
      minMtf50CyPx: 0.22,
      version: t.version,
    })
    expect(res.status).toBe(200)
    expect(res.body).toMatchObject({ minMtf50CyPx: 0.22, version: t.version + 1 })
    const entry = await lastAudit('task', 'recognise')
    expect(entry.detail).toEqual({
      before: { minMtf50CyPx: t.minMtf50CyPx },
      after: { minMtf50CyPx: 0.22 },
    })
    const stale = await as('admin').patch('/api/tasks/recognise', {
      minMtf50CyPx: 0.3,
      version: t.version,
    })
    expect(stale.status).toBe(409)
    expect(stale.body.error.code).toBe('setup.stale')
  })

  it('refuses thresholds out of range and a failure ratio above the warning ratio', async () => {
    const bad = await as('supervisor').patch('/api/tasks/recognise', {
      minMtf50CyPx: 2,
      marginalBand: -1,
      checkIntervalDays: 1.5,
    })
    expect(fieldsOf(bad)).toEqual(['checkIntervalDays', 'marginalBand', 'minMtf50CyPx'])
    const ratio = await as('supervisor').patch('/api/tasks/recognise', { driftFailRatio: 0.9 })
    expect(ratio.status).toBe(400)
    expect(fieldsOf(ratio)).toEqual(['driftFailRatio'])
    expect(
      (await as('supervisor').patch('/api/tasks/no-such-task', { minMtf50CyPx: 0.2 })).status,
    ).toBe(404)
    expect(
      (await as('inspector').patch('/api/tasks/recognise', { minMtf50CyPx: 0.2 })).status,
    ).toBe(403)
    expect(
      (await as('maintenance').patch('/api/tasks/recognise', { minMtf50CyPx: 0.2 })).status,
    ).toBe(403)
  })
})

describe('cameras', () => {
  const camera = () => ({
    assetTag: 'E-100',
    siteId: fleet.siteIds.north,
    cameraModelId: fleet.modelIds.alpha,
    taskId: 'observe',
    locationText: 'Bay 1',
  })

  it('an admin adds a camera, changes it and retires it; each step audited', async () => {
    const res = await as('admin').post('/api/cameras', camera())
    expect(res.status).toBe(201)
    expect(res.body).toMatchObject({
      assetTag: 'E-100',
      siteName: 'North Depot',
      taskId: 'observe',
      state: 'due',
      active: true,
      version: 1,
    })
    const id = res.body.id
    const moved = await as('admin').patch(`/api/cameras/${id}`, {
      siteId: fleet.siteIds.south,
      minMtf50CyPx: 0.2,
      version: 1,
    })
    expect(moved.status).toBe(200)
    expect(moved.body).toMatchObject({ siteName: 'South Yard', minMtf50CyPx: 0.2, version: 2 })
    expect((await lastAudit('camera', id)).detail).toEqual({
      before: { siteId: fleet.siteIds.north, minMtf50CyPx: null },
      after: { siteId: fleet.siteIds.south, minMtf50CyPx: 0.2 },
    })
    const retire = await as('admin').patch(`/api/cameras/${id}`, { active: false })
    expect(retire.status).toBe(200)
    expect((await lastAudit('camera', id)).action).toBe('camera.retire')
    const stale = await as('admin').patch(`/api/cameras/${id}`, {
      locationText: 'Bay 2',
      version: 1,
    })
    expect(stale.status).toBe(409)
  })

  it('refuses a taken asset tag, unknown references and bad values, naming the fields', async () => {
    const dup = await as('admin').post('/api/cameras', { ...camera(), assetTag: 'N1' })
    expect(dup.status).toBe(409)
    expect(fieldsOf(dup)).toEqual(['assetTag'])
    expect(
      fieldsOf(
        await as('admin').post('/api/cameras', { ...camera(), assetTag: 'E-101', siteId: 999999 }),
      ),
    ).toEqual(['siteId'])
    expect(
      fieldsOf(
        await as('admin').post('/api/cameras', {
          ...camera(),
          assetTag: 'E-102',
          taskId: 'juggle',
        }),
      ),
    ).toEqual(['taskId'])
    const bad = await as('admin').post('/api/cameras', {
      ...camera(),
      assetTag: '=cmd()',
      minMtf50CyPx: 3,
      checkIntervalDays: 0,
    })
    expect(fieldsOf(bad)).toEqual(['assetTag', 'checkIntervalDays', 'minMtf50CyPx'])
  })

  it('only admins edit the inventory', async () => {
    expect((await as('supervisor').post('/api/cameras', camera())).status).toBe(403)
    expect(
      (await as('supervisor').patch(`/api/cameras/${fleet.cameraIds.N1}`, { locationText: 'x' }))
        .status,
    ).toBe(403)
  })
})

describe('the audit log', () => {
  it('admins read it newest first, paged and filtered; nobody else may', async () => {
    const page = auditPageSchema.parse((await as('admin').get('/api/audit-log?limit=3')).body)
    expect(page.items).toHaveLength(3)
    expect(page.total).toBeGreaterThan(10)
    expect(page.items[0].id).toBeGreaterThan(page.items[1].id)
    expect(page.items[0].actorName).toBe('Ada Admin')
    const next = auditPageSchema.parse(
      (await as('admin').get('/api/audit-log?limit=3&offset=3')).body,
    )
    expect(next.items[0].id).toBeLessThan(page.items[2].id)
    const tasks = auditPageSchema.parse((await as('admin').get('/api/audit-log?entity=task')).body)
    expect(tasks.items.every((e) => e.entity === 'task')).toBe(true)
    expect(tasks.items[0].actorName).not.toBe('Ada Admin') // a supervisor changed the threshold
    expect((await as('supervisor').get('/api/audit-log')).status).toBe(403)
    expect((await as('admin').get('/api/audit-log?limit=0')).status).toBe(400)
  })
})
