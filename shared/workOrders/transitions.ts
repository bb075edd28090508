// Who may do what to a work order, and where it goes: one pure table used by the server to
// decide and by the client to offer only the actions the server will accept.
//
//   open ──assign──▶ assigned ──start──▶ in_progress ──request_recheck──▶ awaiting_recheck
//                     ▲  │ ▲                 │                                 │
//                     │  └─┴─reassign────────┘        passing re-check ─▶ closed
//                     └──────────────── failing re-check ◀──────────────────────┘
//   any of open/assigned/in_progress/awaiting_recheck ──cancel──▶ cancelled
//
// Closing is never an action by hand: only an inspector's passing re-check closes an order.
import type { Role } from '../schemas/enums'
import type { WorkOrderStatus } from '../schemas/enums'

export const WORK_ORDER_ACTIONS = [
  'assign',
  'reassign',
  'start',
  'request_recheck',
  'comment',
  'add_photo',
  'cancel',
  'close',
] as const
export type WorkOrderAction = (typeof WORK_ORDER_ACTIONS)[number]

/** Statuses from which nothing moves any more. */
export const TERMINAL_STATUSES: readonly WorkOrderStatus[] = ['closed', 'cancelled']
/** Every status in which the order still needs work (all but the terminal ones). */
export const ACTIVE_STATUSES: readonly WorkOrderStatus[] = [
  'open',
  'assigned',
  'in_progress',
  'awaiting_recheck',
]

/** `any`: every user of the role; `assignee`: only the user the order is assigned to. */
export type Scope = 'any' | 'assignee'

export interface ActionRule {
  /** Statuses in which the action is possible. */
  from: readonly WorkOrderStatus[]
  /** Where the order goes; `null` leaves the status as it is. */
  to: WorkOrderStatus | null
  /** Roles that may act, and on which orders. */
  roles: Partial<Record<Role, Scope>>
  /** What the request must carry. */
  needs: { assignee?: boolean; reason?: boolean; note?: boolean }
  label: string
}

export const TRANSITIONS: Record<WorkOrderAction, ActionRule> = {
  assign: {
    from: ['open'],
    to: 'assigned',
    roles: { supervisor: 'any' },
    needs: { assignee: true },
    label: 'Assign',
  },
  reassign: {
    from: ['assigned', 'in_progress'],
    to: 'assigned',
    roles: { supervisor: 'any' },
    needs: { assignee: true, reason: true },
    label: 'Reassign',
  },
  start: {
    from: ['assigned'],
    to: 'in_progress',
    roles: { maintenance: 'assignee' },
    needs: {},
    label: 'Start work',
  },
  request_recheck: {
    from: ['assigned', 'in_progress'],
    to: 'awaiting_recheck',
    roles: { maintenance: 'assignee' },
    needs: {},
    label: 'Done: ask for a re-check',
  },
  comment: {
    from: ACTIVE_STATUSES,
    to: null,
    roles: { supervisor: 'any', maintenance: 'assignee' },
    needs: { note: true },
    label: 'Add a note',
  },
  add_photo: {
    from: ACTIVE_STATUSES,
    to: null,
    roles: { supervisor: 'any', maintenance: 'assignee' },
    needs: {},
    label: 'Add a photo',
  },
  cancel: {
    from: ACTIVE_STATUSES,
    to: 'cancelled',
    roles: { supervisor: 'any' },
    needs: { reason: true },
    label: 'Cancel order',
  },
  close: {
    from: [],
    to: 'closed',
    roles: {},
    needs: {},
    label: 'Close',
  },
}

export interface OrderState {
  status: WorkOrderStatus
  assigneeId: number | null
}

export interface Actor {
  id: number
  role: Role
}

export type Decision =
  | { ok: true; to: WorkOrderStatus }
  | { ok: false; why: 'role' | 'assignee' | 'status' | 'manual_close'; message: string }

const STATUS_WORDS: Record<WorkOrderStatus, string> = {
  open: 'open',
  assigned: 'assigned',
  in_progress: 'in progress',
  awaiting_recheck: 'awaiting a re-check',
  closed: 'closed',
  cancelled: 'cancelled',
}

export function statusWords(status: WorkOrderStatus): string {
  return STATUS_WORDS[status]
}

/** Whether `actor` may take `action` on an order in `state`, and the status it would lead to. */
export function decide(action: WorkOrderAction, state: OrderState, actor: Actor): Decision {
  const rule = TRANSITIONS[action]
  if (action === 'close') {
    return {
      ok: false,
      why: 'manual_close',
      message: 'A work order cannot be closed by hand: a passing re-check of the camera closes it.',
    }
  }
  const scope = rule.roles[actor.role]
  if (!scope) {
    return { ok: false, why: 'role', message: `The ${actor.role} role may not ${rule.label.toLowerCase()}.` }
  }
  if (scope === 'assignee' && state.assigneeId !== actor.id) {
    return { ok: false, why: 'assignee', message: 'This work order is not assigned to you.' }
  }
  if (!rule.from.includes(state.status)) {
    return {
      ok: false,
      why: 'status',
      message: `"${rule.label}" is not possible while the order is ${STATUS_WORDS[state.status]}.`,
    }
  }
  return { ok: true, to: rule.to ?? state.status }
}

/** The actions the actor may take now, in the table's order (for buttons). */
export function allowedActions(state: OrderState, actor: Actor): WorkOrderAction[] {
  return WORK_ORDER_ACTIONS.filter((a) => decide(a, state, actor).ok)
}

export function isTerminal(status: WorkOrderStatus): boolean {
  return TERMINAL_STATUSES.includes(status)
}
