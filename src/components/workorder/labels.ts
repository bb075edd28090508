// Words for work-order statuses, priorities and history entries, as people read them.
import type { Priority, WorkOrderStatus } from '@shared/schemas/enums'
import type { WorkOrderHistoryEntry } from '@shared/schemas/workOrders'
import type { TagLook } from '@/components/common/labelTag'

export const STATUS_LOOK: Record<WorkOrderStatus, TagLook> = {
  open: { label: 'Open', icon: 'warning-o', tone: 'amber-soft' },
  assigned: { label: 'Assigned', icon: 'manager-o', tone: 'teal-outline' },
  in_progress: { label: 'In progress', icon: 'setting-o', tone: 'teal-soft-light-edge' },
  awaiting_recheck: { label: 'Awaiting re-check', icon: 'eye-o', tone: 'teal-solid' },
  closed: { label: 'Closed', icon: 'success', tone: 'green-soft' },
  cancelled: { label: 'Cancelled', icon: 'cross', tone: 'grey-struck' },
}

export const PRIORITY_LABEL: Record<Priority, string> = {
  low: 'Low',
  normal: 'Normal',
  high: 'High',
  urgent: 'Urgent',
}

/** Status filter chips of the list, in order. */
export const STATUS_FILTERS: { value: WorkOrderStatus | 'active' | 'all'; label: string }[] = [
  { value: 'active', label: 'Active' },
  { value: 'open', label: 'Open' },
  { value: 'assigned', label: 'Assigned' },
  { value: 'in_progress', label: 'In progress' },
  { value: 'awaiting_recheck', label: 'Awaiting re-check' },
  { value: 'closed', label: 'Closed' },
  { value: 'cancelled', label: 'Cancelled' },
  { value: 'all', label: 'All' },
]

const who = (e: WorkOrderHistoryEntry) => e.actorName ?? 'Sharpfield'

/** One sentence for a history entry: who did what (the why is shown beside it). */
export function historySentence(e: WorkOrderHistoryEntry): string {
  switch (e.action) {
    case 'opened':
      return e.checkId ? `${who(e)} recorded a failing check; the order was opened.` : `${who(e)} opened the order.`
    case 'assigned':
      return `${who(e)} assigned it to ${e.toAssigneeName ?? 'someone'}.`
    case 'reassigned':
      return `${who(e)} moved it from ${e.fromAssigneeName ?? 'nobody'} to ${e.toAssigneeName ?? 'someone'}.`
    case 'started':
      return `${who(e)} started work.`
    case 'recheck_requested':
    case 'request_recheck':
      return `${who(e)} finished and asked for a re-check.`
    case 'comment':
      return `${who(e)} added a note.`
    case 'photo':
      return `${who(e)} added a photo.`
    case 'cancelled':
    case 'cancel':
      return `${who(e)} cancelled the order.`
    case 'closed':
      return `${who(e)}'s re-check passed; the order is closed.`
    case 'recheck_failed':
      return `${who(e)}'s re-check did not pass; back to ${e.toAssigneeName ?? 'the assignee'}.`
    case 'check_fail':
      return `${who(e)} recorded another failing check.`
    case 'check_pass':
      return `${who(e)} recorded a passing check.`
    case 'check_marginal':
      return `${who(e)} recorded a marginal check.`
    default:
      if (e.fromStatus && e.toStatus && e.fromStatus !== e.toStatus)
        return `${who(e)} moved it from ${STATUS_LOOK[e.fromStatus].label.toLowerCase()} to ${STATUS_LOOK[e.toStatus].label.toLowerCase()}.`
      return `${who(e)}: ${e.action.replace(/_/g, ' ')}.`
  }
}
