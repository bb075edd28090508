// The server's background jobs: drain the mail outbox, and queue the daily overdue digest.
import type { Config } from '../config'
import type { Db } from '../db/client'
import type { Logger } from '../errors'
import { createOutboxSender } from '../mail/sender'
import { createMailTransport } from '../mail/transport'
import { digestIfDue } from '../services/workOrders/digest'
import { createScheduler } from './scheduler'
import type { Scheduler } from './scheduler'

export const MAIL_JOB = 'mail-outbox'
export const DIGEST_JOB = 'overdue-digest'
export const RETENTION_JOB = 'attachment-retention'

/** Full frames are deleted once FRAME_RETENTION_DAYS have passed (checked hourly). */
function retentionJob(attachments: { purgeExpired(): Promise<number> }, logger: Logger) {
  return {
    name: RETENTION_JOB,
    intervalMs: 60 * 60_000,
    async run() {
      const n = await attachments.purgeExpired()
      if (n) logger.info(`retention: ${n} expired frame(s) deleted`)
    },
  }
}

export interface JobOptions {
  db: Db
  config: Pick<Config, 'smtp' | 'mailFrom' | 'publicUrl'>
  logger: Logger
  now?: () => Date
  /** How often the outbox is drained (default 3 s). */
  mailIntervalMs?: number
  /** How often the digest is considered (default 10 min); it is queued once a day. */
  digestIntervalMs?: number
  /** Hour of the day (UTC) from which the day's digest goes out (default 7). */
  digestHourUtc?: number
  /** Deletes uploaded frames past their retention date (run hourly when given). */
  attachments?: { purgeExpired(): Promise<number> }
}

export function createBackgroundJobs(o: JobOptions): Scheduler {
  const now = o.now ?? (() => new Date())
  const sender = createOutboxSender({
    db: o.db,
    transport: createMailTransport(o.config.smtp),
    from: o.config.mailFrom,
    now,
  })
  return createScheduler(
    [
      {
        name: MAIL_JOB,
        intervalMs: o.mailIntervalMs ?? 3_000,
        async run() {
          const r = await sender.drainOnce()
          if (r.sent || r.retrying || r.failed)
            o.logger.info(`mail: ${r.sent} sent, ${r.retrying} to retry, ${r.failed} given up`)
        },
      },
      {
        name: DIGEST_JOB,
        intervalMs: o.digestIntervalMs ?? 10 * 60_000,
        run: () =>
          digestIfDue(o.db, { now: now(), publicUrl: o.config.publicUrl, hourUtc: o.digestHourUtc ?? 7 }),
      },
      ...(o.attachments ? [retentionJob(o.attachments, o.logger)] : []),
    ],
    o.logger,
  )
}
