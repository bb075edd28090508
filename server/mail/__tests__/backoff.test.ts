import { describe, expect, it } from 'vitest'
import { retryDelayMs } from '../backoff'

describe('retry back-off', () => {
  it('doubles from 30 s after each failure up to one hour', () => {
    const delays = [1, 2, 3, 4, 5, 6, 7, 8, 9].map((n) => retryDelayMs(n))
    // 30 s · 2^(n−1): 30, 60, 120, 240, 480, 960, 1920 s, then capped at 3600 s.
    expect(delays).toEqual([30, 60, 120, 240, 480, 960, 1920, 3600, 3600].map((s) => s * 1000))
  })

  it('gives up at the last attempt', () => {
    expect(retryDelayMs(19)).toBe(3_600_000)
    expect(retryDelayMs(20)).toBeNull()
    expect(retryDelayMs(2, { maxAttempts: 2 })).toBeNull()
  })

  it('refuses an attempt count below one', () => {
    expect(() => retryDelayMs(0)).toThrow(RangeError)
    expect(() => retryDelayMs(1.5)).toThrow('attempts must be a whole number ≥ 1, got 1.5.')
  })
})
