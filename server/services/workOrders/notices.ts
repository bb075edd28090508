// Who hears about a change, and the outbox rows that tell them. Called inside the change's
// transaction; each notice's dedupeKey names the order, the version the change produced, the
// kind and the recipient, so a notice exists once however often the code runs.
import { and, desc, eq, inArray, isNotNull } from 'drizzle-orm'
import type { DbOrTx } from '../../db/client'
import { cameras, checks, rounds, users, workOrderHistory } from '../../db/schema'
import { enqueueMails } from '../../mail/outbox'
import type { OutboxMail } from '../../mail/outbox'
import type { MailContent } from '../../mail/templates/document'
import {
  assignedMail,
  closedMail,
  recheckDueMail,
  reassignedAwayMail,
  reassignedToMail,
  returnedMail,
} from '../../mail/templates/workOrderMails'
import type { OrderSummary } from '../../mail/templates/workOrderMails'
import { activeUsersOfRole, usersByIds } from './repository'
import type { UserInfo } from './repository'

export interface NoticeContext {
  tx: DbOrTx
  now: Date
  publicUrl: string
}

export const orderUrl = (publicUrl: string, id: number) => `${publicUrl}/work-orders/${id}`

function mail(
  o: OrderSummary,
  version: number,
  kind: string,
  to: UserInfo,
  content: MailContent,
): OutboxMail {
  return {
    ...content,
    to: to.email,
    kind: `work_order.${kind}`,
    dedupeKey: `wo:${o.id}:v${version}:${kind}:${to.id}`,
  }
}

const usable = (u: UserInfo | undefined): u is UserInfo => Boolean(u && u.active)

export async function noticeAssigned(
  c: NoticeContext,
  o: OrderSummary,
  version: number,
  p: { assigneeId: number; byId: number },
) {
  const people = await usersByIds(c.tx, [p.assigneeId, p.byId])
  const to = people.get(p.assigneeId)
  if (!usable(to)) return
  const content = assignedMail(o, {
    assigneeName: to.name,
    byName: people.get(p.byId)?.name ?? 'A supervisor',
    url: orderUrl(c.publicUrl, o.id),
  })
  await enqueueMails(c.tx, [mail(o, version, 'assigned', to, content)], c.now)
}

export async function noticeReassigned(
  c: NoticeContext,
  o: OrderSummary,
  version: number,
  p: { fromId: number | null; toId: number; byId: number; reason: string },
) {
  const people = await usersByIds(c.tx, [p.fromId, p.toId, p.byId])
  const next = people.get(p.toId)
  const prev = p.fromId === null ? undefined : people.get(p.fromId)
  const byName = people.get(p.byId)?.name ?? 'A supervisor'
  const url = orderUrl(c.publicUrl, o.id)
  const out: OutboxMail[] = []
  const nextName = next?.name ?? 'someone else'
  const prevName = prev?.name ?? 'nobody'
  if (usable(next)) {
    const content = reassignedToMail(o, {
      assigneeName: nextName,
      previousName: prevName,
      byName,
      reason: p.reason,
      url,
    })
    out.push(mail(o, version, 'reassigned_to', next, content))
  }
  if (usable(prev)) {
    const content = reassignedAwayMail(o, {
      previousName: prevName,
      assigneeName: nextName,
      byName,
      reason: p.reason,
      url,
    })
    out.push(mail(o, version, 'reassigned_from', prev, content))
  }
  await enqueueMails(c.tx, out, c.now)
}

/** The inspector of the order's latest failing check, if any. */
async function lastFailingInspector(tx: DbOrTx, orderId: number): Promise<number | null> {
  const [row] = await tx
    .select({ inspectorId: checks.inspectorId })
    .from(workOrderHistory)
    .innerJoin(checks, eq(checks.id, workOrderHistory.checkId))
    .where(
      and(
        eq(workOrderHistory.workOrderId, orderId),
        isNotNull(workOrderHistory.checkId),
        inArray(checks.verdict, ['fail', 'marginal']),
      ),
    )
    .orderBy(desc(workOrderHistory.id))
    .limit(1)
  return row?.inspectorId ?? null
}

