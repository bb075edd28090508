// WORKERS=2: the real server as several processes (node:cluster) over real HTTP. Operators rely
// on: every worker serving the same sessions (one signing key, created once by the primary), a
// crashed worker being replaced on its own, and SIGTERM stopping them all cleanly.
import { mkdtempSync, readFileSync, rmSync, statSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { freePort, runScript, startServer } from '../e2e/harness/processes'
import type { RunningServer } from '../e2e/harness/processes'
import { createTestDatabase } from './helpers/db'
import type { TestDatabase } from './helpers/db'

let tdb: TestDatabase
let server: RunningServer | undefined
let tmp: string
let logFile: string

const log = () => readFileSync(logFile, 'utf8')
const workerPids = () =>
  [...new Set([...log().matchAll(/listening on \S+ \(worker (\d+)\)/g)].map((m) => Number(m[1])))]

async function until<T>(what: string, probe: () => T | undefined | false, timeoutMs = 30_000) {
  const deadline = Date.now() + timeoutMs
  for (;;) {
    const value = probe()
    if (value) return value
    if (Date.now() > deadline) throw new Error(`timed out waiting for ${what}:\n${log()}`)
    await new Promise((r) => setTimeout(r, 200))
  }
}

/** A request on a fresh connection, so the primary hands it to the next worker in turn. */
function get(path: string, token?: string) {
  return fetch(`${server!.baseUrl}${path}`, {
    headers: { Connection: 'close', ...(token ? { Authorization: `Bearer ${token}` } : {}) },
  })
}

beforeAll(async () => {
  tdb = await createTestDatabase()
  tmp = mkdtempSync(join(tmpdir(), 'sf-cluster-'))
  logFile = join(tmp, 'server.log')
  const env = {
    ...process.env,
    NODE_ENV: 'production',
    DATABASE_URL: tdb.url,
    HOST: '127.0.0.1',
    PORT: String(await freePort()),
    SMTP_PORT: String(await freePort()),
    DATA_DIR: join(tmp, 'data'),
    STATIC_DIR: join(tmp, 'no-client'),
    JWT_SECRET: '', // unset: the primary creates the key file the workers share
    DEMO_MODE: 'false',
    WORKERS: '2',
  }
  await runScript('scripts/seed-demo.ts', env)
  server = await startServer(env, logFile)
  await until('two workers', () => workerPids().length >= 2)
}, 120_000)

afterAll(async () => {
  await server?.stop()
  await tdb?.drop()
  rmSync(tmp, { recursive: true, force: true })
})

describe('the server as several worker processes (WORKERS=2)', () => {
  it('serves one session on every worker with the key file the primary created', async () => {
    expect(statSync(join(tmp, 'data', 'jwt-secret')).mode & 0o777).toBe(0o600)
    const res = await fetch(`${server!.baseUrl}/api/auth/login`, {
      method: 'POST',
      headers: { 'Content-Type': 'application/json', Connection: 'close' },
      body: JSON.stringify({ email: 'inspector@sharpfield.test', password: 'sharpfield-demo' }),
    })
    expect(res.status).toBe(200)
    const { token } = (await res.json()) as { token: string }
    // Node's cluster hands fresh connections to the workers in turn: every answer must accept it.
    const statuses = []
    for (let i = 0; i < 8; i++) statuses.push((await get('/api/auth/me', token)).status)
    expect(statuses).toEqual(Array(8).fill(200))
  })

  it('replaces a worker that dies and keeps answering', async () => {
    const before = workerPids()
    const victim = before[0]
    process.kill(victim, 'SIGKILL')
    const replacement = await until('a new worker', () =>
      workerPids().find((pid) => !before.includes(pid)),
    )
    expect(log()).toContain(`worker ${victim} stopped (signal SIGKILL); starting a new one.`)
    expect(isAlive(victim)).toBe(false)
    expect(isAlive(replacement)).toBe(true)
    for (let i = 0; i < 4; i++) expect((await get('/api/health')).status).toBe(200)
  })

  it('stops every worker on SIGTERM', async () => {
    const pids = workerPids().filter(isAlive)
    expect(pids.length).toBe(2)
    await server!.stop()
    server = undefined
    for (const pid of pids) expect(isAlive(pid)).toBe(false)
    expect(log()).not.toContain('took longer')
  })
})

function isAlive(pid: number): boolean {
  try {
    process.kill(pid, 0)
    return true
  } catch {
    return false
  }
}
