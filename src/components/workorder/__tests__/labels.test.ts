import { describe, expect, it } from 'vitest'
import type { WorkOrderHistoryEntry } from '@shared/schemas/workOrders'
import { historySentence } from '../labels'

const entry = (over: Partial<WorkOrderHistoryEntry>): WorkOrderHistoryEntry => ({
  id: 1,
  at: '2031-06-09T10:00:00.000Z',
  actorId: 2,
  actorName: 'Rhea Lindqvist',
  action: 'comment',
  fromStatus: null,
  toStatus: null,
  fromAssigneeId: null,
  fromAssigneeName: null,
  toAssigneeId: null,
  toAssigneeName: null,
  checkId: null,
  reason: null,
  note: null,
  photoId: null,
  ...over,
})

describe('history sentences', () => {
  it('say who did what for each kind of entry', () => {
    expect(historySentence(entry({ action: 'reassigned', fromAssigneeName: 'Piet', toAssigneeName: 'Mina' }))).toBe(
      'Rhea Lindqvist moved it from Piet to Mina.',
    )
    expect(historySentence(entry({ action: 'opened', actorName: 'Jonas', checkId: 'c1' }))).toBe(
      'Jonas recorded a failing check; the order was opened.',
    )
    expect(historySentence(entry({ action: 'recheck_failed', actorName: 'Jonas', toAssigneeName: 'Mina' }))).toBe(
      "Jonas's re-check did not pass; back to Mina.",
    )
    expect(historySentence(entry({ action: 'opened', actorName: null }))).toBe('Sharpfield opened the order.')
  })

  it('falls back to the status change for entries it has no words for (older data)', () => {
    expect(historySentence(entry({ action: 'status', fromStatus: 'assigned', toStatus: 'in_progress' }))).toBe(
      'Rhea Lindqvist moved it from assigned to in progress.',
    )
    expect(historySentence(entry({ action: 'something_new' }))).toBe('Rhea Lindqvist: something new.')
  })
})
