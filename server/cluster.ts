// Several server processes on one machine (WORKERS > 1): the primary forks the workers, which
// share the listening port (node:cluster hands connections round-robin), starts a new worker when
// one dies, and on SIGTERM/SIGINT asks every worker to finish its requests and waits for them.
// Workers are stateless: sessions are JWTs, sign-in limits, the mail outbox and sync state live
// in MariaDB, and background jobs claim their rows, so any worker may serve any request.
import cluster from 'node:cluster'
import type { Worker } from 'node:cluster'

/** More deaths than this within RESTART_WINDOW_MS means the workers cannot run: give up. */
const MAX_RESTARTS = 5
const RESTART_WINDOW_MS = 60_000
const RESTART_DELAY_MS = 1_000
const STOP_TIMEOUT_MS = 15_000

export interface SuperviseOptions {
  workers: number
  log?: (line: string) => void
  exit?: (code: number) => void
}

/** Runs in the primary process: forks and looks after the workers until a stop signal. */
export function superviseWorkers({
  workers,
  log = console.log,
  exit = (code) => process.exit(code),
}: SuperviseOptions): void {
  let stopping = false
  const deaths: number[] = []

  const fork = (): Worker => cluster.fork()

  cluster.on('exit', (worker, code, signal) => {
    if (stopping) return // stopAll counts the exits
    const how = signal ? `signal ${signal}` : `code ${code}`
    const now = Date.now()
    deaths.push(now)
    while (deaths.length && deaths[0] < now - RESTART_WINDOW_MS) deaths.shift()
    if (deaths.length > MAX_RESTARTS) {
      log(
        `Sharpfield: workers died ${deaths.length} times within a minute (last: ${how}); stopping.`,
      )
      stopAll(1)
      return
    }
    log(`Sharpfield: worker ${worker.process.pid} stopped (${how}); starting a new one.`)
    setTimeout(() => {
      if (!stopping) fork()
    }, RESTART_DELAY_MS)
  })

  function stopAll(code: number) {
    if (stopping) return
    stopping = true
    const alive = Object.values(cluster.workers ?? {}).filter((w): w is Worker => Boolean(w))
    if (alive.length === 0) {
      exit(code)
      return
    }
    const force = setTimeout(() => {
      log(`Sharpfield: workers took longer than ${STOP_TIMEOUT_MS / 1000} s to stop; exiting.`)
      for (const w of alive) w.process.kill('SIGKILL')
      exit(1)
    }, STOP_TIMEOUT_MS)
    force.unref()
    cluster.on('exit', () => {
      if (Object.keys(cluster.workers ?? {}).length === 0) {
        clearTimeout(force)
        exit(code)
      }
    })
    // Each worker's own SIGTERM handler closes its server, jobs and pool (server/index.ts).
    for (const w of alive) w.process.kill('SIGTERM')
  }

  process.on('SIGTERM', () => {
    log('Sharpfield stopping (SIGTERM)…')
    stopAll(0)
  })
  process.on('SIGINT', () => {
    log('Sharpfield stopping (SIGINT)…')
    stopAll(0)
  })
  log(`Sharpfield primary ${process.pid}: starting ${workers} workers`)
  for (let i = 0; i < workers; i++) fork()
}
