import type { Role } from '../../shared/schemas/enums'
import { adminRoutes } from './admin'
import { authRoutes } from './auth'
import { cameraCheckRoutes } from './cameraChecks'
import { catalogRoutes } from './catalog'
import type { RouteDef } from './define'
import { fleetRoutes } from './fleet'
import { healthRoutes } from './health'
import { mailboxRoutes } from './mailbox'
import { reportRoutes } from './reports'
import { roundRoutes } from './rounds'
import { setupRoutes } from './setup'
import { syncRoutes } from './sync'
import { uploadRoutes } from './uploads'
import { workOrderRoutes } from './workOrders'

/** Every API route. The app mounts exactly these, with their access rules. */
export const routes: readonly RouteDef[] = [
  ...healthRoutes,
  ...authRoutes,
  ...catalogRoutes,
  ...cameraCheckRoutes,
  ...adminRoutes,
  ...mailboxRoutes,
  ...workOrderRoutes,
  ...syncRoutes,
  ...uploadRoutes,
  ...fleetRoutes,
  ...reportRoutes,
  ...roundRoutes,
  ...setupRoutes,
]

export interface RouteTableEntry {
  method: 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE'
  path: string
  roles: 'public' | Role[]
  demoOnly: boolean
  summary: string
}

/** The route table (method, path, roles) for docs and for the role-matrix test. */
export const routeTable: readonly RouteTableEntry[] = routes.map((r) => ({
  method: r.method.toUpperCase() as RouteTableEntry['method'],
  path: r.path,
  roles: r.access === 'public' ? 'public' : [...r.access],
  demoOnly: r.demoOnly,
  summary: r.summary,
}))
