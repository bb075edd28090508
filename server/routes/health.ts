import { defineRoute } from './define'

export const healthRoutes = [
  defineRoute({
    method: 'get',
    path: '/api/health',
    access: 'public',
    summary: 'Liveness with the real database state; 503 when the database is down.',
    async handler({ res, services }) {
      const health = await services.health.check()
      if (health.db === 'down') res.status(503)
      res.json(health)
    },
  }),
]
