import { beforeEach, describe, expect, it, vi } from 'vitest'
import type * as Vant from 'vant'
import { userCreateSchema } from '@shared/schemas/setup'
import { ApiError } from '@/api/errors'
import { useEntityForm } from '../useEntityForm'

// The confirmation toast needs a document; here we only read what it would say.
const toasts = vi.hoisted(() => [] as string[])
vi.mock('vant', async (original) => ({
  ...(await original<typeof Vant>()),
  showToast: (message: string) => void toasts.push(message),
}))
beforeEach(() => void toasts.splice(0))

const PRIYA = {
  name: 'Priya Natarajan',
  email: ' Priya.Natarajan@sharpfield.test ',
  role: 'inspector',
  password: 'a-long-first-password',
}
// What the server sends for a taken address (server/services/admin: uniqueOr → fieldError).
const TAKEN = 'A user with this e-mail address exists already.'
const taken = () => new ApiError('setup.conflict', TAKEN, 409, { fields: { email: [TAKEN] } })

describe('a setup form', () => {
  it('opens empty for a new record and on the record to change', () => {
    const form = useEntityForm<{ id: number; name: string }>()
    form.edit(null)
    expect(form.open.value).toBe(true)
    expect(form.editing.value).toBeNull()
    form.close()
    form.edit({ id: 7, name: 'Harbour gate' })
    expect(form.editing.value).toEqual({ id: 7, name: 'Harbour gate' })
  })

  it('refuses an invalid draft field by field and sends nothing', async () => {
    const form = useEntityForm()
    form.start()
    const send = vi.fn(() => Promise.resolve())
    expect(await form.save(userCreateSchema, { ...PRIYA, name: ' ' }, send)).toBe(false)
    expect(send).not.toHaveBeenCalled()
    expect(form.errors.value).toEqual({ name: 'Enter a name.' })
    expect(form.open.value).toBe(true)
  })

  it('stays open with the server’s message on its field when the server refuses', async () => {
    const form = useEntityForm()
    form.start()
    const refresh = vi.fn(() => Promise.resolve())
    const ok = await form.save(userCreateSchema, PRIYA, () => Promise.reject(taken()), {
      toast: 'User created.',
      refresh,
    })
    expect(ok).toBe(false)
    expect(form.errors.value).toEqual({ email: TAKEN })
    expect(form.formError.value).toBe(TAKEN)
    expect(form.open.value).toBe(true)
    expect(form.saving.value).toBe(false)
    expect(toasts).toEqual([])
    expect(refresh).not.toHaveBeenCalled()
  })

  it('sends the parsed value, closes, says so and reloads the list once saved', async () => {
    const form = useEntityForm()
    form.start()
    const send = vi.fn(() => Promise.resolve())
    const refresh = vi.fn(() => Promise.resolve())
    const ok = await form.save(userCreateSchema, PRIYA, send, { toast: 'User created.', refresh })
    expect(ok).toBe(true)
    expect(send).toHaveBeenCalledWith({ ...PRIYA, email: 'priya.natarajan@sharpfield.test' })
    expect(form.open.value).toBe(false)
    expect(toasts).toEqual(['User created.'])
    expect(refresh).toHaveBeenCalledOnce()
  })

  it('clears the last messages when opened again', async () => {
    const form = useEntityForm()
    form.start()
    await form.save(userCreateSchema, PRIYA, () => Promise.reject(taken()))
    form.close()
    form.start()
    expect(form.errors.value).toEqual({})
    expect(form.formError.value).toBeNull()
  })
})
