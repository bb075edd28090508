import { loginRequestSchema, refreshRequestSchema } from '../../shared/schemas/auth'
import { ROLES } from '../../shared/schemas/enums'
import {
  REFRESH_COOKIE,
  clearRefreshCookie,
  readCookie,
  setRefreshCookie,
} from '../middleware/cookies'
import { REFRESH_TTL_MS } from '../services/tokens'
import { defineRoute, userOf } from './define'

export const authRoutes = [
  defineRoute({
    method: 'post',
    path: '/api/auth/login',
    access: 'public',
    summary: 'Sign in with e-mail and password; returns an access token and a refresh token.',
    body: loginRequestSchema,
    async handler({ req, res, body, services }) {
      const session = await services.auth.login(body.email, body.password, req.ip ?? 'unknown')
      setRefreshCookie(req, res, session.refreshToken, REFRESH_TTL_MS)
      return session
    },
  }),
  defineRoute({
    method: 'post',
    path: '/api/auth/refresh',
    access: 'public',
    summary: 'Exchange a refresh token (body or cookie) for a new pair; the old one is spent.',
    body: refreshRequestSchema,
    async handler({ req, res, body, services }) {
      const presented = body?.refreshToken ?? readCookie(req, REFRESH_COOKIE)
      try {
        const session = await services.auth.refresh(presented)
        setRefreshCookie(req, res, session.refreshToken, REFRESH_TTL_MS)
        return session
      } catch (err) {
        clearRefreshCookie(req, res)
        throw err
      }
    },
  }),
  defineRoute({
    method: 'post',
    path: '/api/auth/logout',
    access: 'public',
    summary: 'Sign out: revokes the refresh token family (body or cookie) and clears the cookie.',
    body: refreshRequestSchema,
    async handler({ req, res, body, services }) {
      await services.auth.logout(body?.refreshToken ?? readCookie(req, REFRESH_COOKIE))
      clearRefreshCookie(req, res)
      return undefined
    },
  }),
  defineRoute({
    method: 'get',
    path: '/api/auth/me',
    access: ROLES,
    summary: 'The signed-in user.',
    async handler(ctx) {
      return { user: await ctx.services.auth.me(userOf(ctx).id) }
    },
  }),
]
