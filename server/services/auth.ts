import { randomUUID } from 'node:crypto'
import { and, eq, isNull } from 'drizzle-orm'
import type { SessionResponse, SessionUser } from '../../shared/schemas/auth'
import { ERROR_CODES } from '../../shared/schemas/errors'
import type { Db, DbOrTx } from '../db/client'
import { auditLog, refreshTokens, users } from '../db/schema'
import { AppError } from '../errors'
import type { LoginLimiter } from './loginLimiter'
import { burnPasswordCheck, verifyPassword } from './passwords'
import { ACCESS_TTL_S, REFRESH_TTL_MS, hashRefreshToken, newRefreshToken } from './tokens'
import type { AccessTokens } from './tokens'

export interface AuthServiceDeps {
  db: Db
  tokens: AccessTokens
  limiter: LoginLimiter
  now?: () => Date
}

type UserRow = typeof users.$inferSelect

const badCredentials = () =>
  new AppError(ERROR_CODES.invalidCredentials, 'The e-mail or password is not right.', 401)
const badRefresh = (message = 'The session is no longer valid; sign in again.') =>
  new AppError(ERROR_CODES.invalidRefresh, message, 401)

function affectedRows(result: unknown): number {
  const header = Array.isArray(result) ? result[0] : result
  return Number((header as { affectedRows?: number } | undefined)?.affectedRows ?? 0)
}

export function toSessionUser(u: UserRow): SessionUser {
  return { id: u.id, email: u.email, name: u.name, role: u.role }
}

export function createAuthService({
  db,
  tokens,
  limiter,
  now = () => new Date(),
}: AuthServiceDeps) {
  async function issueRefresh(tx: DbOrTx, userId: number, familyId: string) {
    const token = newRefreshToken()
    const [row] = await tx
      .insert(refreshTokens)
      .values({
        userId,
        familyId,
        tokenHash: hashRefreshToken(token),
        expiresAt: new Date(now().getTime() + REFRESH_TTL_MS),
      })
      .$returningId()
    return { token, id: row.id }
  }

  async function session(user: UserRow, refreshToken: string): Promise<SessionResponse> {
    const token = await tokens.sign({ id: user.id, email: user.email, role: user.role })
    return { token, expiresIn: ACCESS_TTL_S, refreshToken, user: toSessionUser(user) }
  }

  async function revokeFamily(familyId: string) {
    await db
      .update(refreshTokens)
      .set({ revokedAt: now() })
      .where(and(eq(refreshTokens.familyId, familyId), isNull(refreshTokens.revokedAt)))
  }

  return {
    async login(emailRaw: string, password: string, ip: string): Promise<SessionResponse> {
      const email = emailRaw.trim().toLowerCase()
      const wait = await limiter.retryAfterS(email, ip)
      if (wait > 0) {
        throw new AppError(
          ERROR_CODES.rateLimited,
          `Too many failed sign-ins for this account; try again in ${Math.ceil(wait / 60)} min.`,
          429,
          { retryAfterS: wait },
          { 'Retry-After': String(wait) },
        )
      }
      const [user] = await db.select().from(users).where(eq(users.email, email)).limit(1)
      if (!user) {
        await burnPasswordCheck(password)
        await limiter.recordFailure(email, ip)
        throw badCredentials()
      }
      if (!(await verifyPassword(user.passwordHash, password))) {
        await limiter.recordFailure(email, ip)
        throw badCredentials()
      }
      if (!user.active) {
        throw new AppError(
          ERROR_CODES.accountInactive,
          'This account is deactivated; ask an administrator.',
          403,
        )
      }
      await limiter.recordSuccess(email, ip)
      const refresh = await issueRefresh(db, user.id, randomUUID())
      return session(user, refresh.token)
    },

    /** Rotates a refresh token. Presenting an already rotated token revokes its whole family. */
    async refresh(presented: string | undefined): Promise<SessionResponse> {
      if (!presented) throw badRefresh('No refresh token was sent; sign in again.')
      const [row] = await db
        .select()
        .from(refreshTokens)
        .where(eq(refreshTokens.tokenHash, hashRefreshToken(presented)))
        .limit(1)
      if (!row) throw badRefresh()
      if (row.revokedAt) {
        if (row.replacedBy !== null) await reuseDetected(row.familyId, row.userId)
        throw badRefresh()
      }
      if (row.expiresAt.getTime() <= now().getTime())
        throw badRefresh('The session has expired; sign in again.')
      const [user] = await db.select().from(users).where(eq(users.id, row.userId)).limit(1)
      if (!user || !user.active) {
        await revokeFamily(row.familyId)
        throw new AppError(
          ERROR_CODES.accountInactive,
          'This account is deactivated; ask an administrator.',
          401,
        )
      }
      const next = await db.transaction(async (tx) => {
        // Claim the presented token; a concurrent rotation of the same token loses here.
        const claimed = await tx
          .update(refreshTokens)
          .set({ revokedAt: now() })
          .where(and(eq(refreshTokens.id, row.id), isNull(refreshTokens.revokedAt)))
        if (affectedRows(claimed) !== 1) return null
        const issued = await issueRefresh(tx, user.id, row.familyId)
        await tx
          .update(refreshTokens)
          .set({ replacedBy: issued.id })
          .where(eq(refreshTokens.id, row.id))
        return issued
      })
      if (!next) {
        await reuseDetected(row.familyId, row.userId)
        throw badRefresh()
      }
      return session(user, next.token)
    },

    /** Revokes the family of the presented refresh token (if any); always succeeds. */
    async logout(presented: string | undefined): Promise<void> {
      if (!presented) return
      const [row] = await db
        .select({ familyId: refreshTokens.familyId })
        .from(refreshTokens)
        .where(eq(refreshTokens.tokenHash, hashRefreshToken(presented)))
        .limit(1)
      if (row) await revokeFamily(row.familyId)
    },

    async me(userId: number): Promise<SessionUser> {
      const [user] = await db.select().from(users).where(eq(users.id, userId)).limit(1)
      if (!user || !user.active) {
        throw new AppError(
          ERROR_CODES.invalidToken,
          'The account behind this token is not available.',
          401,
        )
      }
      return toSessionUser(user)
    },
  }

  async function reuseDetected(familyId: string, userId: number) {
    await revokeFamily(familyId)
    await db.insert(auditLog).values({
      actorId: userId,
      action: 'auth.refresh_reused',
      entity: 'refresh_family',
      entityId: familyId,
      detail: {
        note: 'A rotated refresh token was presented again; the whole family was revoked.',
      },
    })
    throw new AppError(
      ERROR_CODES.refreshReused,
      'This sign-in was used from somewhere else; all its sessions were ended. Sign in again.',
      401,
    )
  }
}

export type AuthService = ReturnType<typeof createAuthService>
