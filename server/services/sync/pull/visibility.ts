import type { AuthUser } from '../../tokens'

/**
 * What each role's devices receive through pull (the server decides; the client only displays):
 * - every role: all sites, tasks (with thresholds), camera models and cameras — inspectors may be
 *   sent to any camera (commissioning, re-checks after repair, ad-hoc visits) and maintenance has
 *   to find the camera of an order, so the inventory is not cut per round;
 * - rounds: supervisors and admins all, inspectors the rounds assigned to them, maintenance none;
 * - work orders: supervisors and admins all, maintenance only those assigned to them, inspectors
 *   only those awaiting a re-check (the re-checks they are asked to make).
 * A record that stops being visible (an order reassigned away, a round given to someone else)
 * is listed under `removed` so the device drops it.
 */
export interface Visibility {
  rounds: 'all' | 'own' | 'none'
  workOrders: 'all' | 'assigned' | 'awaiting_recheck' | 'none'
}

export function visibility(user: Pick<AuthUser, 'role'>): Visibility {
  switch (user.role) {
    case 'supervisor':
    case 'admin':
      return { rounds: 'all', workOrders: 'all' }
    case 'inspector':
      return { rounds: 'own', workOrders: 'awaiting_recheck' }
    case 'maintenance':
      return { rounds: 'none', workOrders: 'assigned' }
  }
}
