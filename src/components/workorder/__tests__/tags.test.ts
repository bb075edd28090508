import { describe, expect, it } from 'vitest'
import { WORK_ORDER_STATUSES } from '@shared/schemas/enums'
import { classesOf, renderHtml, textOf } from '@/components/common/__tests__/renderHtml'
import OverdueFlag from '../OverdueFlag.vue'
import StatusTag from '../StatusTag.vue'

const DAY_MS = 86_400_000

describe('a work-order status tag', () => {
  it('shows each status in words', async () => {
    const words: string[] = []
    for (const status of WORK_ORDER_STATUSES) {
      const html = await renderHtml(StatusTag, { status })
      expect(html).toContain('data-test="wo-status"')
      words.push(textOf(html))
    }
    expect(words).toEqual([
      'Open',
      'Assigned',
      'In progress',
      'Awaiting re-check',
      'Closed',
      'Cancelled',
    ])
  })

  it('strikes a cancelled order through', async () => {
    const html = await renderHtml(StatusTag, { status: 'cancelled' })
    expect(classesOf(html, 'label-tag')).toContain('label-tag--grey-struck')
  })
})

describe('the overdue flag of a work order', () => {
  const now = new Date('2031-06-10T12:00:00Z')

  it('counts whole days late', async () => {
    const dueAt = new Date(now.getTime() - 2.5 * DAY_MS).toISOString()
    const html = await renderHtml(OverdueFlag, { dueAt, now })
    expect(textOf(html)).toBe('Overdue 2 d')
    expect(html).toContain('data-test="wo-overdue"')
  })

  it('says at least one day once the due time has passed', async () => {
    const dueAt = new Date(now.getTime() - 3_600_000).toISOString()
    expect(textOf(await renderHtml(OverdueFlag, { dueAt, now }))).toBe('Overdue 1 d')
  })
})
