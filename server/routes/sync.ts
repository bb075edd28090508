import { ROLES } from '../../shared/schemas/enums'
import { pullQuerySchema, pushRequestSchema } from '../../shared/schemas/sync'
import { defineRoute, userOf } from './define'

// Offline sync (server/services/sync/README.md). Every signed-in role may call both routes; what
// each role may push is decided per operation kind, what it may pull per entity.
export const syncRoutes = [
  defineRoute({
    method: 'post',
    path: '/api/sync/push',
    access: ROLES,
    summary: 'Apply a batch of queued device operations (idempotent per operation id).',
    body: pushRequestSchema,
    handler: (ctx) => ctx.services.sync.push(userOf(ctx), ctx.body),
  }),
  defineRoute({
    method: 'get',
    path: '/api/sync/pull',
    access: ROLES,
    summary: 'What changed since the cursor (a full download without one), for this user.',
    query: pullQuerySchema,
    handler: (ctx) => ctx.services.sync.pull(userOf(ctx), ctx.query),
  }),
]
