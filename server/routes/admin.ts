import { defineRoute } from './define'

export const adminRoutes = [
  defineRoute({
    method: 'get',
    path: '/api/users',
    access: ['admin'],
    summary: 'All users with role and status (admin only).',
    async handler({ services }) {
      return { items: await services.users.list() }
    },
  }),
]
