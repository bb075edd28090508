import { spawn } from 'node:child_process'
import type { ChildProcess } from 'node:child_process'
import { mkdtempSync, rmSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { count, inArray } from 'drizzle-orm'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { checks, measurements, syncOperations } from '../../server/db/schema'
import { freePort } from '../e2e/harness/processes'
import { ROOT } from '../e2e/harness/root'
import { createUser, TEST_JWT_SECRET } from './helpers/app'
import type { TestUser } from './helpers/app'
import { createTestDatabase } from './helpers/db'
import type { TestDatabase } from './helpers/db'
import { checkPayload, createFleet, op } from './helpers/fleet'

// The real server (`tsx server/index.ts`) is killed with SIGKILL in the middle of a large push,
// restarted, and the client sends the same batch again: every check is there exactly once.

let tdb: TestDatabase
let dataDir: string
let inspector: TestUser
let child: ChildProcess | null = null
let log = ''

async function startServer(port: number): Promise<string> {
  const env = {
    ...process.env,
    NODE_ENV: 'production',
    DATABASE_URL: tdb.url,
    HOST: '127.0.0.1',
    PORT: String(port),
    DATA_DIR: dataDir,
    STATIC_DIR: join(dataDir, 'no-client'),
    JWT_SECRET: TEST_JWT_SECRET,
    DEMO_MODE: 'false',
    SMTP_PORT: String(await freePort()),
  }
  // `node --import tsx` runs the server in this one process (the tsx CLI would put it in a
  // grandchild that SIGKILL to the CLI does not reach).
  child = spawn(process.execPath, ['--import', 'tsx', 'server/index.ts'], {
    cwd: ROOT,
    env,
    stdio: ['ignore', 'pipe', 'pipe'],
  })
  child.stdout?.on('data', (d: Buffer) => (log = (log + d.toString()).slice(-4000)))
  child.stderr?.on('data', (d: Buffer) => (log = (log + d.toString()).slice(-4000)))
  const base = `http://127.0.0.1:${port}`
  const deadline = Date.now() + 60_000
  while (Date.now() < deadline) {
    if (child.exitCode !== null) throw new Error(`server exited:\n${log}`)
    try {
      const res = await fetch(`${base}/api/health`)
      if (res.ok && ((await res.json()) as { db?: string }).db === 'up') return base
    } catch {
      // not listening yet
    }
    await new Promise((r) => setTimeout(r, 200))
  }
  throw new Error(`server did not become healthy:\n${log}`)
}

function kill(signal: NodeJS.Signals): Promise<void> {
  const c = child
  child = null
  if (!c || c.exitCode !== null || c.signalCode !== null) return Promise.resolve()
  return new Promise((resolve) => {
    c.once('exit', () => resolve())
    c.kill(signal)
  })
}

async function countWhere(
  table: typeof checks | typeof syncOperations | typeof measurements,
  ids: string[],
) {
  const column =
    table === checks
      ? checks.id
      : table === syncOperations
        ? syncOperations.opId
        : measurements.checkId
  const [{ n }] = await tdb.db.select({ n: count() }).from(table).where(inArray(column, ids))
  return Number(n)
}

beforeAll(async () => {
  tdb = await createTestDatabase()
  dataDir = mkdtempSync(join(tmpdir(), 'sf-crash-'))
  inspector = await createUser(tdb.db, 'inspector')
})
afterAll(async () => {
  await kill('SIGTERM')
  rmSync(dataDir, { recursive: true, force: true })
  await tdb?.drop()
})

describe('a server killed in the middle of a push', () => {
  it('ends with every check stored exactly once after the client retries the same batch', async () => {
    const fleet = await createFleet(tdb.db, 5)
    const batch = Array.from({ length: 100 }, (_, i) =>
      op('check.create', checkPayload(fleet.cameraIds[i % 5], {}, 12)),
    )
    const checkIds = batch.map((o) => (o.payload as { id: string }).id)
    const opIds = batch.map((o) => o.id)
    const body = JSON.stringify({ deviceId: 'phone-crash', ops: batch })

    const port = await freePort()
    let base = await startServer(port)
    const login = await fetch(`${base}/api/auth/login`, {
      method: 'POST',
      headers: { 'Content-Type': 'application/json' },
      body: JSON.stringify({ email: inspector.email, password: inspector.password }),
    })
    const { token } = (await login.json()) as { token: string }
    const send = () =>
      fetch(`${base}/api/sync/push`, {
        method: 'POST',
        headers: { 'Content-Type': 'application/json', Authorization: `Bearer ${token}` },
        body,
      })

    const inFlight = send().then(
      (res) => `answered ${res.status}`,
      () => 'connection lost',
    )
    // Kill as soon as the first checks are committed.
    const deadline = Date.now() + 30_000
    while ((await countWhere(checks, checkIds)) === 0 && Date.now() < deadline) {
      await new Promise((r) => setTimeout(r, 5))
    }
    await kill('SIGKILL')
    expect(await inFlight).toBe('connection lost')
    const committed = await countWhere(checks, checkIds)
    expect(committed).toBeGreaterThan(0)
    expect(committed).toBeLessThan(100)
    // What committed is whole: a check has all 12 measurements and its operation row, or nothing.
    expect(await countWhere(measurements, checkIds)).toBe(committed * 12)
    expect(await countWhere(syncOperations, opIds)).toBe(committed)

    base = await startServer(port)
    const retry = await send()
    expect(retry.status).toBe(200)
    const { results } = (await retry.json()) as { results: { id: string; status: string }[] }
    expect(results.map((r) => r.id)).toEqual(opIds)
    expect(results.filter((r) => r.status === 'duplicate')).toHaveLength(committed)
    expect(results.filter((r) => r.status === 'applied')).toHaveLength(100 - committed)

    expect(await countWhere(checks, checkIds)).toBe(100)
    expect(await countWhere(measurements, checkIds)).toBe(1200)
    expect(await countWhere(syncOperations, opIds)).toBe(100)
  })
})
