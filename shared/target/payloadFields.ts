// The shape every Sharpfield QR payload shares: `<prefix>;key=value;key=value…`. Keys are unique;
// unknown keys are kept (the decoders ignore those they do not know: later versions may add some).

export interface PayloadParts {
  /** Text before the first `;`, e.g. `sharpfield-target:v1`. */
  prefix: string
  fields: Map<string, string>
}

/**
 * Splits a scanned payload. `what` names the code in messages ("target code", "camera label").
 * A field without `=` or a key given twice is a damaged code: RangeError.
 */
export function splitPayload(text: string, what: string): PayloadParts {
  const [prefix, ...rest] = text.trim().split(';')
  const fields = new Map<string, string>()
  for (const field of rest) {
    const eq = field.indexOf('=')
    if (eq <= 0) throw new RangeError(`The ${what} has a malformed field "${field}".`)
    const key = field.slice(0, eq)
    if (fields.has(key)) throw new RangeError(`The ${what} repeats the field "${key}".`)
    fields.set(key, field.slice(eq + 1))
  }
  return { prefix, fields }
}
