import type { LoginAttemptStore } from '../loginLimiter'

/** A store in memory, so the limiter's rules can be tested without a database. */
export function createMemoryAttemptStore(): LoginAttemptStore {
  const map = new Map<string, number[]>()
  return {
    async recent(key, sinceMs) {
      return (map.get(key) ?? []).filter((t) => t >= sinceMs)
    },
    async addFailure(key, atMs) {
      map.set(key, [...(map.get(key) ?? []), atMs])
    },
    async clear(key) {
      map.delete(key)
    },
  }
}
