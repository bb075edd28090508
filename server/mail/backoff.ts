// When to try a mail again after the SMTP server refused it or could not be reached.

export interface BackoffOptions {
  /** Wait after the first failure (default 30 s). */
  baseMs?: number
  /** Longest wait between two tries (default 1 h). */
  maxMs?: number
  /** Tries before a mail is given up as failed (default 20: about 15 hours of retries). */
  maxAttempts?: number
}

export const DEFAULT_BACKOFF: Required<BackoffOptions> = {
  baseMs: 30_000,
  maxMs: 3_600_000,
  maxAttempts: 20,
}

/**
 * Exponential back-off: after the n-th failed try (n ≥ 1) wait base·2^(n−1), capped at max;
 * `null` once n reaches maxAttempts (give up).
 */
export function retryDelayMs(attempts: number, options: BackoffOptions = {}): number | null {
  const o = { ...DEFAULT_BACKOFF, ...options }
  if (!Number.isInteger(attempts) || attempts < 1)
    throw new RangeError(`attempts must be a whole number ≥ 1, got ${attempts}.`)
  if (attempts >= o.maxAttempts) return null
  return Math.min(o.maxMs, o.baseMs * 2 ** (attempts - 1))
}
