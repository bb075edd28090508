import type { AddressInfo } from 'node:net'
import { simpleParser } from 'mailparser'
import type { AddressObject } from 'mailparser'
import { SMTPServer } from 'smtp-server'
import type { MailboxMessage } from '../../shared/schemas/mailbox'
import { storeMessage } from './mailbox'

// A local stand-in for a mail relay (development, demo and tests): accepts every message on
// loopback, without TLS or real authentication, and stores it in the mailbox folder.

export interface FakeSmtpOptions {
  host?: string
  port?: number
  mailboxDir: string
  onMessage?: (message: MailboxMessage) => void
}

export interface FakeSmtp {
  host: string
  port: number
  close(): Promise<void>
}

function addressText(a: AddressObject | AddressObject[] | undefined): string {
  if (!a) return ''
  return (Array.isArray(a) ? a : [a]).map((x) => x.text).join(', ')
}

export function startFakeSmtp(options: FakeSmtpOptions): Promise<FakeSmtp> {
  const host = options.host ?? '127.0.0.1'
  const server = new SMTPServer({
    authOptional: true,
    allowInsecureAuth: true,
    disabledCommands: ['STARTTLS'],
    logger: false,
    size: 25 * 1024 * 1024,
    onAuth(auth, _session, cb) {
      cb(null, { user: auth.username ?? 'any' }) // any credentials are fine for the fake
    },
    onData(stream, session, cb) {
      simpleParser(stream)
        .then(async (mail) => {
          const envelopeTo = session.envelope.rcptTo.map((r) => r.address).join(', ')
          const stored = await storeMessage(options.mailboxDir, {
            from:
              mail.from?.text ??
              (session.envelope.mailFrom ? session.envelope.mailFrom.address : ''),
            to: addressText(mail.to) || envelopeTo,
            subject: mail.subject ?? '',
            text: mail.text ?? '',
            html: typeof mail.html === 'string' ? mail.html : null,
            date: (mail.date ?? new Date()).toISOString(),
          })
          options.onMessage?.(stored)
          cb()
        })
        .catch((err: Error) => cb(err))
    },
  })
  return new Promise((resolve, reject) => {
    server.once('error', reject)
    server.listen(options.port ?? 2525, host, () => {
      server.off('error', reject)
      const address = server.server.address() as AddressInfo
      resolve({
        host,
        port: address.port,
        close: () => new Promise<void>((done) => server.close(() => done())),
      })
    })
  })
}
