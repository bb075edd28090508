// The work-order notices and the overdue digest, worded for the person who receives them.
import type { Priority, WorkOrderStatus } from '../../../shared/schemas/enums'
import { statusWords } from '../../../shared/workOrders/transitions'
import { renderMail } from './document'
import type { MailContent, MailDoc, MailFact } from './document'

export interface OrderSummary {
  id: number
  title: string
  assetTag: string
  siteName: string
  locationText: string
  priority: Priority
  status: WorkOrderStatus
  dueAt: Date | null
}

const PRIORITY_WORDS: Record<Priority, string> = {
  low: 'Low',
  normal: 'Normal',
  high: 'High',
  urgent: 'Urgent',
}

/** A date as people read it in a mail: "12 Jun 2024, 14:05 UTC". */
export function mailDate(d: Date | null): string {
  if (!d) return 'not set'
  const day = d.toLocaleDateString('en-GB', {
    day: 'numeric',
    month: 'short',
    year: 'numeric',
    timeZone: 'UTC',
  })
  const time = d.toLocaleTimeString('en-GB', { hour: '2-digit', minute: '2-digit', timeZone: 'UTC' })
  return `${day}, ${time} UTC`
}

function facts(o: OrderSummary): MailFact[] {
  return [
    { label: 'Work order', value: `#${o.id} ${o.title}` },
    { label: 'Camera', value: o.assetTag },
    { label: 'Site', value: o.siteName },
    { label: 'Where', value: o.locationText || '—' },
    { label: 'Priority', value: PRIORITY_WORDS[o.priority] },
    { label: 'Due', value: mailDate(o.dueAt) },
    { label: 'Status', value: statusWords(o.status) },
  ]
}

const open = (url: string) => ({ label: 'Open the work order', url })
const SAFETY =
  'Before work at height or inside a housing: isolate and verify the power, and follow local codes and your employer’s procedures.'

export function assignedMail(
  o: OrderSummary,
  p: { assigneeName: string; byName: string; url: string },
): MailContent {
  const doc: MailDoc = {
    heading: `Work order #${o.id} is assigned to you`,
    paragraphs: [
      `Hello ${p.assigneeName},`,
      `${p.byName} assigned you work order #${o.id} for camera ${o.assetTag}. When the work is done, ask for a re-check in the app.`,
      SAFETY,
    ],
    facts: facts(o),
    action: open(p.url),
  }
  return renderMail(`Work order #${o.id} assigned to you: ${o.assetTag}`, doc)
}

export function reassignedToMail(
  o: OrderSummary,
  p: { assigneeName: string; previousName: string; byName: string; reason: string; url: string },
): MailContent {
  const doc: MailDoc = {
    heading: `Work order #${o.id} is now yours`,
    paragraphs: [
      `Hello ${p.assigneeName},`,
      `${p.byName} moved work order #${o.id} for camera ${o.assetTag} from ${p.previousName} to you.`,
      SAFETY,
    ],
    facts: facts(o),
    quote: { label: 'Reason', text: p.reason },
    action: open(p.url),
  }
  return renderMail(`Work order #${o.id} reassigned to you: ${o.assetTag}`, doc)
}

export function reassignedAwayMail(
  o: OrderSummary,
  p: { previousName: string; assigneeName: string; byName: string; reason: string; url: string },
): MailContent {
  const doc: MailDoc = {
    heading: `Work order #${o.id} is no longer yours`,
    paragraphs: [
      `Hello ${p.previousName},`,
      `${p.byName} moved work order #${o.id} for camera ${o.assetTag} to ${p.assigneeName}. You need not do anything more on it.`,
    ],
    facts: facts(o),
    quote: { label: 'Reason', text: p.reason },
    action: open(p.url),
  }
  return renderMail(`Work order #${o.id} moved to ${p.assigneeName}`, doc)
}

export function recheckDueMail(
  o: OrderSummary,
  p: { inspectorName: string; assigneeName: string | null; note: string | null; url: string },
): MailContent {
  const doc: MailDoc = {
    heading: `Camera ${o.assetTag} is ready for a re-check`,
    paragraphs: [
      `Hello ${p.inspectorName},`,
      `${p.assigneeName ?? 'Maintenance'} finished the work on order #${o.id} and asks for a re-check of camera ${o.assetTag}. A passing check closes the order; a failing one sends it back.`,
    ],
    facts: facts(o),
    quote: p.note ? { label: 'Note from maintenance', text: p.note } : undefined,
    action: open(p.url),
  }
  return renderMail(`Re-check due: camera ${o.assetTag} (work order #${o.id})`, doc)
}

export function closedMail(
  o: OrderSummary,
  p: { supervisorName: string; inspectorName: string; checkId: string; url: string },
): MailContent {
  const doc: MailDoc = {
    heading: `Work order #${o.id} is closed`,
    paragraphs: [
      `Hello ${p.supervisorName},`,
      `${p.inspectorName} re-checked camera ${o.assetTag} and it passed, so work order #${o.id} is closed.`,
    ],
    facts: [...facts(o), { label: 'Closing check', value: p.checkId }],
    action: open(p.url),
  }
  return renderMail(`Work order #${o.id} closed: ${o.assetTag} passed its re-check`, doc)
}

export function returnedMail(
  o: OrderSummary,
  p: { assigneeName: string; inspectorName: string; reasons: string; url: string },
): MailContent {
  const doc: MailDoc = {
    heading: `Work order #${o.id} is back with you`,
    paragraphs: [
      `Hello ${p.assigneeName},`,
      `${p.inspectorName} re-checked camera ${o.assetTag} and it did not pass, so work order #${o.id} is assigned to you again.`,
      SAFETY,
    ],
    facts: facts(o),
    quote: { label: 'What the re-check found', text: p.reasons },
    action: open(p.url),
  }
  return renderMail(`Re-check did not pass: work order #${o.id} (${o.assetTag}) is back with you`, doc)
}

export function digestMail(
  orders: OrderSummary[],
  p: { supervisorName: string; day: string; now: Date; listUrl: string; orderUrl: (id: number) => string },
): MailContent {
  const days = (o: OrderSummary) =>
    o.dueAt ? Math.max(1, Math.floor((p.now.getTime() - o.dueAt.getTime()) / 86_400_000)) : 0
  const doc: MailDoc = {
    heading: `${orders.length} overdue work order${orders.length === 1 ? '' : 's'}`,
    paragraphs: [
      `Hello ${p.supervisorName},`,
      `These work orders are past their due date and not yet closed (as of ${mailDate(p.now)}).`,
    ],
    list: {
      heading: 'Overdue, longest first',
      items: orders.map((o) => ({
        text: `#${o.id} ${o.assetTag} at ${o.siteName}: ${statusWords(o.status)}, ${PRIORITY_WORDS[o.priority].toLowerCase()} priority, ${days(o)} day${days(o) === 1 ? '' : 's'} overdue (due ${mailDate(o.dueAt)})`,
        url: p.orderUrl(o.id),
      })),
    },
    action: { label: 'Open the work orders', url: p.listUrl },
  }
  return renderMail(`Overdue work orders, ${p.day}: ${orders.length}`, doc)
}
