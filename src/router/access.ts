// The guard's decision as a pure function: who may open which route.
import type { RouteMeta } from 'vue-router'
import type { Role } from './roles'

export type AccessDecision =
  | { kind: 'allow' }
  | { kind: 'sign-in' }
  /** Send the user to their home; `denied` when they asked for another role's page. */
  | { kind: 'home'; denied: boolean }

export function decideAccess(
  meta: RouteMeta,
  role: Role | null,
  isSignInPage: boolean,
): AccessDecision {
  if (isSignInPage) return role ? { kind: 'home', denied: false } : { kind: 'allow' }
  if (meta.public) return { kind: 'allow' }
  if (!role) return { kind: 'sign-in' }
  if (meta.roles && !meta.roles.includes(role)) return { kind: 'home', denied: true }
  return { kind: 'allow' }
}
