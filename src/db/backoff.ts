// Retry timing for the outbox and the upload queue.

/** First retry after 5 s, doubling up to 15 min, with jitter (see backoffMs). */
export const BACKOFF_BASE_MS = 5_000
export const BACKOFF_MAX_MS = 15 * 60_000
/**
 * Delay before the next try after `attempts` failures: 5 s × 2^(attempts − 1), at most 15 min,
 * with "equal jitter" (half fixed, half random) so phones that lost the network together do not
 * come back together. `random` is a number in [0, 1).
 */
export function backoffMs(attempts: number, random: number = Math.random()): number {
  const n = Math.max(1, attempts)
  const ceiling = Math.min(BACKOFF_MAX_MS, BACKOFF_BASE_MS * 2 ** Math.min(n - 1, 20))
  return Math.round(ceiling / 2 + (ceiling / 2) * random)
}
