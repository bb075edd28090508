// Failed sign-ins are counted per (account, client address). After `maxFailures` failures within
// `windowMs`, that pair is refused until the oldest failure leaves the window; other accounts and
// other addresses are unaffected. The counts live behind a store interface; the app keeps them in
// MariaDB (loginAttemptsDb.ts) so every server process and replica sees the same failures.

export interface LoginAttemptStore {
  /** Failure times (ms) for the key that are not older than `sinceMs`. */
  recent(key: string, sinceMs: number): Promise<number[]>
  addFailure(key: string, atMs: number): Promise<void>
  clear(key: string): Promise<void>
}

export interface LoginLimiter {
  /** Seconds to wait when the pair is blocked, otherwise 0. */
  retryAfterS(email: string, ip: string): Promise<number>
  recordFailure(email: string, ip: string): Promise<void>
  recordSuccess(email: string, ip: string): Promise<void>
}

export interface LoginLimiterOptions {
  maxFailures?: number
  windowMs?: number
  now?: () => number
}

export const LOGIN_MAX_FAILURES = 10
export const LOGIN_WINDOW_MS = 15 * 60 * 1000

export function createLoginLimiter(
  store: LoginAttemptStore,
  options: LoginLimiterOptions = {},
): LoginLimiter {
  const max = options.maxFailures ?? LOGIN_MAX_FAILURES
  const windowMs = options.windowMs ?? LOGIN_WINDOW_MS
  const now = options.now ?? Date.now
  const keyOf = (email: string, ip: string) => `${email.trim().toLowerCase()}|${ip}`
  return {
    async retryAfterS(email, ip) {
      const t = now()
      const times = await store.recent(keyOf(email, ip), t - windowMs)
      if (times.length < max) return 0
      // Blocked until enough failures age out to drop below the limit.
      const sorted = [...times].sort((a, b) => a - b)
      const freeAt = sorted[sorted.length - max] + windowMs
      return Math.max(1, Math.ceil((freeAt - t) / 1000))
    },
    recordFailure: (email, ip) => store.addFailure(keyOf(email, ip), now()),
    recordSuccess: (email, ip) => store.clear(keyOf(email, ip)),
  }
}
