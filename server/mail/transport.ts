import nodemailer from 'nodemailer'
import type { Transporter } from 'nodemailer'
import type { SmtpConfig } from '../config'

/** The SMTP transport: the local fake by default, a real relay by configuration. */
export function createMailTransport(smtp: SmtpConfig): Transporter {
  return nodemailer.createTransport({
    host: smtp.host,
    port: smtp.port,
    secure: smtp.secure,
    auth: smtp.user ? { user: smtp.user, pass: smtp.password ?? '' } : undefined,
    connectionTimeout: 10_000,
    greetingTimeout: 10_000,
    socketTimeout: 30_000,
  })
}
