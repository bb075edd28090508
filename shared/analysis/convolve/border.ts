/**
 * Border rules: how samples outside a finite signal are filled.
 *
 * For a signal `a b c d` (n = 4), the samples left of index 0 are:
 * - `zero`       0 0 0 | a b c d   (scipy `constant` with cval 0, OpenCV BORDER_CONSTANT)
 * - `replicate`  a a a | a b c d   (scipy `nearest`, OpenCV BORDER_REPLICATE)
 * - `reflect101` d c b | a b c d   (scipy `mirror`, OpenCV BORDER_REFLECT_101, the OpenCV default)
 * - `symmetric`  c b a | a b c d   (scipy `reflect`, OpenCV BORDER_REFLECT, MATLAB `symmetric`)
 * - `wrap`       b c d | a b c d   (scipy `wrap`, OpenCV BORDER_WRAP; circular convolution)
 * (read the left part right to left: the sample at index −1 is 0, a, b, a, d respectively.)
 */
export type BorderRule = 'zero' | 'replicate' | 'reflect101' | 'symmetric' | 'wrap'

export const BORDER_RULES: readonly BorderRule[] = [
  'zero',
  'replicate',
  'reflect101',
  'symmetric',
  'wrap',
]

/** Throws a TypeError unless `rule` is one of BORDER_RULES. */
export function assertBorderRule(rule: unknown): asserts rule is BorderRule {
  if (typeof rule !== 'string' || !BORDER_RULES.includes(rule as BorderRule)) {
    throw new TypeError(
      `Unknown border rule ${JSON.stringify(rule)}: use one of ${BORDER_RULES.join(', ')}.`,
    )
  }
}

/**
 * Index inside [0, n) that supplies the sample at position `i` under `rule`,
 * or −1 when the rule supplies a zero (`zero` outside the signal).
 * Works for any distance outside the signal (the rules are periodic or clamped).
 * Not for per-pixel hot loops: build an index table once instead.
 */
export function borderIndex(i: number, n: number, rule: BorderRule): number {
  if (i >= 0 && i < n) return i
  switch (rule) {
    case 'zero':
      return -1
    case 'replicate':
      return i < 0 ? 0 : n - 1
    case 'wrap':
      return ((i % n) + n) % n
    case 'symmetric': {
      const period = 2 * n
      const m = ((i % period) + period) % period
      return m < n ? m : period - 1 - m
    }
    case 'reflect101': {
      if (n === 1) return 0
      const period = 2 * n - 2
      const m = ((i % period) + period) % period
      return m < n ? m : period - m
    }
  }
}

/**
 * Index table for positions −before … n − 1 + after: entry `j` holds borderIndex(j − before, n, rule).
 * Used to build padded copies without per-sample branching.
 */
export function borderIndexTable(
  n: number,
  before: number,
  after: number,
  rule: BorderRule,
): Int32Array {
  const table = new Int32Array(n + before + after)
  for (let j = 0; j < table.length; j++) table[j] = borderIndex(j - before, n, rule)
  return table
}
