// Drains the outbox: claims due rows, sends each through the SMTP transport, marks it sent, or
// records the failure and schedules the next try with exponential back-off.
//
// Several API replicas may drain at once. A sender first claims rows with one UPDATE that only
// takes pending, due rows nobody holds (or whose holder's lease ran out), under a fresh token,
// then reads back exactly its own rows: two senders never hold the same row, so each mail goes
// to the SMTP server once. The one gap left is a process dying between the server's "accepted"
// and the "sent" mark; the row is then tried again after the lease, and its Message-ID stays the
// same so a receiving system can drop the repeat.
import { createHash, randomUUID } from 'node:crypto'
import { and, eq, sql } from 'drizzle-orm'
import type { Transporter } from 'nodemailer'
import type { Db } from '../db/client'
import { mailOutbox } from '../db/schema'
import { retryDelayMs } from './backoff'
import type { BackoffOptions } from './backoff'

type OutboxRow = typeof mailOutbox.$inferSelect

export interface SenderOptions {
  db: Db
  transport: Pick<Transporter, 'sendMail'>
  /** The From header, e.g. `Sharpfield <noreply@sharpfield.test>`. */
  from: string
  now?: () => Date
  /** Rows claimed per round (default 10). */
  batchSize?: number
  /** Rounds per drain at most (default 10). */
  maxBatches?: number
  /** How long a claim holds before another sender may take the row over (default 10 min). */
  leaseMs?: number
  backoff?: BackoffOptions
}

export interface DrainResult {
  sent: number
  retrying: number
  failed: number
}

export interface OutboxSender {
  drainOnce(): Promise<DrainResult>
}

/** SMTP answers that will not change on a retry: the recipient does not exist or is refused. */
function isPermanent(err: unknown): boolean {
  const code = (err as { responseCode?: unknown }).responseCode
  return typeof code === 'number' && code >= 550 && code <= 553
}

/** No SMTP conversation took place (refused, timed out, DNS): the rest of the batch would fail too. */
function isUnreachable(err: unknown): boolean {
  return typeof (err as { responseCode?: unknown }).responseCode !== 'number'
}

function errorText(err: unknown): string {
  const e = err as { code?: unknown; responseCode?: unknown; message?: unknown }
  const parts = [e.code, e.responseCode, e.message].filter((x) => x !== undefined && x !== '')
  return (parts.join(' ') || 'unknown error').slice(0, 2000)
}

function messageId(dedupeKey: string, from: string): string {
  const domain = /@([A-Za-z0-9.-]+)/.exec(from)?.[1] ?? 'sharpfield.invalid'
  return `<${createHash('sha256').update(dedupeKey).digest('hex').slice(0, 40)}@${domain}>`
}

export function createOutboxSender(options: SenderOptions): OutboxSender {
  const { db, transport, from } = options
  const now = options.now ?? (() => new Date())
  const batchSize = options.batchSize ?? 10
  const maxBatches = options.maxBatches ?? 10
  const leaseMs = options.leaseMs ?? 10 * 60_000

  async function claim(token: string): Promise<{ rows: OutboxRow[]; until: Date }> {
    const t = now()
    const until = new Date(t.getTime() + leaseMs)
    await db.execute(sql`
      update ${mailOutbox}
         set ${mailOutbox.claimToken} = ${token}, ${mailOutbox.claimedUntil} = ${until}
       where ${mailOutbox.status} = 'pending'
         and ${mailOutbox.nextAttemptAt} <= ${t}
         and (${mailOutbox.claimedUntil} is null or ${mailOutbox.claimedUntil} < ${t})
       order by ${mailOutbox.nextAttemptAt}, ${mailOutbox.id}
       limit ${batchSize}`)
    const rows = await db
      .select()
      .from(mailOutbox)
      .where(eq(mailOutbox.claimToken, token))
      .orderBy(mailOutbox.id)
    return { rows, until }
  }

  const mine = (row: OutboxRow, token: string) =>
    and(eq(mailOutbox.id, row.id), eq(mailOutbox.claimToken, token))

  async function markSent(row: OutboxRow, token: string): Promise<void> {
    await db
      .update(mailOutbox)
      .set({
        status: 'sent',
        sentAt: now(),
        attempts: row.attempts + 1,
        lastError: null,
        claimToken: null,
        claimedUntil: null,
      })
      .where(mine(row, token))
  }

  /** Records a failed try: retry later with back-off, or give up. Returns whether it gave up. */
  async function markFailed(row: OutboxRow, token: string, error: string, permanent: boolean) {
    const attempts = row.attempts + 1
    const delay = permanent ? null : retryDelayMs(attempts, options.backoff)
    await db
      .update(mailOutbox)
      .set({
        status: delay === null ? 'failed' : 'pending',
        attempts,
        lastError: error,
        nextAttemptAt: new Date(now().getTime() + (delay ?? 0)),
        claimToken: null,
        claimedUntil: null,
      })
      .where(mine(row, token))
    return delay === null
  }

  async function release(row: OutboxRow, token: string): Promise<void> {
    await db.update(mailOutbox).set({ claimToken: null, claimedUntil: null }).where(mine(row, token))
  }

  async function drainOnce(): Promise<DrainResult> {
    const result: DrainResult = { sent: 0, retrying: 0, failed: 0 }
    for (let round = 0; round < maxBatches; round++) {
      const token = randomUUID()
      const { rows, until } = await claim(token)
      if (!rows.length) break
      let down: string | null = null
      for (const row of rows) {
        if (down !== null) {
          // The server could not be reached a moment ago: count this as the same failed try.
          if (await markFailed(row, token, `not tried: ${down}`, false)) result.failed++
          else result.retrying++
          continue
        }
        if (now().getTime() > until.getTime() - 5_000) {
          await release(row, token) // too close to the lease's end to send safely
          continue
        }
        try {
          await transport.sendMail({
            from,
            to: row.toAddress,
            subject: row.subject,
            text: row.text,
            html: row.html ?? undefined,
            messageId: messageId(row.dedupeKey, from),
          })
          await markSent(row, token)
          result.sent++
        } catch (err) {
          const error = errorText(err)
          if (await markFailed(row, token, error, isPermanent(err))) result.failed++
          else result.retrying++
          if (isUnreachable(err)) down = error
        }
      }
      if (down !== null || rows.length < batchSize) break
    }
    return result
  }

  return { drainOnce }
}
