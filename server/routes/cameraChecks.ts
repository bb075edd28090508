import { cameraChecksQuerySchema } from '../../shared/schemas/cameraChecks'
import { idParamSchema } from '../../shared/schemas/common'
import { ROLES } from '../../shared/schemas/enums'
import { defineRoute } from './define'

// A camera's check history: every role that may see the camera may see its checks.
export const cameraCheckRoutes = [
  defineRoute({
    method: 'get',
    path: '/api/cameras/:id/checks',
    access: ROLES,
    summary: "A camera's checks on the server (newest first) with its baseline's MTF50.",
    params: idParamSchema,
    query: cameraChecksQuerySchema,
    handler: ({ services, params, query }) => services.cameraChecks.list(params.id, query.limit),
  }),
]
