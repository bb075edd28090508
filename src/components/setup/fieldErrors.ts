// Field messages for a form: from the shared zod schema (before sending) or from the
// server's 400 (details.fields), keyed by the form's field names.
import type { ZodType } from 'zod'

export type FieldErrors = Record<string, string>

/** Runs the schema; returns the parsed value or the first message per field. */
export function validate<T>(
  schema: ZodType<T>,
  value: unknown,
): { ok: true; data: T } | { ok: false; errors: FieldErrors } {
  const r = schema.safeParse(value)
  if (r.success) return { ok: true, data: r.data }
  const errors: FieldErrors = {}
  for (const issue of r.error.issues) {
    const key = issue.path.length ? String(issue.path[0]) : '_'
    errors[key] ??= issue.message
  }
  return { ok: false, errors }
}

/** The server's field messages (a 400 or 409 with details.fields), if any. */
export function serverFieldErrors(error: unknown): FieldErrors {
  const fields = (error as { details?: { fields?: Record<string, string[]> } } | null)?.details
    ?.fields
  const out: FieldErrors = {}
  for (const [k, v] of Object.entries(fields ?? {})) if (v[0]) out[k] = v[0]
  return out
}

/** '' → null, '12.5' → 12.5, 'abc' → NaN (the schema then names the field). */
export function numberOrNull(text: string): number | null {
  const t = text.trim()
  return t === '' ? null : Number(t)
}

export function numberOrUndefined(text: string): number | undefined {
  const t = text.trim()
  return t === '' ? undefined : Number(t)
}
