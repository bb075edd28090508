import { describe, expect, it } from 'vitest'
import { createLoginLimiter } from '../loginLimiter'
import { createMemoryAttemptStore } from './memoryAttemptStore'

function setup() {
  let t = 1_000_000
  const now = () => t
  const limiter = createLoginLimiter(createMemoryAttemptStore(), { now })
  return { limiter, advance: (ms: number) => (t += ms) }
}

describe('login limiter', () => {
  it('blocks the 11th attempt after ten failures and reports when to retry', async () => {
    const { limiter, advance } = setup()
    for (let i = 0; i < 10; i++) {
      expect(await limiter.retryAfterS('a@x.test', '1.2.3.4')).toBe(0)
      await limiter.recordFailure('a@x.test', '1.2.3.4')
      advance(60_000)
    }
    // First failure at t0, now t0 + 10 min: it leaves the 15-min window in 5 min.
    expect(await limiter.retryAfterS('a@x.test', '1.2.3.4')).toBe(300)
  })

  it('forgets failures older than the window', async () => {
    const { limiter, advance } = setup()
    for (let i = 0; i < 10; i++) await limiter.recordFailure('a@x.test', '1.2.3.4')
    expect(await limiter.retryAfterS('a@x.test', '1.2.3.4')).toBeGreaterThan(0)
    advance(15 * 60_000 + 1)
    expect(await limiter.retryAfterS('a@x.test', '1.2.3.4')).toBe(0)
  })

  it('keys on account and address together, ignoring e-mail case', async () => {
    const { limiter } = setup()
    for (let i = 0; i < 10; i++) await limiter.recordFailure('A@x.test', '1.2.3.4')
    expect(await limiter.retryAfterS('a@X.test', '1.2.3.4')).toBeGreaterThan(0)
    expect(await limiter.retryAfterS('a@x.test', '5.6.7.8')).toBe(0)
    expect(await limiter.retryAfterS('b@x.test', '1.2.3.4')).toBe(0)
  })

  it('a success clears the count', async () => {
    const { limiter } = setup()
    for (let i = 0; i < 9; i++) await limiter.recordFailure('a@x.test', '1.2.3.4')
    await limiter.recordSuccess('a@x.test', '1.2.3.4')
    await limiter.recordFailure('a@x.test', '1.2.3.4')
    expect(await limiter.retryAfterS('a@x.test', '1.2.3.4')).toBe(0)
  })
})
