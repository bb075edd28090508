import { winAnsiCode } from '@shared/target/fontMetrics'

/** Points per millimetre (1 pt = 1/72 in, 1 in = 25.4 mm). */
export const PT_PER_MM = 72 / 25.4

/** A PDF number: at most 4 decimals, no exponent, no trailing zeros, no negative zero. */
export function pdfNumber(n: number): string {
  if (!Number.isFinite(n)) throw new RangeError(`A PDF number must be finite, got ${n}.`)
  const s = Number(n.toFixed(4)).toString()
  return s === '-0' ? '0' : s
}

/**
 * A PDF literal string in WinAnsi: backslash, parentheses and every byte outside printable ASCII
 * are escaped, so content streams stay 7-bit ASCII.
 */
export function pdfString(text: string): string {
  let out = '('
  for (const ch of text) {
    const code = winAnsiCode(ch)
    if (ch === '\\' || ch === '(' || ch === ')') out += `\\${ch}`
    else if (code > 126) out += `\\${code.toString(8).padStart(3, '0')}`
    else out += ch
  }
  return `${out})`
}
