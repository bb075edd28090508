// Photos on work orders: PNG and JPEG only (by their bytes), stored and served back unchanged,
// with the same rules as every other action (assignee only, version checked).
import { encode as encodePng } from 'fast-png'
import jpeg from 'jpeg-js'
import request from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { workOrderDetailSchema } from '../../shared/schemas/workOrders'
import type { WorkOrderDetail } from '../../shared/schemas/workOrders'
import { createTestDatabase } from './helpers/db'
import type { TestDatabase } from './helpers/db'
import { api, buildWorld } from './helpers/workOrderWorld'
import type { Person, World } from './helpers/workOrderWorld'

let tdb: TestDatabase
let w: World
let order: WorkOrderDetail

const png = Buffer.from(
  encodePng({ width: 3, height: 2, data: new Uint8Array(3 * 2 * 3).fill(200), channels: 3 }),
)
const jpg = Buffer.from(
  jpeg.encode({ width: 5, height: 4, data: Buffer.alloc(5 * 4 * 4, 128) }, 80).data,
)

function upload(who: Person, id: number, file: Buffer, name: string, version: number, note?: string) {
  let r = request(w.app)
    .post(`/api/work-orders/${id}/photos`)
    .set('Authorization', `Bearer ${w.token[who]}`)
    .field('version', String(version))
  if (note) r = r.field('note', note)
  return r.attach('photo', file, name)
}

beforeAll(async () => {
  tdb = await createTestDatabase()
  w = await buildWorld(tdb.db)
  const opened = await api(w, 'supervisor').post('/api/work-orders', { cameraId: w.cameraIds[0] })
  const assigned = await api(w, 'supervisor').act(opened.body.id, {
    action: 'assign',
    version: opened.body.version,
    assigneeId: w.users.maint1.id,
  })
  order = workOrderDetailSchema.parse(assigned.body)
})
afterAll(() => tdb?.drop())

describe('work-order photos', () => {
  it('the assignee attaches a PNG and a JPEG; both come back byte for byte with their size', async () => {
    let res = await upload('maint1', order.id, png, 'housing.png', order.version, 'Before: condensation inside')
    expect(res.status, JSON.stringify(res.body)).toBe(201)
    order = workOrderDetailSchema.parse(res.body)
    res = await upload('maint1', order.id, jpg, 'after.jpg', order.version)
    expect(res.status).toBe(201)
    order = workOrderDetailSchema.parse(res.body)
    expect(order.photos.map((p) => [p.mime, p.width, p.height, p.bytes])).toEqual([
      ['image/png', 3, 2, png.length],
      ['image/jpeg', 5, 4, jpg.length],
    ])
    const entries = order.history.filter((h) => h.action === 'photo')
    expect(entries.map((h) => h.photoId)).toEqual(order.photos.map((p) => p.id))
    expect(entries[0].note).toBe('Before: condensation inside')

    for (const [photo, bytes] of [
      [order.photos[0], png],
      [order.photos[1], jpg],
    ] as const) {
      const got = await api(w, 'supervisor')
        .get(`/api/work-orders/${order.id}/photos/${photo.id}`)
        .buffer(true)
        .parse((r, cb) => {
          const parts: Buffer[] = []
          r.on('data', (c: Buffer) => parts.push(c))
          r.on('end', () => cb(null, Buffer.concat(parts)))
        })
      expect(got.status).toBe(200)
      expect(got.headers['content-type']).toBe(photo.mime)
      expect(Buffer.compare(got.body as Buffer, bytes)).toBe(0)
    }
  })

  it('refuses what is not PNG or JPEG, whatever its name says, and changes nothing', async () => {
    const gif = Buffer.from('GIF89a\x01\x00\x01\x00\x00\x00\x00;', 'latin1')
    for (const [bytes, name] of [
      [gif, 'photo.png'],
      [Buffer.from('not an image at all'), 'photo.jpg'],
      [png.subarray(0, 20), 'cut.png'],
    ] as const) {
      const res = await upload('maint1', order.id, bytes, name, order.version)
      expect(res.status).toBe(400)
      expect(res.body.error.code).toBe('work_order.bad_photo')
    }
    const res = await request(w.app)
      .post(`/api/work-orders/${order.id}/photos`)
      .set('Authorization', `Bearer ${w.token.maint1}`)
      .field('version', String(order.version))
    expect(res.status).toBe(400)
    expect(res.body.error.message).toContain('"photo"')
    const now = workOrderDetailSchema.parse((await api(w, 'maint1').get(`/api/work-orders/${order.id}`)).body)
    expect(now.version).toBe(order.version)
    expect(now.photos.length).toBe(2)
  })

  it('another maintenance user may neither attach nor see the photos; a stale version is a 409', async () => {
    expect((await upload('maint2', order.id, png, 'x.png', order.version)).status).toBe(403)
    expect((await api(w, 'maint2').get(`/api/work-orders/${order.id}/photos/${order.photos[0].id}`)).status).toBe(403)
    const stale = await upload('maint1', order.id, png, 'x.png', order.version - 1)
    expect(stale.status).toBe(409)
    expect(stale.body.error.code).toBe('work_order.stale')
  })
})
