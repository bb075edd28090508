import request from 'supertest'
import { describe, expect, it } from 'vitest'
import { cameraDetailSchema, cameraListSchema } from '../../shared/schemas/cameras'
import { pullResponseSchema } from '../../shared/schemas/sync'
import { checkPayload, op } from './helpers/fleet'
import { push, statuses, useSyncSession, type Who } from './helpers/syncSession'

// GET /api/cameras against the real database: the list a device refreshes its offline copy from
// carries each camera's baseline MTF50, the same record a sync pull brings, so a refresh over
// REST never leaves the device without the value it judges drift by.

const s = useSyncSession(3)

function get(who: Who | null, path: string) {
  const req = request(s.app).get(path)
  return who ? req.set('Authorization', `Bearer ${s.tokens[who]}`) : req
}

async function list(who: Who) {
  const res = await get(who, '/api/cameras?limit=500&sort=assetTag')
  expect(res.status).toBe(200)
  return cameraListSchema.parse(res.body).items
}

describe('the camera list', () => {
  it("carries the baseline check's median MTF50 once a baseline is set, as the sync pull does", async () => {
    const [withBaseline, without] = s.fleet.cameraIds
    const before = await list('inspector')
    expect(before.find((c) => c.id === withBaseline)?.baselineMtf50CyPx).toBeNull()

    const commissioning = checkPayload(withBaseline, { medianMtf50CyPx: 0.31 })
    const ops = [
      op('check.create', commissioning),
      op('check.markBaseline', { checkId: commissioning.id, cameraId: withBaseline }),
    ]
    expect(statuses(await push(s, 'inspector', ops))).toEqual(['applied', 'applied'])

    for (const who of ['inspector', 'supervisor', 'maintenance'] as const) {
      const items = await list(who)
      expect(items.find((c) => c.id === withBaseline)).toMatchObject({
        baselineCheckId: commissioning.id,
        baselineMtf50CyPx: 0.31, // the median MTF50 the commissioning check was saved with
      })
      expect(items.find((c) => c.id === without)).toMatchObject({
        baselineCheckId: null,
        baselineMtf50CyPx: null,
      })
    }

    const detail = await get('inspector', `/api/cameras/${withBaseline}`)
    expect(cameraDetailSchema.parse(detail.body).baselineMtf50CyPx).toBe(0.31)

    // Same record both ways (compared field by field, `overdue` is the same at this moment).
    const pulled = await get('inspector', '/api/sync/pull')
    expect(pulled.status).toBe(200)
    const fromPull = pullResponseSchema.parse(pulled.body).cameras
    const fromList = await list('inspector')
    expect(fromList).toEqual([...fromPull].sort((a, b) => a.assetTag.localeCompare(b.assetTag)))
  })

  it('follows a replaced baseline: a supervisor marks a newer check', async () => {
    const cameraId = s.fleet.cameraIds[2]
    const first = checkPayload(cameraId, { medianMtf50CyPx: 0.28 })
    const second = checkPayload(cameraId, { medianMtf50CyPx: 0.34 })
    expect(
      statuses(
        await push(s, 'inspector', [
          op('check.create', first),
          op('check.markBaseline', { checkId: first.id, cameraId }),
          op('check.create', second),
        ]),
      ),
    ).toEqual(['applied', 'applied', 'applied'])
    expect((await list('inspector')).find((c) => c.id === cameraId)?.baselineMtf50CyPx).toBe(0.28)

    const [replaced] = await push(s, 'supervisor', [
      op('check.markBaseline', { checkId: second.id, cameraId }),
    ])
    expect(replaced.status).toBe('applied')
    expect((await list('inspector')).find((c) => c.id === cameraId)).toMatchObject({
      baselineCheckId: second.id,
      baselineMtf50CyPx: 0.34,
    })
  })

  it('still refuses a caller without a session and a malformed query', async () => {
    expect((await get(null, '/api/cameras')).status).toBe(401)
    const bad = await get('inspector', '/api/cameras?limit=5000')
    expect(bad.status).toBe(400)
  })
})
