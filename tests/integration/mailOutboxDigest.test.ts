// The daily digest of overdue work orders: one mail per active supervisor per day, listing the
// orders past their due date that are neither closed nor cancelled, delivered through SMTP.
import { mkdtempSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { eq } from 'drizzle-orm'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { mailOutbox, users, workOrders } from '../../server/db/schema'
import { createBackgroundJobs, DIGEST_JOB, MAIL_JOB } from '../../server/jobs'
import { startFakeSmtp } from '../../server/mail/fakeSmtp'
import type { FakeSmtp } from '../../server/mail/fakeSmtp'
import { readMailbox } from '../../server/mail/mailbox'
import { digestIfDue, enqueueOverdueDigest } from '../../server/services/workOrders/digest'
import { createTestDatabase } from './helpers/db'
import type { TestDatabase } from './helpers/db'
import { api, buildWorld } from './helpers/workOrderWorld'
import type { World } from './helpers/workOrderWorld'

let tdb: TestDatabase
let w: World
let smtp: FakeSmtp
let dir: string
const ids: Record<string, number> = {}
const DAY = 86_400_000

beforeAll(async () => {
  tdb = await createTestDatabase()
  w = await buildWorld(tdb.db)
  dir = join(mkdtempSync(join(tmpdir(), 'sf-digest-')), 'mailbox')
  smtp = await startFakeSmtp({ port: 0, mailboxDir: dir })
  const open = async (cameraId: number, dueAt: Date) =>
    (await api(w, 'supervisor').post('/api/work-orders', { cameraId, dueAt: dueAt.toISOString() })).body
  const now = Date.now()
  ids.late2 = (await open(w.cameraIds[0], new Date(now - 2 * DAY))).id
  ids.late5 = (await open(w.cameraIds[1], new Date(now - 5 * DAY))).id
  ids.future = (await open(w.cameraIds[2], new Date(now + 2 * DAY))).id
  const cancelled = await open(w.cameraIds[3], new Date(now - 9 * DAY))
  ids.cancelled = cancelled.id
  await api(w, 'supervisor').act(cancelled.id, { action: 'cancel', version: cancelled.version, reason: 'Duplicate.' })
  // A supervisor who has left gets nothing.
  await tdb.db.update(users).set({ active: false }).where(eq(users.id, w.users.supervisor2.id))
})
afterAll(async () => {
  await smtp?.close()
  await tdb?.drop()
})

describe('overdue digest', () => {
  it('is not queued before the sending hour', async () => {
    const early = new Date(Date.UTC(2031, 0, 5, 5, 0))
    expect(await digestIfDue(tdb.db, { now: early, publicUrl: w.config.publicUrl, hourUtc: 7 })).toBeNull()
  })

  it('lists the overdue orders, longest overdue first, to each active supervisor, once a day', async () => {
    const now = new Date()
    const r = await enqueueOverdueDigest(tdb.db, { now, publicUrl: w.config.publicUrl })
    expect(r).toEqual({ day: now.toISOString().slice(0, 10), overdue: 2, recipients: 1 })
    // Running again the same day adds nothing.
    await enqueueOverdueDigest(tdb.db, { now: new Date(now.getTime() + 3_600_000 * 0.1), publicUrl: w.config.publicUrl })
    const rows = await tdb.db.select().from(mailOutbox).where(eq(mailOutbox.kind, 'digest.overdue'))
    expect(rows.map((m) => m.toAddress)).toEqual([w.users.supervisor.email])
    const text = rows[0].text
    expect(rows[0].subject).toBe(`Overdue work orders, ${r.day}: 2`)
    expect(text.indexOf(`#${ids.late5} `)).toBeGreaterThan(-1)
    expect(text.indexOf(`#${ids.late5} `)).toBeLessThan(text.indexOf(`#${ids.late2} `))
    expect(text).toContain('5 days overdue')
    expect(text).toContain('2 days overdue')
    expect(text).not.toContain(`#${ids.future} `)
    expect(text).not.toContain(`#${ids.cancelled} `)
    expect(rows[0].html).toContain(`https://sharpfield.example.test/work-orders/${ids.late5}`)
  })

  it('the background jobs queue and deliver it through SMTP, once', async () => {
    await tdb.db.delete(mailOutbox).where(eq(mailOutbox.kind, 'digest.overdue'))
    const jobs = createBackgroundJobs({
      db: tdb.db,
      config: { ...w.config, smtp: { ...w.config.smtp, host: smtp.host, port: smtp.port } },
      logger: { info: () => {}, error: (m, e) => console.error(m, e) },
      digestHourUtc: 0,
      mailIntervalMs: 60_000,
      digestIntervalMs: 60_000,
    })
    try {
      await jobs.runNow(DIGEST_JOB)
      await jobs.runNow(MAIL_JOB)
      await jobs.runNow(DIGEST_JOB)
      await jobs.runNow(MAIL_JOB)
    } finally {
      await jobs.stop()
    }
    const digests = (await readMailbox(dir)).filter((m) => m.subject.startsWith('Overdue work orders'))
    expect(digests.map((m) => m.to)).toEqual([w.users.supervisor.email])
    expect(digests[0].text).toContain('2 overdue work orders')
    const [row] = await tdb.db.select().from(mailOutbox).where(eq(mailOutbox.kind, 'digest.overdue'))
    expect(row.status).toBe('sent')
    const [late] = await tdb.db.select().from(workOrders).where(eq(workOrders.id, ids.late5))
    expect(late.status).toBe('open') // the digest changes no order
  })
})
