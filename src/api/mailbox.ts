// The demo mailbox: e-mails caught by the local fake SMTP server (demo mode only).
import { mailboxListSchema, type MailboxMessage } from '@shared/schemas/mailbox'
import { http } from './http'

export type { MailboxMessage }

export async function fetchMailbox(signal?: AbortSignal): Promise<MailboxMessage[]> {
  return (await http.get('/api/mailbox', { schema: mailboxListSchema, signal })).items
}
