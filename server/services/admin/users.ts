// Users: create, change name or role, switch off and on, set a new password. Role changes,
// switching off and new passwords end the user's sessions (their refresh tokens are revoked;
// an access token already issued lapses within its 15 minutes).
import { and, count, eq, isNull, ne } from 'drizzle-orm'
import type { PasswordReset, UserCreate, UserUpdate } from '../../../shared/schemas/setup'
import type { User } from '../../../shared/schemas/users'
import type { Db, DbOrTx } from '../../db/client'
import { refreshTokens, users } from '../../db/schema'
import { hashPassword } from '../passwords'
import { audit } from '../sync/audit'
import type { AuthUser } from '../tokens'
import { diff, fieldError, notFound, SETUP_ERRORS, uniqueOr } from './common'

type UserRow = typeof users.$inferSelect

function toUser(u: UserRow): User {
  return {
    id: u.id,
    email: u.email,
    name: u.name,
    role: u.role,
    active: u.active,
    createdAt: u.createdAt.toISOString(),
    updatedAt: u.updatedAt.toISOString(),
  }
}

async function endSessions(tx: DbOrTx, userId: number, at: Date) {
  await tx
    .update(refreshTokens)
    .set({ revokedAt: at })
    .where(and(eq(refreshTokens.userId, userId), isNull(refreshTokens.revokedAt)))
}

async function load(tx: DbOrTx, id: number, lock = false): Promise<UserRow> {
  const q = tx.select().from(users).where(eq(users.id, id))
  const [row] = lock ? await q.for('update') : await q
  if (!row) throw notFound('user', id)
  return row
}

export function createUserAdmin(db: Db, now: () => Date) {
  return {
    async create(actor: AuthUser, input: UserCreate): Promise<User> {
      const passwordHash = await hashPassword(input.password)
      const id = await db.transaction(async (tx) => {
        const [ins] = await uniqueOr(
          () =>
            tx
              .insert(users)
              .values({ email: input.email, name: input.name, role: input.role, passwordHash })
              .$returningId(),
          'users_email_unique',
          'email',
          'A user with this e-mail address exists already.',
        )
        await audit(tx, {
          actorId: actor.id,
          action: 'user.create',
          entity: 'user',
          entityId: ins.id,
          detail: {
            after: { email: input.email, name: input.name, role: input.role, active: true },
          },
        })
        return ins.id
      })
      return toUser(await load(db, id))
    },

    async update(actor: AuthUser, id: number, input: UserUpdate): Promise<User> {
      await db.transaction(async (tx) => {
        const before = await load(tx, id, true)
        const change = diff(before, input)
        if (Object.keys(change.after).length === 0) return
        if (id === actor.id && (input.active === false || (input.role && input.role !== 'admin')))
          throw fieldError(
            input.active === false ? 'active' : 'role',
            'You cannot switch off your own account or give up your own administrator role.',
            403,
            SETUP_ERRORS.notAllowed,
          )
        const losesAdmin =
          before.role === 'admin' &&
          before.active &&
          ((input.role !== undefined && input.role !== 'admin') || input.active === false)
        if (losesAdmin) {
          const [{ n }] = await tx
            .select({ n: count() })
            .from(users)
            .where(and(eq(users.role, 'admin'), eq(users.active, true), ne(users.id, id)))
          if (Number(n) === 0)
            throw fieldError(
              'role',
              'Sharpfield needs at least one active administrator.',
              409,
              SETUP_ERRORS.conflict,
            )
        }
        await tx.update(users).set(change.after).where(eq(users.id, id))
        if (change.after.role !== undefined || change.after.active === false)
          await endSessions(tx, id, now())
        const action =
          change.after.active === false
            ? 'user.deactivate'
            : change.after.active === true
              ? 'user.reactivate'
              : change.after.role !== undefined
                ? 'user.role_change'
                : 'user.update'
        await audit(tx, { actorId: actor.id, action, entity: 'user', entityId: id, detail: change })
      })
      return toUser(await load(db, id))
    },

    async resetPassword(actor: AuthUser, id: number, input: PasswordReset): Promise<User> {
      const passwordHash = await hashPassword(input.password)
      await db.transaction(async (tx) => {
        await load(tx, id, true)
        await tx.update(users).set({ passwordHash }).where(eq(users.id, id))
        await endSessions(tx, id, now())
        // Never the password or its hash: only that it was set, and that sessions ended.
        await audit(tx, {
          actorId: actor.id,
          action: 'user.password_reset',
          entity: 'user',
          entityId: id,
          detail: { sessionsEnded: true },
        })
      })
      return toUser(await load(db, id))
    },
  }
}
