import { describe, expect, it } from 'vitest'
import { userCreateSchema } from '@shared/schemas/setup'
import { ApiError } from '@/api/errors'
import { renderHtml, textOf } from '@/components/common/__tests__/renderHtml'
import type { FormFieldSpec } from '../EntityForm.vue'
import EntityPanel from '../EntityPanel.vue'
import { useEntityForm } from '../useEntityForm'

const FIELDS: FormFieldSpec[] = [
  { key: 'name', label: 'Name', kind: 'text' },
  { key: 'email', label: 'E-mail', kind: 'email' },
  {
    key: 'role',
    label: 'Role',
    kind: 'select',
    options: [{ value: 'inspector', label: 'Inspector' }],
  },
  { key: 'password', label: 'First password', kind: 'password' },
]
const ROWS = [
  { id: 1, name: 'Rhea Lindqvist', email: 'rhea.lindqvist@sharpfield.test' },
  { id: 2, name: 'Jonas Okafor', email: 'jonas.okafor@sharpfield.test' },
]
const TAKEN = 'A user with this e-mail address exists already.'

function panel(form = useEntityForm(), extra: Record<string, unknown> = {}) {
  return {
    rows: ROWS,
    cell: (r: (typeof ROWS)[number]) => ({ title: r.name, label: r.email }),
    count: '2 users',
    newLabel: 'New user',
    rowTest: 'user-row',
    form,
    formTitle: 'New user',
    fields: FIELDS,
    initial: { name: '', email: '', role: 'inspector', password: '' },
    ...extra,
  }
}

/** Each form field's label → the message shown under it ('' when none). */
function fieldMessages(html: string): Record<string, string> {
  const out: Record<string, string> = {}
  for (const block of html
    .split(/(?=<div class="(?:van-cell van-field|select-field van-cell))/)
    .slice(1)) {
    const label = block.match(/<label[^>]*>([^<]*)<\/label>/)?.[1]
    const message = block.match(
      /class="(?:van-field__error-message|select-field__error)"[^>]*>([^<]*)</,
    )
    if (label) out[label] = message?.[1] ?? ''
  }
  return out
}

describe('a setup panel', () => {
  it('lists each record with its words under a bar with the count and a New button', async () => {
    const text = textOf(await renderHtml(EntityPanel, panel()))
    expect(text).toBe(
      '2 users New user Rhea Lindqvist rhea.lindqvist@sharpfield.test Jonas Okafor jonas.okafor@sharpfield.test',
    )
  })

  it('marks each row for the browser tests', async () => {
    const html = await renderHtml(EntityPanel, panel())
    expect(html.match(/data-test="user-row"/g)).toHaveLength(2)
  })

  it('has no bar without a New label, and no list before the records arrive', async () => {
    const html = await renderHtml(
      EntityPanel,
      panel(undefined, { newLabel: undefined, rows: null }),
    )
    expect(html).not.toContain('panel-bar')
    expect(html).not.toContain('van-cell-group')
  })

  it('keeps the form hidden until it is opened', async () => {
    expect(await renderHtml(EntityPanel, panel())).not.toContain('data-test="entity-form"')
  })

  it('shows a server’s field message under that field and its sentence under the form', async () => {
    const form = useEntityForm()
    form.edit(null)
    const draft = {
      name: 'Priya Natarajan',
      email: 'priya.natarajan@sharpfield.test',
      role: 'inspector',
      password: 'a-long-first-password',
    }
    await form.save(userCreateSchema, draft, () =>
      Promise.reject(new ApiError('setup.conflict', TAKEN, 409, { fields: { email: [TAKEN] } })),
    )
    const html = await renderHtml(EntityPanel, panel(form))
    expect(html).toContain('data-test="entity-form"')
    expect(fieldMessages(html)).toEqual({
      Name: '',
      'E-mail': TAKEN,
      Role: '',
      'First password': '',
    })
    expect(html).toMatch(new RegExp(`role="alert" data-test="form-error"[^>]*>\\s*${TAKEN}`))
  })

  it('shows the schema’s messages under each wrong field before anything is sent', async () => {
    const form = useEntityForm()
    form.edit(null)
    await form.save(
      userCreateSchema,
      { name: '', email: 'not an address', role: 'inspector', password: 'short' },
      () => Promise.resolve(),
    )
    expect(fieldMessages(await renderHtml(EntityPanel, panel(form)))).toEqual({
      Name: 'Enter a name.',
      'E-mail': 'Enter an e-mail address.',
      Role: '',
      'First password': 'At least 12 characters.',
    })
  })
})