/** Inspectors who work at the site: a round there, or a check of one of its cameras. */
async function siteInspectors(tx: DbOrTx, cameraId: number): Promise<UserInfo[]> {
  const [cam] = await tx.select({ siteId: cameras.siteId }).from(cameras).where(eq(cameras.id, cameraId))
  if (!cam) return []
  const fromRounds = await tx
    .selectDistinct({ id: rounds.assigneeId })
    .from(rounds)
    .where(eq(rounds.siteId, cam.siteId))
  const fromChecks = await tx
    .selectDistinct({ id: checks.inspectorId })
    .from(checks)
    .innerJoin(cameras, eq(cameras.id, checks.cameraId))
    .where(eq(cameras.siteId, cam.siteId))
  const ids = [...fromRounds, ...fromChecks].map((r) => r.id)
  const people = await usersByIds(tx, ids)
  return [...people.values()].filter((u) => u.active && u.role === 'inspector')
}

/**
 * The re-check is due: tell the inspector who made the failing check, or, when that is not
 * known (an order opened by hand) or the person has left, every inspector of the site.
 */
export async function noticeRecheckDue(
  c: NoticeContext,
  o: OrderSummary & { cameraId: number },
  version: number,
  p: { assigneeId: number | null; note: string | null },
) {
  const inspectorId = await lastFailingInspector(c.tx, o.id)
  const people = await usersByIds(c.tx, [inspectorId, p.assigneeId])
  const known = inspectorId === null ? undefined : people.get(inspectorId)
  let recipients: UserInfo[] = usable(known) ? [known] : await siteInspectors(c.tx, o.cameraId)
  if (!recipients.length) recipients = await activeUsersOfRole(c.tx, 'inspector')
  const assigneeName = p.assigneeId === null ? null : (people.get(p.assigneeId)?.name ?? null)
  const url = orderUrl(c.publicUrl, o.id)
  const out = recipients.map((to) =>
    mail(o, version, 'recheck_due', to, recheckDueMail(o, { inspectorName: to.name, assigneeName, note: p.note, url })),
  )
  await enqueueMails(c.tx, out, c.now)
}

/** Closed: tell the supervisor who last assigned it, or every supervisor when nobody did. */
export async function noticeClosed(
  c: NoticeContext,
  o: OrderSummary,
  version: number,
  p: { checkId: string; inspectorId: number },
) {
  const [last] = await c.tx
    .select({ actorId: workOrderHistory.actorId })
    .from(workOrderHistory)
    .innerJoin(users, eq(users.id, workOrderHistory.actorId))
    .where(
      and(
        eq(workOrderHistory.workOrderId, o.id),
        inArray(workOrderHistory.action, ['assigned', 'reassigned']),
        eq(users.role, 'supervisor'),
      ),
    )
    .orderBy(desc(workOrderHistory.id))
    .limit(1)
  const people = await usersByIds(c.tx, [last?.actorId, p.inspectorId])
  const assigner = last?.actorId ? people.get(last.actorId) : undefined
  const recipients = usable(assigner) ? [assigner] : await activeUsersOfRole(c.tx, 'supervisor')
  const inspectorName = people.get(p.inspectorId)?.name ?? 'An inspector'
  const url = orderUrl(c.publicUrl, o.id)
  const out = recipients.map((to) =>
    mail(o, version, 'closed', to, closedMail(o, { supervisorName: to.name, inspectorName, checkId: p.checkId, url })),
  )
  await enqueueMails(c.tx, out, c.now)
}

/** A re-check did not pass: the order is back with its assignee. */
export async function noticeReturned(
  c: NoticeContext,
  o: OrderSummary,
  version: number,
  p: { assigneeId: number | null; inspectorId: number; reasons: string },
) {
  if (p.assigneeId === null) return
  const people = await usersByIds(c.tx, [p.assigneeId, p.inspectorId])
  const to = people.get(p.assigneeId)
  if (!usable(to)) return
  const content = returnedMail(o, {
    assigneeName: to.name,
    inspectorName: people.get(p.inspectorId)?.name ?? 'An inspector',
    reasons: p.reasons,
    url: orderUrl(c.publicUrl, o.id),
  })
  await enqueueMails(c.tx, [mail(o, version, 'returned', to, content)], c.now)
}
