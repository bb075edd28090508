import { mkdtempSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import request from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { startFakeSmtp } from '../../server/mail/fakeSmtp'
import type { FakeSmtp } from '../../server/mail/fakeSmtp'
import { mailboxDir, readMailbox } from '../../server/mail/mailbox'
import { createMailTransport } from '../../server/mail/transport'
import { mailboxListSchema } from '../../shared/schemas/mailbox'
import { createUser, makeApp, signIn, testConfig } from './helpers/app'
import { createTestDatabase } from './helpers/db'
import type { TestDatabase } from './helpers/db'

let tdb: TestDatabase
let smtp: FakeSmtp
const config = testConfig({ demoMode: true })

beforeAll(async () => {
  tdb = await createTestDatabase()
  smtp = await startFakeSmtp({ host: '127.0.0.1', port: 0, mailboxDir: mailboxDir(config.dataDir) })
})
afterAll(async () => {
  await smtp?.close()
  await tdb?.drop()
})

describe('fake SMTP and the demo mailbox', () => {
  it('catches a mail sent through the nodemailer transport and stores it as JSON', async () => {
    const transport = createMailTransport({ ...config.smtp, host: smtp.host, port: smtp.port })
    const info = await transport.sendMail({
      from: config.mailFrom,
      to: 'maintenance@sharpfield.test',
      subject: 'Work order 7 assigned to you',
      text: 'Camera MTD-006 needs refocusing.',
      html: '<p>Camera <b>MTD-006</b> needs refocusing.</p>',
    })
    expect(info.accepted).toEqual(['maintenance@sharpfield.test'])
    const [mail] = await readMailbox(mailboxDir(config.dataDir))
    expect(mail.subject).toBe('Work order 7 assigned to you')
    expect(mail.to).toBe('maintenance@sharpfield.test')
    expect(mail.from).toContain('noreply@sharpfield.test')
    expect(mail.text.trim()).toBe('Camera MTD-006 needs refocusing.')
    expect(mail.html).toContain('<b>MTD-006</b>')
  })

  it('GET /api/mailbox lists the caught mails for a supervisor, newest first', async () => {
    const transport = createMailTransport({ ...config.smtp, host: smtp.host, port: smtp.port })
    await transport.sendMail({
      from: config.mailFrom,
      to: 'a@sharpfield.test',
      subject: 'second',
      text: '2',
    })
    const app = makeApp(tdb.db, { config }).app
    const token = (await signIn(app, await createUser(tdb.db, 'supervisor'))).token
    const res = await request(app).get('/api/mailbox').set('Authorization', `Bearer ${token}`)
    expect(res.status).toBe(200)
    const { items } = mailboxListSchema.parse(res.body)
    expect(items.map((m) => m.subject)).toEqual(['second', 'Work order 7 assigned to you'])
  })

  it('the mailbox does not exist outside demo mode', async () => {
    const app = makeApp(tdb.db, { config: { ...config, demoMode: false } }).app
    const token = (await signIn(app, await createUser(tdb.db, 'admin'))).token
    const res = await request(app).get('/api/mailbox').set('Authorization', `Bearer ${token}`)
    expect(res.status).toBe(404)
  })

  it('an empty or missing mailbox lists nothing', async () => {
    expect(await readMailbox(join(mkdtempSync(join(tmpdir(), 'sf-mb-')), 'mailbox'))).toEqual([])
  })
})
