import { describe, expect, it } from 'vitest'
import { fleetFilterSchema, resolvePeriod } from '../../../../shared/schemas/fleet'

const NOW = new Date('2025-06-15T12:00:00Z')

describe('the fleet period', () => {
  it('default to the 90 days before now', () => {
    const p = resolvePeriod({}, NOW)
    expect(p.from.toISOString()).toBe('2025-03-17T12:00:00.000Z')
    expect(p.to).toEqual(NOW)
  })

  it('count a date-only end to the end of that day', () => {
    const p = resolvePeriod({ from: '2025-05-01', to: '2025-05-31' }, NOW)
    expect(p.from.toISOString()).toBe('2025-05-01T00:00:00.000Z')
    expect(p.to.toISOString()).toBe('2025-06-01T00:00:00.000Z')
  })

  it('refuse an empty or reversed period and one longer than the limit', () => {
    expect(() => resolvePeriod({ from: '2025-06-01', to: '2025-05-01' }, NOW)).toThrow(RangeError)
    expect(() => resolvePeriod({ from: '2010-01-01' }, NOW)).toThrow('at most 1900 days')
  })

  it('accept dates and ISO times, and nothing else', () => {
    expect(
      fleetFilterSchema.safeParse({ from: '2025-05-01', to: '2025-05-31T10:00:00+02:00' }).success,
    ).toBe(true)
    expect(fleetFilterSchema.safeParse({ from: '31/05/2025' }).success).toBe(false)
    expect(fleetFilterSchema.safeParse({ siteId: 'north' }).success).toBe(false)
  })
})
