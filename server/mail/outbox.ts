// The transactional outbox: a notice is a row written in the same transaction as the change it
// reports, so it exists exactly when the change does. `dedupeKey` is unique: writing the same
// notice twice (a replayed operation, a second digest run) keeps the first row and adds nothing.
import { sql } from 'drizzle-orm'
import type { DbOrTx } from '../db/client'
import { mailOutbox } from '../db/schema'
import type { MailContent } from './templates/document'

export interface OutboxMail extends MailContent {
  to: string
  dedupeKey: string
  /** What it is about, e.g. 'work_order.assigned'. */
  kind: string
}

/** Inserts the mails; ones whose dedupeKey exists already are left as they are. */
export async function enqueueMails(tx: DbOrTx, mails: readonly OutboxMail[], now: Date): Promise<void> {
  if (!mails.length) return
  await tx
    .insert(mailOutbox)
    .values(
      mails.map((m) => ({
        toAddress: m.to,
        subject: m.subject,
        text: m.text,
        html: m.html,
        dedupeKey: m.dedupeKey.slice(0, 191),
        kind: m.kind,
        nextAttemptAt: now,
        createdAt: now,
      })),
    )
    .onDuplicateKeyUpdate({ set: { dedupeKey: sql`${mailOutbox.dedupeKey}` } })
}
