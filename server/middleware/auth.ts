import type { RequestHandler, Response } from 'express'
import { ERROR_CODES } from '../../shared/schemas/errors'
import type { Role } from '../../shared/schemas/enums'
import { AppError } from '../errors'
import type { AccessTokens, AuthUser } from '../services/tokens'

/** The signed-in user, set by requireAuth. */
export function currentUser(res: Response): AuthUser | null {
  return (res.locals.user as AuthUser | undefined) ?? null
}

function bearerToken(header: string | undefined): string | null {
  if (!header) return null
  const m = /^Bearer\s+(\S+)\s*$/i.exec(header)
  return m ? m[1] : null
}

/** 401 without a valid, unexpired access token (`auth.invalid_token` / `auth.expired`). */
export function requireAuth(tokens: AccessTokens): RequestHandler {
  return async (req, res, next) => {
    const token = bearerToken(req.get('authorization'))
    if (!token) {
      throw new AppError(ERROR_CODES.invalidToken, 'Sign in first: no access token was sent.', 401)
    }
    res.locals.user = await tokens.verify(token)
    next()
  }
}

/** 403 unless the signed-in user has one of the roles. Use after requireAuth. */
export function requireRole(...roles: readonly Role[]): RequestHandler {
  return (_req, res, next) => {
    const user = currentUser(res)
    if (!user) throw new AppError(ERROR_CODES.invalidToken, 'Sign in first.', 401)
    if (!roles.includes(user.role)) {
      throw new AppError(ERROR_CODES.forbidden, 'Your role may not do this.', 403, {
        allowed: roles,
      })
    }
    next()
  }
}
