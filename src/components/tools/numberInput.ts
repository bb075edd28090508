// Reads a number typed into a form field, with a message a person can act on when it is wrong.

export interface NumberRule {
  /** Field name in a sentence, e.g. "Focal length". */
  label: string
  /** Unit shown in messages, e.g. "mm"; '' for none. */
  unit: string
  min: number
  max: number
  /** The minimum itself is not allowed (a distance of 0 m, for instance). */
  exclusiveMin?: boolean
  integer?: boolean
}

export type ParsedNumber = { ok: true; value: number } | { ok: false; message: string }

const PLAIN_NUMBER = /^[+]?(\d+([.,]\d*)?|[.,]\d+)$/

/** Accepts "2.8", "2,8" (decimal comma) and surrounding spaces; nothing else. */
export function parseNumberInput(
  text: string | number | null | undefined,
  rule: NumberRule,
): ParsedNumber {
  const raw = String(text ?? '').trim()
  const unit = rule.unit === '°' ? '°' : rule.unit ? ` ${rule.unit}` : ''
  if (raw === '')
    return {
      ok: false,
      message: `Enter the ${rule.label.toLowerCase()}${rule.unit ? ` in ${rule.unit}` : ''}.`,
    }
  if (!PLAIN_NUMBER.test(raw))
    return { ok: false, message: `${rule.label} must be a plain number, such as 2.8.` }
  const value = Number(raw.replace(',', '.'))
  if (rule.integer && !Number.isInteger(value))
    return { ok: false, message: `${rule.label} must be a whole number.` }
  const tooLow = rule.exclusiveMin ? value <= rule.min : value < rule.min
  if (tooLow || value > rule.max) {
    const low = rule.exclusiveMin ? `more than ${rule.min}` : `at least ${rule.min}`
    return { ok: false, message: `${rule.label} must be ${low} and at most ${rule.max}${unit}.` }
  }
  return { ok: true, value }
}
