// Work-order e-mail through the transactional outbox: who is told what, each notice once, and
// delivery through a real SMTP conversation (the local fake) that survives the server being down.
import { createServer } from 'node:net'
import { mkdtempSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { asc, eq, gt } from 'drizzle-orm'
import { SMTPServer } from 'smtp-server'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { mailOutbox } from '../../server/db/schema'
import { startFakeSmtp } from '../../server/mail/fakeSmtp'
import type { FakeSmtp } from '../../server/mail/fakeSmtp'
import { readMailbox } from '../../server/mail/mailbox'
import { enqueueMails } from '../../server/mail/outbox'
import { createOutboxSender } from '../../server/mail/sender'
import { createMailTransport } from '../../server/mail/transport'
import { workOrderDetailSchema } from '../../shared/schemas/workOrders'
import type { WorkOrderDetail } from '../../shared/schemas/workOrders'
import { createTestDatabase } from './helpers/db'
import type { TestDatabase } from './helpers/db'
import { api, buildWorld, openOrderOf, recordTestCheck } from './helpers/workOrderWorld'
import type { Person, World } from './helpers/workOrderWorld'

let tdb: TestDatabase
let w: World
const closers: (() => Promise<void>)[] = []

beforeAll(async () => {
  tdb = await createTestDatabase()
  w = await buildWorld(tdb.db)
})
afterAll(async () => {
  for (const close of closers) await close()
  await tdb?.drop()
})

async function act(who: Person, o: WorkOrderDetail, body: object): Promise<WorkOrderDetail> {
  const res = await api(w, who).act(o.id, { version: o.version, ...body })
  expect(res.status, JSON.stringify(res.body)).toBe(200)
  return workOrderDetailSchema.parse(res.body)
}

/** Outbox rows written after `afterId`, as [kind, recipient]. */
async function newMails(afterId: number) {
  const rows = await tdb.db.select().from(mailOutbox).where(gt(mailOutbox.id, afterId)).orderBy(asc(mailOutbox.id))
  return rows
}
async function lastMailId(): Promise<number> {
  const rows = await tdb.db.select({ id: mailOutbox.id }).from(mailOutbox)
  return rows.reduce((m, r) => Math.max(m, r.id), 0)
}

function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const probe = createServer()
    probe.once('error', reject)
    probe.listen(0, '127.0.0.1', () => {
      const { port } = probe.address() as { port: number }
      probe.close(() => resolve(port))
    })
  })
}

