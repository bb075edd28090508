// Child processes for the harness: one-shot scripts and the server, each run through tsx.
import { spawn, type ChildProcess } from 'node:child_process'
import { createWriteStream } from 'node:fs'
import { createServer } from 'node:net'
import { join } from 'node:path'
import { ROOT } from './root'

const TSX = join(ROOT, 'node_modules/tsx/dist/cli.mjs')

export function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const probe = createServer()
    probe.once('error', reject)
    probe.listen(0, '127.0.0.1', () => {
      const address = probe.address()
      const port = typeof address === 'object' && address ? address.port : 0
      probe.close(() => resolve(port))
    })
  })
}

/** Runs `tsx <script>` to completion; rejects with its output when it fails. */
export function runScript(script: string, env: NodeJS.ProcessEnv): Promise<void> {
  return new Promise((resolve, reject) => {
    const child = spawn(process.execPath, [TSX, script], {
      cwd: ROOT,
      env,
      stdio: ['ignore', 'pipe', 'pipe'],
    })
    let output = ''
    child.stdout.on('data', (d: Buffer) => (output += d.toString()))
    child.stderr.on('data', (d: Buffer) => (output += d.toString()))
    child.once('error', reject)
    child.once('exit', (code) => {
      if (code === 0) resolve()
      else reject(new Error(`${script} exited with ${code}:\n${output}`))
    })
  })
}

export interface RunningServer {
  baseUrl: string
  stop(): Promise<void>
}

function stopChild(child: ChildProcess): Promise<void> {
  if (child.exitCode !== null || child.signalCode !== null) return Promise.resolve()
  return new Promise((resolve) => {
    const kill = setTimeout(() => child.kill('SIGKILL'), 8000)
    child.once('exit', () => {
      clearTimeout(kill)
      resolve()
    })
    child.kill('SIGTERM')
  })
}

async function waitForHealth(
  baseUrl: string,
  child: ChildProcess,
  timeoutMs: number,
  log: () => string,
): Promise<void> {
  const deadline = Date.now() + timeoutMs
  while (Date.now() < deadline) {
    if (child.exitCode !== null)
      throw new Error(`The server exited with ${child.exitCode}:\n${log()}`)
    try {
      const res = await fetch(`${baseUrl}/api/health`)
      const body = (await res.json()) as { db?: string }
      if (res.ok && body.db === 'up') return
    } catch {
      // not listening yet
    }
    await new Promise((r) => setTimeout(r, 250))
  }
  throw new Error(
    `The server did not report a healthy database within ${timeoutMs / 1000} s:\n${log()}`,
  )
}

/** Starts `tsx server/index.ts`, logging to `logFile`, and waits for /api/health. */
export async function startServer(env: NodeJS.ProcessEnv, logFile: string): Promise<RunningServer> {
  const baseUrl = `http://127.0.0.1:${env.PORT}`
  const child = spawn(process.execPath, [TSX, 'server/index.ts'], {
    cwd: ROOT,
    env,
    stdio: ['ignore', 'pipe', 'pipe'],
  })
  const file = createWriteStream(logFile)
  let recent = ''
  const keep = (d: Buffer) => {
    file.write(d)
    recent = (recent + d.toString()).slice(-4000)
  }
  child.stdout?.on('data', keep)
  child.stderr?.on('data', keep)
  try {
    await waitForHealth(baseUrl, child, 60_000, () => recent)
  } catch (error) {
    await stopChild(child)
    file.end()
    throw error
  }
  return {
    baseUrl,
    async stop() {
      await stopChild(child)
      file.end()
    },
  }
}
