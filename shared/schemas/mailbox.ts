import { z } from 'zod'
import { isoDateTime, listOf } from './common'

/** One e-mail caught by the local fake SMTP server (demo mode only). */
export const mailboxMessageSchema = z.object({
  id: z.string(),
  from: z.string(),
  to: z.string(),
  subject: z.string(),
  text: z.string(),
  html: z.string().nullable(),
  date: isoDateTime,
})
export type MailboxMessage = z.infer<typeof mailboxMessageSchema>
export const mailboxListSchema = listOf(mailboxMessageSchema)
export type MailboxList = z.infer<typeof mailboxListSchema>
