import { createHash, randomBytes } from 'node:crypto'
import { SignJWT, errors as joseErrors, jwtVerify } from 'jose'
import { ERROR_CODES } from '../../shared/schemas/errors'
import { roleSchema } from '../../shared/schemas/enums'
import type { Role } from '../../shared/schemas/enums'
import { AppError } from '../errors'

export const JWT_ISSUER = 'sharpfield'
export const JWT_AUDIENCE = 'sharpfield-api'
export const JWT_ALG = 'HS256'
export const ACCESS_TTL_S = 15 * 60
export const REFRESH_TTL_MS = 30 * 24 * 3600 * 1000

export interface AuthUser {
  id: number
  email: string
  role: Role
}

export interface AccessTokens {
  sign(user: AuthUser): Promise<string>
  verify(token: string): Promise<AuthUser>
}

/** Short-lived HS256 access tokens (jose); the algorithm is pinned on verify. */
export function createAccessTokens(key: Uint8Array, ttlS = ACCESS_TTL_S): AccessTokens {
  return {
    sign(user) {
      return new SignJWT({ role: user.role, email: user.email })
        .setProtectedHeader({ alg: JWT_ALG, typ: 'JWT' })
        .setSubject(String(user.id))
        .setIssuer(JWT_ISSUER)
        .setAudience(JWT_AUDIENCE)
        .setIssuedAt()
        .setExpirationTime(`${ttlS}s`)
        .sign(key)
    },
    async verify(token) {
      try {
        const { payload } = await jwtVerify(token, key, {
          algorithms: [JWT_ALG],
          issuer: JWT_ISSUER,
          audience: JWT_AUDIENCE,
          requiredClaims: ['sub', 'exp', 'iat'],
        })
        const id = Number(payload.sub)
        const role = roleSchema.safeParse(payload.role)
        if (
          !Number.isInteger(id) ||
          id <= 0 ||
          !role.success ||
          typeof payload.email !== 'string'
        ) {
          throw new AppError(ERROR_CODES.invalidToken, 'The access token is not valid.', 401)
        }
        return { id, email: payload.email, role: role.data }
      } catch (err) {
        if (err instanceof AppError) throw err
        if (err instanceof joseErrors.JWTExpired) {
          throw new AppError(
            ERROR_CODES.expired,
            'The session has expired; refresh it or sign in again.',
            401,
          )
        }
        throw new AppError(ERROR_CODES.invalidToken, 'The access token is not valid.', 401)
      }
    },
  }
}

/** An opaque refresh token: 256 random bits, sent to the client; only its hash is stored. */
export function newRefreshToken(): string {
  return randomBytes(32).toString('base64url')
}

export function hashRefreshToken(token: string): string {
  return createHash('sha256').update(token).digest('hex')
}
