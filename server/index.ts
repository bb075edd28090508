// Boot: config → database pool → app → listen; graceful shutdown on SIGTERM/SIGINT.
import cluster from 'node:cluster'
import type { AddressInfo } from 'node:net'
import { createApp } from './app'
import { superviseWorkers } from './cluster'
import { ConfigError, loadConfig, redactUrl } from './config'
import { createDb } from './db/client'
import { consoleLogger } from './errors'
import { createBackgroundJobs } from './jobs'
import { loadJwtKey } from './secret'
import { createAttachmentService } from './services/attachments'
import { createStorage } from './storage'

async function main(): Promise<void> {
  const config = loadConfig()
  const jwtKey = loadJwtKey(config.jwtSecret, config.dataDir)
  if (config.workers > 1 && cluster.isPrimary) {
    // The key file is created here, once, before the workers read it.
    superviseWorkers({ workers: config.workers })
    return
  }
  const handle = createDb(config.databaseUrl, { connectionLimit: config.dbPoolSize })
  const app = createApp({ config, db: handle.db, jwtKey })

  const server = app.listen(config.port, config.host)
  await new Promise<void>((resolve, reject) => {
    server.once('listening', resolve)
    server.once('error', reject)
  })
  const { port } = server.address() as AddressInfo
  const who = cluster.isWorker ? ` (worker ${process.pid})` : ''
  console.log(`Sharpfield listening on http://${config.host}:${port}${who}`)
  console.log(
    `  database ${redactUrl(config.databaseUrl)}, demo mode ${config.demoMode ? 'on' : 'off'}`,
  )
  // Mail outbox drain and the daily overdue digest; every replica may run them (rows are claimed).
  const attachments = createAttachmentService({
    db: handle.db,
    storage: createStorage(config.dataDir),
    now: () => new Date(),
    frameRetentionDays: config.uploads.frameRetentionDays,
    maxBytes: config.uploads.maxBytes,
  })
  const jobs = createBackgroundJobs({ db: handle.db, config, logger: consoleLogger, attachments })
  jobs.start()

  let stopping = false
  const shutdown = (signal: string) => {
    if (stopping) return
    stopping = true
    console.log(`Sharpfield stopping (${signal})…`)
    const force = setTimeout(() => {
      console.error('Sharpfield: shutdown took longer than 10 s; exiting.')
      process.exit(1)
    }, 10_000)
    force.unref()
    server.close(() => {
      jobs
        .stop()
        .then(() => handle.close())
        .catch((err: unknown) => console.error('Closing the database pool failed:', err))
        .finally(() => process.exit(0))
    })
    server.closeIdleConnections()
  }
  process.on('SIGTERM', () => shutdown('SIGTERM'))
  process.on('SIGINT', () => shutdown('SIGINT'))
}

main().catch((err: unknown) => {
  if (err instanceof ConfigError) console.error(err.message)
  else if ((err as NodeJS.ErrnoException).code === 'EADDRINUSE') {
    console.error(
      `Sharpfield cannot start: ${(err as Error).message}. Is another server on that port?`,
    )
  } else console.error('Sharpfield failed to start:', err)
  process.exit(1)
})
