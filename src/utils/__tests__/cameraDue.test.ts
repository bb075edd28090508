import { describe, expect, it } from 'vitest'
import { sampleCamera } from '@/db/__tests__/sampleCatalog'
import { compareUrgency, daysOverdue, needsCheck, urgencyOf } from '../cameraDue'

// Calendar arithmetic only: 1 day = 86 400 000 ms, whole days rounded down.
const NOW = new Date('2025-06-10T12:00:00.000Z')

describe('camera urgency', () => {
  it('counts whole days since the check fell due; zero before or on the day; null if never planned', () => {
    expect(daysOverdue(sampleCamera(1, { nextDueAt: '2025-06-01T12:00:00.000Z' }), NOW)).toBe(9)
    expect(daysOverdue(sampleCamera(1, { nextDueAt: '2025-06-10T00:00:00.000Z' }), NOW)).toBe(0)
    expect(daysOverdue(sampleCamera(1, { nextDueAt: '2025-06-20T00:00:00.000Z' }), NOW)).toBe(0)
    expect(daysOverdue(sampleCamera(1, { nextDueAt: null }), NOW)).toBeNull()
  })

  it('failing and in-repair states win over dates; a passed due date makes a camera overdue', () => {
    expect(
      urgencyOf(sampleCamera(1, { state: 'failing', nextDueAt: '2025-01-01T00:00:00.000Z' }), NOW),
    ).toBe('failing')
    expect(
      urgencyOf(
        sampleCamera(1, { state: 'in_repair', nextDueAt: '2025-01-01T00:00:00.000Z' }),
        NOW,
      ),
    ).toBe('in_repair')
    expect(
      urgencyOf(sampleCamera(1, { state: 'ok', nextDueAt: '2025-06-09T00:00:00.000Z' }), NOW),
    ).toBe('overdue')
    expect(
      urgencyOf(sampleCamera(1, { state: 'due', nextDueAt: '2025-07-01T00:00:00.000Z' }), NOW),
    ).toBe('due')
    expect(
      urgencyOf(sampleCamera(1, { state: 'ok', nextDueAt: '2025-07-01T00:00:00.000Z' }), NOW),
    ).toBe('ok')
  })

  it('only failing, overdue and due cameras need a check', () => {
    const states = ['failing', 'due', 'in_repair', 'ok'] as const
    const future = '2025-09-01T00:00:00.000Z'
    expect(
      states.map((state) => needsCheck(sampleCamera(1, { state, nextDueAt: future }), NOW)),
    ).toEqual([true, true, false, false])
  })

  it('sorts failing, then the longest overdue, then due, in repair and fine; asset tag breaks ties', () => {
    const cams = [
      sampleCamera(1, { assetTag: 'OK-1', state: 'ok', nextDueAt: '2025-08-01T00:00:00.000Z' }),
      sampleCamera(2, { assetTag: 'LATE-2', state: 'ok', nextDueAt: '2025-06-05T00:00:00.000Z' }),
      sampleCamera(3, { assetTag: 'FAIL-3', state: 'failing' }),
      sampleCamera(4, { assetTag: 'LATE-4', state: 'due', nextDueAt: '2025-05-01T00:00:00.000Z' }),
      sampleCamera(5, { assetTag: 'REP-5', state: 'in_repair' }),
      sampleCamera(6, { assetTag: 'DUE-6', state: 'due', nextDueAt: '2025-06-30T00:00:00.000Z' }),
      sampleCamera(7, { assetTag: 'CAM-10', state: 'ok', nextDueAt: null }),
      sampleCamera(8, { assetTag: 'CAM-9', state: 'ok', nextDueAt: null }),
    ]
    const order = [...cams].sort((a, b) => compareUrgency(a, b, NOW)).map((c) => c.assetTag)
    expect(order).toEqual([
      'FAIL-3',
      'LATE-4',
      'LATE-2',
      'DUE-6',
      'REP-5',
      'OK-1',
      'CAM-9',
      'CAM-10',
    ])
  })
})
