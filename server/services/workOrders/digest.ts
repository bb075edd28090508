// The daily digest of overdue work orders, one mail per active supervisor per (UTC) day. Safe to
// run as often as the scheduler likes: the dedupeKey holds the day, so a day's digest exists once.
import { and, asc, inArray, isNotNull, lt } from 'drizzle-orm'
import { ACTIVE_STATUSES } from '../../../shared/workOrders/transitions'
import type { Db } from '../../db/client'
import { workOrders } from '../../db/schema'
import { enqueueMails } from '../../mail/outbox'
import { digestMail } from '../../mail/templates/workOrderMails'
import { orderUrl } from './notices'
import { activeUsersOfRole, selectOrders, toSummary } from './repository'

export interface DigestResult {
  day: string
  overdue: number
  recipients: number
}

export async function enqueueOverdueDigest(
  db: Db,
  p: { now: Date; publicUrl: string },
): Promise<DigestResult> {
  const day = p.now.toISOString().slice(0, 10)
  return db.transaction(async (tx) => {
    const rows = await selectOrders(
      tx,
      and(
        inArray(workOrders.status, [...ACTIVE_STATUSES]),
        isNotNull(workOrders.dueAt),
        lt(workOrders.dueAt, p.now),
      ),
    ).orderBy(asc(workOrders.dueAt), asc(workOrders.id))
    if (!rows.length) return { day, overdue: 0, recipients: 0 }
    const orders = rows.map(toSummary)
    const supervisors = await activeUsersOfRole(tx, 'supervisor')
    await enqueueMails(
      tx,
      supervisors.map((s) => ({
        ...digestMail(orders, {
          supervisorName: s.name,
          day,
          now: p.now,
          listUrl: `${p.publicUrl}/work-orders?overdue=true`,
          orderUrl: (id) => orderUrl(p.publicUrl, id),
        }),
        to: s.email,
        kind: 'digest.overdue',
        dedupeKey: `digest:${day}:${s.id}`,
      })),
      p.now,
    )
    return { day, overdue: orders.length, recipients: supervisors.length }
  })
}

/** Runs the digest once the day's sending hour (UTC) has come. */
export async function digestIfDue(
  db: Db,
  p: { now: Date; publicUrl: string; hourUtc: number },
): Promise<DigestResult | null> {
  if (p.now.getUTCHours() < p.hourUtc) return null
  return enqueueOverdueDigest(db, p)
}
