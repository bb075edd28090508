import { asc } from 'drizzle-orm'
import type { User } from '../../shared/schemas/users'
import type { Db } from '../db/client'
import { users } from '../db/schema'

export function createUserService(db: Db) {
  return {
    async list(): Promise<User[]> {
      const rows = await db
        .select({
          id: users.id,
          email: users.email,
          name: users.name,
          role: users.role,
          active: users.active,
          createdAt: users.createdAt,
          updatedAt: users.updatedAt,
        })
        .from(users)
        .orderBy(asc(users.name))
      return rows.map((r) => ({
        ...r,
        createdAt: r.createdAt.toISOString(),
        updatedAt: r.updatedAt.toISOString(),
      }))
    },
  }
}

export type UserService = ReturnType<typeof createUserService>
