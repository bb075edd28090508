import { describe, expect, it } from 'vitest'
import { mtfBin, weekStart, weeksOf } from '../weeks'

// Weeks start on Monday (ISO 8601), in UTC. Calendar facts checked against any calendar:
// 2025-06-01 is a Sunday, 2025-06-02 a Monday, 2024-12-30 the Monday of ISO week 2025-W01.
describe('fleet weeks', () => {
  it('put a Sunday in the week of the Monday before it', () => {
    expect(weekStart(new Date('2025-06-01T23:59:59Z'))).toBe('2025-05-26')
    expect(weekStart(new Date('2025-06-02T00:00:00Z'))).toBe('2025-06-02')
  })

  it('cross a year end', () => {
    expect(weekStart(new Date('2025-01-01T12:00:00Z'))).toBe('2024-12-30')
  })

  it('list every week overlapping a period and the instants they cover', () => {
    const w = weeksOf({
      from: new Date('2025-05-28T10:00:00Z'),
      to: new Date('2025-06-09T00:00:00Z'),
    })
    // The period ends exactly at Monday 9 June 00:00, so that week is not included.
    expect(w.weeks).toEqual(['2025-05-26', '2025-06-02'])
    expect(w.from.toISOString()).toBe('2025-05-26T00:00:00.000Z')
    expect(w.to.toISOString()).toBe('2025-06-09T00:00:00.000Z')
  })

  it('bin MTF50 in 0.025 cycles/pixel steps, everything from 0.575 up in the last bin', () => {
    expect(mtfBin(0)).toBe(0)
    expect(mtfBin(0.024)).toBe(0)
    expect(mtfBin(0.12)).toBe(4)
    expect(mtfBin(0.31)).toBe(12)
    expect(mtfBin(0.9)).toBe(23)
  })
})
