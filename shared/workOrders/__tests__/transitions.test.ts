import { describe, expect, it } from 'vitest'
import { WORK_ORDER_STATUSES } from '../../schemas/enums'
import type { Role, WorkOrderStatus } from '../../schemas/enums'
import { WORK_ORDER_ACTIONS, allowedActions, decide } from '../transitions'
import type { WorkOrderAction } from '../transitions'

// The product's rules written out by hand (issue 7 and DESIGN.md), independent of the table:
// every allowed (action, actor, status) with the status it leads to. Everything else is refused.
type ActorKind = 'supervisor' | 'maintenance (assignee)' | 'maintenance (other)' | 'inspector' | 'admin'
const ACTIVE = ['open', 'assigned', 'in_progress', 'awaiting_recheck'] as const
const same = (statuses: readonly WorkOrderStatus[]) =>
  Object.fromEntries(statuses.map((s) => [s, s])) as Partial<Record<WorkOrderStatus, WorkOrderStatus>>
const to = (statuses: readonly WorkOrderStatus[], target: WorkOrderStatus) =>
  Object.fromEntries(statuses.map((s) => [s, target])) as Partial<Record<WorkOrderStatus, WorkOrderStatus>>

const ALLOWED: Record<WorkOrderAction, Partial<Record<ActorKind, Partial<Record<WorkOrderStatus, WorkOrderStatus>>>>> = {
  // Supervisors assign an open order…
  assign: { supervisor: { open: 'assigned' } },
  // …and reassign one that is assigned or being worked on (back to `assigned` for the new person).
  reassign: { supervisor: to(['assigned', 'in_progress'], 'assigned') },
  // Maintenance moves its own orders forward.
  start: { 'maintenance (assignee)': { assigned: 'in_progress' } },
  request_recheck: { 'maintenance (assignee)': to(['assigned', 'in_progress'], 'awaiting_recheck') },
  // Notes and photos on any order still open: supervisors on all, maintenance on its own.
  comment: { supervisor: same(ACTIVE), 'maintenance (assignee)': same(ACTIVE) },
  add_photo: { supervisor: same(ACTIVE), 'maintenance (assignee)': same(ACTIVE) },
  // Supervisors cancel anything not finished.
  cancel: { supervisor: to(ACTIVE, 'cancelled') },
  // Nobody closes by hand: only a passing re-check does.
  close: {},
}

const ACTORS: Record<ActorKind, { role: Role; id: number }> = {
  supervisor: { role: 'supervisor', id: 1 },
  'maintenance (assignee)': { role: 'maintenance', id: 7 },
  'maintenance (other)': { role: 'maintenance', id: 8 },
  inspector: { role: 'inspector', id: 3 },
  admin: { role: 'admin', id: 4 },
}
const ASSIGNEE = 7

const cases = WORK_ORDER_ACTIONS.flatMap((action) =>
  (Object.keys(ACTORS) as ActorKind[]).flatMap((actor) =>
    WORK_ORDER_STATUSES.map((status) => ({ action, actor, status, expected: ALLOWED[action][actor]?.[status] ?? null })),
  ),
)

describe('the work-order transition table', () => {
  it('covers every action × actor × status (8 × 5 × 6)', () => {
    expect(cases.length).toBe(240)
    expect(cases.filter((c) => c.expected !== null).length).toBe(1 + 2 + 1 + 2 + 8 + 8 + 4)
  })

  it.each(cases)('$action by $actor on a $status order → $expected', ({ action, actor, status, expected }) => {
    const d = decide(action, { status, assigneeId: ASSIGNEE }, ACTORS[actor])
    if (expected === null) {
      expect(d.ok).toBe(false)
      if (!d.ok) expect(d.message.length).toBeGreaterThan(10)
    } else {
      expect(d).toEqual({ ok: true, to: expected })
    }
  })

  it('an unassigned order offers maintenance nothing, the supervisor assign, note, photo and cancel', () => {
    const state = { status: 'open' as const, assigneeId: null }
    expect(allowedActions(state, { role: 'maintenance', id: 7 })).toEqual([])
    expect(allowedActions(state, { role: 'supervisor', id: 1 })).toEqual(['assign', 'comment', 'add_photo', 'cancel'])
  })

  it('says why an action is refused', () => {
    const state = { status: 'assigned' as const, assigneeId: 7 }
    expect(decide('start', state, { role: 'maintenance', id: 8 })).toMatchObject({ ok: false, why: 'assignee' })
    expect(decide('reassign', state, { role: 'maintenance', id: 7 })).toMatchObject({ ok: false, why: 'role' })
    expect(decide('close', state, { role: 'supervisor', id: 1 })).toMatchObject({ ok: false, why: 'manual_close' })
    expect(decide('assign', state, { role: 'supervisor', id: 1 })).toMatchObject({
      ok: false,
      why: 'status',
      message: '"Assign" is not possible while the order is assigned.',
    })
  })
})
