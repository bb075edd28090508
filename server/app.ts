import express from 'express'
import type { Express } from 'express'
import helmet from 'helmet'
import { SYNC_LIMITS } from '../shared/schemas/sync'
import type { Config } from './config'
import type { Db } from './db/client'
import { apiNotFound, consoleLogger, errorHandler } from './errors'
import type { Logger } from './errors'
import { requireAuth, requireRole } from './middleware/auth'
import { routes } from './routes/table'
import { createServices } from './services'
import { createDbAttemptStore } from './services/loginAttemptsDb'
import { createLoginLimiter } from './services/loginLimiter'
import type { LoginLimiter } from './services/loginLimiter'
import { createAccessTokens } from './services/tokens'
import { registerWorkOrderSync } from './services/workOrders/register'
import { mountClient } from './static'
import type { ObjectStorage } from './storage'

export interface AppDeps {
  config: Config
  db: Db
  /** HS256 signing key for access tokens (see secret.ts). */
  jwtKey: Uint8Array
  loginLimiter?: LoginLimiter
  logger?: Logger
  now?: () => Date
  /** Where uploaded check images go (default: a folder under DATA_DIR). */
  storage?: ObjectStorage
}

/** Content Security Policy the PWA runs under (no inline scripts, workers from self/blob). */
export const CSP_DIRECTIVES = {
  defaultSrc: ["'self'"],
  scriptSrc: ["'self'"],
  styleSrc: ["'self'", "'unsafe-inline'"],
  imgSrc: ["'self'", 'data:', 'blob:'],
  workerSrc: ["'self'", 'blob:'],
  connectSrc: ["'self'"],
  fontSrc: ["'self'", 'data:'],
  manifestSrc: ["'self'"],
  objectSrc: ["'none'"],
  baseUri: ["'self'"],
  formAction: ["'self'"],
  frameAncestors: ["'none'"],
}

/** Builds the app: middleware → API routes → API 404 → client → error handler. Does not listen. */
export function createApp(deps: AppDeps): Express {
  const { config, db } = deps
  const logger = deps.logger ?? consoleLogger
  const now = deps.now ?? (() => new Date())
  const tokens = createAccessTokens(deps.jwtKey)
  const limiter = deps.loginLimiter ?? createLoginLimiter(createDbAttemptStore(db))

  const app = express()
  app.disable('x-powered-by')
  app.set('trust proxy', config.trustProxy)
  app.locals.services = createServices({
    ...{ config, db, tokens, limiter, now, logger },
    storage: deps.storage,
  })
  registerWorkOrderSync(config)

  app.use(
    helmet({
      // upgrade-insecure-requests would break plain-http loopback use, so defaults are off.
      contentSecurityPolicy: { useDefaults: false, directives: CSP_DIRECTIVES },
    }),
  )

  app.use('/api', (_req, res, next) => {
    res.setHeader('Cache-Control', 'no-store')
    next()
  })
  // A push carries up to 100 checks with their curves: it alone may be larger than 1 MB.
  app.use('/api/sync/push', express.json({ limit: SYNC_LIMITS.maxPushBytes }))
  app.use('/api', express.json({ limit: '1mb' }))

  const authenticate = requireAuth(tokens)
  for (const route of routes) {
    if (route.demoOnly && !config.demoMode) continue
    const guards = route.access === 'public' ? [] : [authenticate, requireRole(...route.access)]
    app[route.method](route.path, ...guards, route.handle)
  }
  app.use('/api', apiNotFound)

  mountClient(app, config.staticDir)
  app.use(errorHandler(logger))
  return app
}
