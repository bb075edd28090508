import { idParamSchema } from '../../shared/schemas/common'
import {
  cameraHistoryQuerySchema,
  fleetCameraQuerySchema,
  fleetFilterSchema,
  passRateTrendQuerySchema,
} from '../../shared/schemas/fleet'
import { checkIdParamSchema } from '../../shared/schemas/reports'
import { defineRoute } from './define'

// The fleet overview: supervisors use it, admins may read it.
const FLEET_READERS = ['supervisor', 'admin'] as const

export const fleetRoutes = [
  defineRoute({
    method: 'get',
    path: '/api/fleet/summary',
    access: FLEET_READERS,
    summary:
      'Counts for a period (cameras, checked, pass rate, marginal, failing, overdue): overall, by site, by task.',
    query: fleetFilterSchema,
    handler: ({ services, query }) => services.fleet.summary(query),
  }),
  defineRoute({
    method: 'get',
    path: '/api/fleet/cameras',
    access: FLEET_READERS,
    summary:
      'The camera table: filtered (site, task, model, state, verdict, overdue, text), sorted and paged on the server.',
    query: fleetCameraQuerySchema,
    handler: ({ services, query }) => services.fleet.cameras(query),
  }),
  defineRoute({
    method: 'get',
    path: '/api/fleet/cameras/:id/history',
    access: FLEET_READERS,
    summary:
      "A camera's checks (newest first) with its threshold and baseline, for the trend chart.",
    params: idParamSchema,
    query: cameraHistoryQuerySchema,
    handler: ({ services, params, query }) => services.fleet.history(params.id, query.limit),
  }),
  defineRoute({
    method: 'get',
    path: '/api/fleet/checks/:id',
    access: FLEET_READERS,
    summary: 'One check with its reasons and measurements (MTF curves).',
    params: checkIdParamSchema,
    handler: ({ services, params }) => services.fleet.check(params.id),
  }),
  defineRoute({
    method: 'get',
    path: '/api/fleet/trends/pass-rate',
    access: FLEET_READERS,
    summary:
      'Share of checks that passed per week, overall and for the sites with the lowest pass rate.',
    query: passRateTrendQuerySchema,
    handler: ({ services, query }) => services.fleet.passRate(query),
  }),
  defineRoute({
    method: 'get',
    path: '/api/fleet/distribution/mtf50',
    access: FLEET_READERS,
    summary: "Histogram of checks' median MTF50 in the period, by camera model.",
    query: fleetFilterSchema,
    handler: ({ services, query }) => services.fleet.mtfDistribution(query),
  }),
]
