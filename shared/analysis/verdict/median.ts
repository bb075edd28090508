/** The median of a non-empty list (the mean of the middle two for an even count). */
export function median(values: readonly number[]): number {
  const s = [...values].sort((a, b) => a - b)
  const n = s.length
  return n % 2 ? s[(n - 1) / 2] : 0.5 * (s[n / 2 - 1] + s[n / 2])
}
