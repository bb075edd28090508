import { idParamSchema } from '../../shared/schemas/common'
import {
  roundCancelSchema,
  roundCreateSchema,
  roundListQuerySchema,
} from '../../shared/schemas/rounds'
import { defineRoute, userOf } from './define'

// Rounds: supervisors assign and cancel; inspectors may read their own (they also get them
// through sync); admins may read.
export const roundRoutes = [
  defineRoute({
    method: 'get',
    path: '/api/rounds',
    access: ['supervisor', 'admin', 'inspector'],
    summary: 'Rounds (open first, by due date); inspectors see only their own.',
    query: roundListQuerySchema,
    handler: (ctx) => ctx.services.rounds.list(userOf(ctx), ctx.query),
  }),
  defineRoute({
    method: 'post',
    path: '/api/rounds',
    access: ['supervisor'],
    summary: 'Assign cameras, or every active camera of a site, to an inspector with a due date.',
    body: roundCreateSchema,
    status: 201,
    handler: (ctx) => ctx.services.rounds.create(userOf(ctx), ctx.body),
  }),
  defineRoute({
    method: 'get',
    path: '/api/round-assignees',
    access: ['supervisor'],
    summary: 'Active inspectors a round can be given to.',
    async handler({ services }) {
      return { items: await services.rounds.assignees() }
    },
  }),
  defineRoute({
    method: 'get',
    path: '/api/rounds/:id',
    access: ['supervisor', 'admin', 'inspector'],
    summary: 'One round with its cameras and which of them are done.',
    params: idParamSchema,
    handler: (ctx) => ctx.services.rounds.get(userOf(ctx), ctx.params.id),
  }),
  defineRoute({
    method: 'post',
    path: '/api/rounds/:id/cancel',
    access: ['supervisor'],
    summary: 'Cancel an open round (inspectors receive the change through sync).',
    params: idParamSchema,
    body: roundCancelSchema,
    handler: (ctx) => ctx.services.rounds.cancel(userOf(ctx), ctx.params.id, ctx.body.reason),
  }),
]
