import { defineRoute } from './define'

export const mailboxRoutes = [
  defineRoute({
    method: 'get',
    path: '/api/mailbox',
    access: ['admin', 'supervisor'],
    demoOnly: true,
    summary: 'E-mails caught by the local fake SMTP server, newest first (demo mode only).',
    async handler({ services }) {
      return { items: await services.mailbox.list() }
    },
  }),
]
