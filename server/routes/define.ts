import type { Request, RequestHandler, Response } from 'express'
import type { z } from 'zod'
import type { Role } from '../../shared/schemas/enums'
import { currentUser } from '../middleware/auth'
import type { Services } from '../services'
import type { AuthUser } from '../services/tokens'

/** Who may call a route: anyone, or signed-in users with one of the roles. */
export type Access = 'public' | readonly Role[]
export type HttpMethod = 'get' | 'post' | 'put' | 'patch' | 'delete'

type Out<S> = S extends z.ZodType ? z.output<S> : undefined

export interface RouteContext<B, Q, P> {
  req: Request
  res: Response
  body: B
  query: Q
  params: P
  /** Set on every route whose access is a role list. */
  user: AuthUser | null
  services: Services
}

export interface RouteDef {
  method: HttpMethod
  /** Full path, e.g. /api/cameras/:id. */
  path: string
  access: Access
  summary: string
  /** Mounted only when DEMO_MODE is on (404 otherwise). */
  demoOnly: boolean
  handle: RequestHandler
}

export interface RouteSpec<BS, QS, PS> {
  method: HttpMethod
  path: string
  access: Access
  summary: string
  demoOnly?: boolean
  body?: BS
  query?: QS
  params?: PS
  /** Status for a returned value (default 200); returning undefined answers 204. */
  status?: number
  handler: (ctx: RouteContext<Out<BS>, Out<QS>, Out<PS>>) => unknown
}

/**
 * A route: its access rule (enforced by the app before validation), zod schemas for body, query
 * and params (a ZodError becomes a 400 with field messages) and a thin handler that calls a service.
 */
export function defineRoute<
  BS extends z.ZodType | undefined = undefined,
  QS extends z.ZodType | undefined = undefined,
  PS extends z.ZodType | undefined = undefined,
>(spec: RouteSpec<BS, QS, PS>): RouteDef {
  const handle: RequestHandler = async (req, res) => {
    const body = (spec.body ? spec.body.parse(req.body) : undefined) as Out<BS>
    const query = (spec.query ? spec.query.parse(req.query) : undefined) as Out<QS>
    const params = (spec.params ? spec.params.parse(req.params) : undefined) as Out<PS>
    const services = req.app.locals.services as Services
    const result = await spec.handler({
      req,
      res,
      body,
      query,
      params,
      user: currentUser(res),
      services,
    })
    if (res.headersSent) return
    if (result === undefined) res.status(204).end()
    else res.status(spec.status ?? 200).json(result)
  }
  return {
    method: spec.method,
    path: spec.path,
    access: spec.access,
    summary: spec.summary,
    demoOnly: spec.demoOnly ?? false,
    handle,
  }
}

/** The signed-in user of a role-protected route (never null there). */
export function userOf(ctx: { user: AuthUser | null }): AuthUser {
  if (!ctx.user) throw new Error('userOf() used on a public route')
  return ctx.user
}