describe('who is told what', () => {
  it('assignment, reassignment, re-check due and closure each write their notices, once', async () => {
    const cam = w.cameraIds[0]
    await recordTestCheck(w, 'inspector2', cam, 'fail')
    let o = workOrderDetailSchema.parse((await api(w, 'supervisor').get(`/api/work-orders/${await openOrderOf(tdb.db, cam)}`)).body)

    let mark = await lastMailId()
    o = await act('supervisor', o, { action: 'assign', assigneeId: w.users.maint1.id })
    let mails = await newMails(mark)
    expect(mails.map((m) => [m.kind, m.toAddress])).toEqual([['work_order.assigned', w.users.maint1.email]])
    expect(mails[0].subject).toBe(`Work order #${o.id} assigned to you: ${o.assetTag}`)
    expect(mails[0].text).toContain('Hello Piet Alvarez')
    expect(mails[0].text).toContain(`https://sharpfield.example.test/work-orders/${o.id}`)
    expect(mails[0].text).toContain('isolate and verify the power')

    mark = await lastMailId()
    o = await act('supervisor2', o, { action: 'reassign', assigneeId: w.users.maint2.id, reason: 'Piet <b>is</b> on leave & away.' })
    mails = await newMails(mark)
    expect(mails.map((m) => [m.kind, m.toAddress])).toEqual([
      ['work_order.reassigned_to', w.users.maint2.email],
      ['work_order.reassigned_from', w.users.maint1.email],
    ])
    // User text is escaped in HTML and kept as written in the plain text.
    expect(mails[0].html).toContain('Piet &lt;b&gt;is&lt;/b&gt; on leave &amp; away.')
    expect(mails[0].html).not.toContain('<b>is</b>')
    expect(mails[0].text).toContain('> Piet <b>is</b> on leave & away.')
    expect(mails[1].text).toContain('moved work order')

    o = await act('maint2', o, { action: 'start' })
    mark = await lastMailId()
    o = await act('maint2', o, { action: 'request_recheck', note: 'Refocused at 12 m.' })
    mails = await newMails(mark)
    // The inspector who made the failing check, and only that one.
    expect(mails.map((m) => [m.kind, m.toAddress])).toEqual([['work_order.recheck_due', w.users.inspector2.email]])
    expect(mails[0].text).toContain('Refocused at 12 m.')

    mark = await lastMailId()
    await recordTestCheck(w, 'inspector', cam, 'pass')
    mails = await newMails(mark)
    // The supervisor who last assigned it (supervisor2 reassigned it), not every supervisor.
    expect(mails.map((m) => [m.kind, m.toAddress])).toEqual([['work_order.closed', w.users.supervisor2.email]])
    expect(mails[0].text).toContain('Jonas Ekwueme re-checked camera')
  })

  it('an order opened by hand asks the inspectors of its site for the re-check', async () => {
    // Only inspector2 has worked at the second site.
    await recordTestCheck(w, 'inspector2', w.otherCamera, 'pass')
    let o = workOrderDetailSchema.parse((await api(w, 'supervisor').post('/api/work-orders', { cameraId: w.otherCamera })).body)
    o = await act('supervisor', o, { action: 'assign', assigneeId: w.users.maint1.id })
    const mark = await lastMailId()
    o = await act('maint1', o, { action: 'request_recheck' })
    expect(o.status).toBe('awaiting_recheck')
    const mails = await newMails(mark)
    expect(mails.map((m) => [m.kind, m.toAddress])).toEqual([['work_order.recheck_due', w.users.inspector2.email]])
  })

  it('a notice with the same dedupe key is stored once', async () => {
    const mail = { to: 'x@sharpfield.test', subject: 's', text: 't', html: '<p>t</p>', kind: 'test', dedupeKey: 'test:once' }
    await enqueueMails(tdb.db, [mail], new Date())
    await enqueueMails(tdb.db, [{ ...mail, subject: 'changed' }], new Date())
    const rows = await tdb.db.select().from(mailOutbox).where(eq(mailOutbox.dedupeKey, 'test:once'))
    expect(rows.map((r) => r.subject)).toEqual(['s'])
    await tdb.db.delete(mailOutbox).where(eq(mailOutbox.dedupeKey, 'test:once'))
  })
})

