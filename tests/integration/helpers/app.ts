import { mkdtempSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import type { Express } from 'express'
import request from 'supertest'
import { createApp } from '../../../server/app'
import type { AppDeps } from '../../../server/app'
import { loadConfig } from '../../../server/config'
import type { Config } from '../../../server/config'
import type { Db } from '../../../server/db/client'
import { users } from '../../../server/db/schema'
import { hashPassword } from '../../../server/services/passwords'
import { sessionResponseSchema } from '../../../shared/schemas/auth'
import type { SessionResponse } from '../../../shared/schemas/auth'
import type { Role } from '../../../shared/schemas/enums'

export const TEST_JWT_SECRET = 'integration-test-secret-that-is-long-enough-0123456789'
export const jwtKey = new TextEncoder().encode(TEST_JWT_SECRET)

/** A config like production's defaults, with a private data dir and a missing static dir. */
export function testConfig(overrides: Partial<Config> = {}): Config {
  const dataDir = mkdtempSync(join(tmpdir(), 'sf-it-data-'))
  const base = loadConfig({
    DATA_DIR: dataDir,
    STATIC_DIR: join(dataDir, 'no-dist'),
    JWT_SECRET: TEST_JWT_SECRET,
  })
  return { ...base, ...overrides }
}

export function makeApp(db: Db, deps: Partial<AppDeps> = {}): { app: Express; config: Config } {
  const config = deps.config ?? testConfig()
  const silent = { info: () => {}, error: () => {} }
  const app = createApp({ db, jwtKey, logger: silent, ...deps, config })
  return { app, config }
}

export interface TestUser {
  id: number
  email: string
  password: string
  role: Role
}

let counter = 0
export async function createUser(
  db: Db,
  role: Role,
  options: { email?: string; password?: string; active?: boolean; name?: string } = {},
): Promise<TestUser> {
  const email = options.email ?? `${role}-${++counter}-${Date.now()}@sharpfield.test`
  const password = options.password ?? `pw-${role}-${counter}-long`
  const [row] = await db
    .insert(users)
    .values({
      email,
      name: options.name ?? `Test ${role}`,
      role,
      passwordHash: await hashPassword(password),
      active: options.active ?? true,
    })
    .$returningId()
  return { id: row.id, email, password, role }
}

export async function signIn(
  app: Express,
  user: { email: string; password: string },
): Promise<SessionResponse> {
  const res = await request(app)
    .post('/api/auth/login')
    .send({ email: user.email, password: user.password })
  if (res.status !== 200)
    throw new Error(`sign-in of ${user.email} failed: ${res.status} ${JSON.stringify(res.body)}`)
  return sessionResponseSchema.parse(res.body)
}
