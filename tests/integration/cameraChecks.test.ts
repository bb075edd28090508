import request from 'supertest'
import { describe, expect, it } from 'vitest'
import { cameraChecksSchema } from '../../shared/schemas/cameraChecks'
import { checkPayload, op } from './helpers/fleet'
import { push, statuses, useSyncSession, type Who } from './helpers/syncSession'

// GET /api/cameras/:id/checks against the real database: the history a device shows on the
// camera screen and keeps for offline drift checks, for every role that sees cameras.

const s = useSyncSession(3)

function history(who: Who, cameraId: number, query = '') {
  return request(s.app)
    .get(`/api/cameras/${cameraId}/checks${query}`)
    .set('Authorization', `Bearer ${s.tokens[who]}`)
}

describe("a camera's checks", () => {
  it('lists the checks pushed from a device, newest first, with the baseline and who made them', async () => {
    const cameraId = s.fleet.cameraIds[0]
    const older = checkPayload(cameraId, {
      capturedAt: new Date(Date.now() - 3 * 86_400_000).toISOString(),
      medianMtf50CyPx: 0.31,
    })
    const newer = checkPayload(cameraId, {
      capturedAt: new Date(Date.now() - 3_600_000).toISOString(),
      mode: 'night',
      verdict: 'marginal',
      medianMtf50CyPx: 0.22,
      baselineRatio: 0.22 / 0.31,
    })
    const ops = [
      op('check.create', older),
      op('check.markBaseline', { checkId: older.id, cameraId }),
      op('check.create', newer),
    ]
    expect(statuses(await push(s, 'inspector', ops))).toEqual(['applied', 'applied', 'applied'])

    const res = await history('inspector', cameraId)
    expect(res.status).toBe(200)
    const body = cameraChecksSchema.parse(res.body)
    expect(body.cameraId).toBe(cameraId)
    expect(body.checks.map((c) => c.id)).toEqual([newer.id, older.id])
    expect(body.checks[0]).toMatchObject({
      mode: 'night',
      verdict: 'marginal',
      medianMtf50CyPx: 0.22,
      isBaseline: false,
      inspectorName: 'Test inspector',
    })
    expect(body.checks[1].isBaseline).toBe(true)
    expect(body.baseline).toEqual({ checkId: older.id, mtf50CyPx: 0.31 })
    expect(body.truncated).toBe(false)
  })

  it('sends at most `limit` checks and says when more exist', async () => {
    const cameraId = s.fleet.cameraIds[1]
    const payloads = [1, 2, 3].map((h) =>
      checkPayload(cameraId, { capturedAt: new Date(Date.now() - h * 3_600_000).toISOString() }),
    )
    await push(
      s,
      'inspector',
      payloads.map((p) => op('check.create', p)),
    )
    const body = cameraChecksSchema.parse((await history('supervisor', cameraId, '?limit=2')).body)
    expect(body.checks.map((c) => c.id)).toEqual([payloads[0].id, payloads[1].id])
    expect(body.truncated).toBe(true)
    expect(body.baseline).toBeNull()
  })

  it('answers every role that sees cameras, and nobody without a session', async () => {
    const cameraId = s.fleet.cameraIds[2]
    for (const who of ['inspector', 'supervisor', 'maintenance'] as const) {
      expect((await history(who, cameraId)).status).toBe(200)
    }
    const anonymous = await request(s.app).get(`/api/cameras/${cameraId}/checks`)
    expect(anonymous.status).toBe(401)
  })

  it('says which camera is missing, and refuses a bad id or limit', async () => {
    const missing = await history('inspector', 987654)
    expect(missing.status).toBe(404)
    expect(missing.body.error.code).toBe('camera.not_found')
    expect((await history('inspector', 0)).status).toBe(400)
    expect((await history('inspector', s.fleet.cameraIds[0], '?limit=0')).status).toBe(400)
    expect((await history('inspector', s.fleet.cameraIds[0], '?limit=9999')).status).toBe(400)
  })
})
