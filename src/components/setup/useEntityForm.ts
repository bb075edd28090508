// The open/save cycle of a setup form: validate with the shared schema, send, show the
// server's field messages or its sentence, close and refresh on success.
import { ref } from 'vue'
import type { ZodType } from 'zod'
import { errorMessage } from '@/api/errors'
import { serverFieldErrors, validate, type FieldErrors } from './fieldErrors'

export function useEntityForm() {
  const open = ref(false)
  const errors = ref<FieldErrors>({})
  const formError = ref<string | null>(null)
  const saving = ref(false)

  function start() {
    errors.value = {}
    formError.value = null
    open.value = true
  }

  /** Validates `draft`; if valid, runs `send` with the parsed value. True when saved. */
  async function save<T>(
    schema: ZodType<T>,
    draft: unknown,
    send: (value: T) => Promise<unknown>,
  ): Promise<boolean> {
    formError.value = null
    const checked = validate(schema, draft)
    if (!checked.ok) {
      errors.value = checked.errors
      return false
    }
    errors.value = {}
    saving.value = true
    try {
      await send(checked.data)
      open.value = false
      return true
    } catch (e) {
      errors.value = serverFieldErrors(e)
      formError.value = errorMessage(e)
      return false
    } finally {
      saving.value = false
    }
  }

  return { open, errors, formError, saving, start, save }
}
