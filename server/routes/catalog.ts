import { cameraListQuerySchema } from '../../shared/schemas/cameras'
import { idParamSchema } from '../../shared/schemas/common'
import { ROLES } from '../../shared/schemas/enums'
import { defineRoute } from './define'

// Read routes every signed-in role needs for the app shell and offline work.
export const catalogRoutes = [
  defineRoute({
    method: 'get',
    path: '/api/sites',
    access: ROLES,
    summary: 'Sites with their camera counts.',
    async handler({ services }) {
      return { items: await services.sites.list() }
    },
  }),
  defineRoute({
    method: 'get',
    path: '/api/cameras',
    access: ROLES,
    summary: 'Cameras with site, task and model names; filters and paging in the query.',
    query: cameraListQuerySchema,
    handler: ({ services, query }) => services.cameras.list(query),
  }),
  defineRoute({
    method: 'get',
    path: '/api/cameras/:id',
    access: ROLES,
    summary: 'One camera with its site, task thresholds and model.',
    params: idParamSchema,
    handler: ({ services, params }) => services.cameras.get(params.id),
  }),
  defineRoute({
    method: 'get',
    path: '/api/tasks',
    access: ROLES,
    summary: 'Camera tasks with their default thresholds.',
    async handler({ services }) {
      return { items: await services.catalog.tasks() }
    },
  }),
  defineRoute({
    method: 'get',
    path: '/api/camera-models',
    access: ROLES,
    summary: 'Camera models (sensor, pixel pitch, lens).',
    async handler({ services }) {
      return { items: await services.catalog.cameraModels() }
    },
  }),
]
