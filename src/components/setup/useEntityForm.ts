// The open/save cycle of a setup form: which record is being edited (none for a new one),
// validate with the shared schema, send, show the server's field messages or its sentence,
// close, say so and refresh on success.
import { ref, shallowRef, type Ref } from 'vue'
import { showToast } from 'vant'
import 'vant/es/toast/style'
import type { ZodType } from 'zod'
import { errorMessage } from '@/api/errors'
import { serverFieldErrors, validate, type FieldErrors } from './fieldErrors'

/** What FormSheet reads to draw the form and its messages. */
export interface FormSheetState {
  open: Ref<boolean>
  errors: Ref<FieldErrors>
  formError: Ref<string | null>
  saving: Ref<boolean>
  close(): void
}

/** After a successful save: a short confirmation and the list to reload. */
export interface AfterSave {
  toast: string
  refresh?: () => Promise<unknown>
}

export function useEntityForm<T = never>() {
  const open = ref(false)
  const editing = shallowRef<T | null>(null)
  const errors = ref<FieldErrors>({})
  const formError = ref<string | null>(null)
  const saving = ref(false)

  function start() {
    errors.value = {}
    formError.value = null
    open.value = true
  }
  /** Opens the form on `item`, or empty for a new record when null. */
  function edit(item: T | null) {
    editing.value = item
    start()
  }
  function close() {
    open.value = false
  }

  /** Validates `draft`; if valid, runs `send` with the parsed value. True when saved. */
  async function save<V>(
    schema: ZodType<V>,
    draft: unknown,
    send: (value: V) => Promise<unknown>,
    after?: AfterSave,
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
    } catch (e) {
      errors.value = serverFieldErrors(e)
      formError.value = errorMessage(e)
      return false
    } finally {
      saving.value = false
    }
    open.value = false
    if (after) {
      showToast(after.toast)
      await after.refresh?.()
    }
    return true
  }

  return { open, editing, errors, formError, saving, start, edit, close, save }
}
