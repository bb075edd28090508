import { describe, expect, it } from 'vitest'
import { cameraStatusAfterCheck } from '../checksCameraStatus'

const DAY = 86_400_000
const now = new Date('2025-06-01T12:00:00Z')
const at = (daysAgo: number) => new Date(now.getTime() - daysAgo * DAY)
const check = (over: Partial<Parameters<typeof cameraStatusAfterCheck>[1]> = {}) => ({
  id: 'c1',
  capturedAt: at(1),
  mode: 'day' as const,
  verdict: 'pass' as const,
  medianMtf50CyPx: 0.3,
  ...over,
})

describe('camera status after a check', () => {
  it('a passing day check sets the last result, ok, and the next due date one interval on', () => {
    const u = cameraStatusAfterCheck(
      { state: 'due', lastCheckAt: at(100), nextDueAt: at(10) },
      check(),
      90,
      now,
    )
    expect(u.isLatest).toBe(true)
    expect(u.set).toEqual({
      lastCheckId: 'c1',
      lastCheckAt: at(1),
      lastVerdict: 'pass',
      lastMtf50CyPx: 0.3,
      nextDueAt: new Date(at(1).getTime() + 90 * DAY),
      state: 'ok',
    })
  })

  it('a failing check marks the camera failing, whatever its due date', () => {
    const u = cameraStatusAfterCheck(
      { state: 'ok', lastCheckAt: null, nextDueAt: null },
      check({ verdict: 'fail' }),
      90,
      now,
    )
    expect(u.set.state).toBe('failing')
  })

  it('a passing check too old to cover the interval leaves the camera due', () => {
    const u = cameraStatusAfterCheck(
      { state: 'failing', lastCheckAt: at(200), nextDueAt: null },
      check({ capturedAt: at(120) }),
      90,
      now,
    )
    expect(u.set.state).toBe('due')
  })

  it('an older check arriving late changes neither the last result nor the state', () => {
    const u = cameraStatusAfterCheck(
      { state: 'failing', lastCheckAt: at(1), nextDueAt: at(-89) },
      check({ capturedAt: at(5) }),
      90,
      now,
    )
    expect(u.isLatest).toBe(false)
    expect(u.set).toEqual({})
  })

  it('a late day check can only move the next due date later', () => {
    const camera = { state: 'ok' as const, lastCheckAt: at(1), nextDueAt: at(30) }
    const u = cameraStatusAfterCheck(camera, check({ capturedAt: at(5), mode: 'day' }), 90, now)
    expect(u.isLatest).toBe(false)
    expect(u.set).toEqual({ nextDueAt: new Date(at(5).getTime() + 90 * DAY) })
  })

  it('a night check updates the last result but not the due date', () => {
    const u = cameraStatusAfterCheck(
      { state: 'ok', lastCheckAt: at(3), nextDueAt: at(-80) },
      check({ mode: 'night' }),
      90,
      now,
    )
    expect(u.set.nextDueAt).toBeUndefined()
    expect(u.set.lastCheckId).toBe('c1')
    expect(u.set.state).toBe('ok')
  })
})