describe('delivery', () => {
  it('SMTP down, then up: the first drain schedules retries, then every mail is delivered exactly once', async () => {
    const pending = await tdb.db.select().from(mailOutbox).where(eq(mailOutbox.status, 'pending'))
    expect(pending.length).toBeGreaterThanOrEqual(7)
    const port = await freePort() // nothing listens here yet
    let clock = new Date(Date.now() + 1000)
    const sender = createOutboxSender({
      db: tdb.db,
      transport: createMailTransport({ ...w.config.smtp, host: '127.0.0.1', port }),
      from: w.config.mailFrom,
      now: () => clock,
    })
    const down = await sender.drainOnce()
    expect(down).toEqual({ sent: 0, retrying: pending.length, failed: 0 })
    const afterDown = await tdb.db.select().from(mailOutbox).where(eq(mailOutbox.status, 'pending'))
    for (const row of afterDown) {
      expect(row.attempts).toBe(1)
      // First retry 30 s later (DEFAULT_BACKOFF.baseMs).
      expect(row.nextAttemptAt.getTime()).toBe(clock.getTime() + 30_000)
      expect(row.lastError).toMatch(/ECONNREFUSED/)
      expect(row.claimToken).toBeNull()
    }
    // Not due yet: nothing is tried.
    expect(await sender.drainOnce()).toEqual({ sent: 0, retrying: 0, failed: 0 })

    const dir = join(mkdtempSync(join(tmpdir(), 'sf-mail-')), 'mailbox')
    const smtp: FakeSmtp = await startFakeSmtp({ port, mailboxDir: dir })
    closers.push(() => smtp.close())
    clock = new Date(clock.getTime() + 31_000)
    const up = await sender.drainOnce()
    expect(up).toEqual({ sent: pending.length, retrying: 0, failed: 0 })
    expect(await sender.drainOnce()).toEqual({ sent: 0, retrying: 0, failed: 0 })

    const caught = await readMailbox(dir)
    expect(caught.length).toBe(pending.length)
    const expected = pending.map((p) => `${p.toAddress}|${p.subject}`).sort()
    expect(caught.map((m) => `${m.to}|${m.subject}`).sort()).toEqual(expected)
    const sent = await tdb.db.select().from(mailOutbox).where(eq(mailOutbox.status, 'sent'))
    expect(sent.length).toBe(pending.length)
    expect(sent.every((r) => r.attempts === 2 && r.lastError === null && r.sentAt !== null)).toBe(true)
  })

  it('two replicas draining at once send each mail once', async () => {
    const now = new Date()
    const mails = Array.from({ length: 24 }, (_, i) => ({
      to: `crew${i}@sharpfield.test`,
      subject: `Replica test ${i}`,
      text: `mail ${i}`,
      html: `<p>mail ${i}</p>`,
      kind: 'test',
      dedupeKey: `replica:${i}`,
    }))
    await enqueueMails(tdb.db, mails, now)
    const dir = join(mkdtempSync(join(tmpdir(), 'sf-mail-')), 'mailbox')
    const smtp = await startFakeSmtp({ port: 0, mailboxDir: dir })
    closers.push(() => smtp.close())
    const make = () =>
      createOutboxSender({
        db: tdb.db,
        transport: createMailTransport({ ...w.config.smtp, host: smtp.host, port: smtp.port }),
        from: w.config.mailFrom,
        batchSize: 3,
        maxBatches: 20,
      })
    const [a, b] = await Promise.all([make().drainOnce(), make().drainOnce()])
    expect(a.sent + b.sent).toBe(24)
    expect(a.sent).toBeGreaterThan(0)
    expect(b.sent).toBeGreaterThan(0)
    const caught = await readMailbox(dir)
    expect(caught.map((m) => m.subject).sort()).toEqual(mails.map((m) => m.subject).sort())
  })

  it('a refused recipient is given up at once; other failures after the last try', async () => {
    const refusing = new SMTPServer({
      authOptional: true,
      disabledCommands: ['STARTTLS'],
      logger: false,
      onRcptTo(address, _session, cb) {
        if (address.address.startsWith('nobody')) return cb(Object.assign(new Error('No such user'), { responseCode: 550 }))
        cb(Object.assign(new Error('Try later'), { responseCode: 451 }))
      },
    })
    await new Promise<void>((resolve) => refusing.listen(0, '127.0.0.1', resolve))
    closers.push(() => new Promise((resolve) => refusing.close(() => resolve())))
    const port = (refusing.server.address() as { port: number }).port
    await enqueueMails(
      tdb.db,
      [
        { to: 'nobody@sharpfield.test', subject: 'gone', text: 'x', html: '', kind: 'test', dedupeKey: 'refused:1' },
        { to: 'busy@sharpfield.test', subject: 'busy', text: 'x', html: '', kind: 'test', dedupeKey: 'refused:2' },
      ],
      new Date(),
    )
    let clock = new Date(Date.now() + 1000)
    const sender = createOutboxSender({
      db: tdb.db,
      transport: createMailTransport({ ...w.config.smtp, host: '127.0.0.1', port }),
      from: w.config.mailFrom,
      now: () => clock,
      backoff: { baseMs: 1000, maxAttempts: 2 },
    })
    expect(await sender.drainOnce()).toEqual({ sent: 0, retrying: 1, failed: 1 })
    clock = new Date(clock.getTime() + 1500)
    expect(await sender.drainOnce()).toEqual({ sent: 0, retrying: 0, failed: 1 })
    const rows = await tdb.db.select().from(mailOutbox).where(eq(mailOutbox.kind, 'test'))
    const byKey = Object.fromEntries(rows.map((r) => [r.dedupeKey, r]))
    expect(byKey['refused:1']).toMatchObject({ status: 'failed', attempts: 1 })
    expect(byKey['refused:1'].lastError).toContain('550')
    expect(byKey['refused:2']).toMatchObject({ status: 'failed', attempts: 2 })
    expect(byKey['refused:2'].lastError).toContain('451')
  })
})
