import type { Config } from '../config'
import type { Db } from '../db/client'
import { consoleLogger } from '../errors'
import type { Logger } from '../errors'
import { mailboxDir, readMailbox } from '../mail/mailbox'
import { createStorage } from '../storage'
import type { ObjectStorage } from '../storage'
import { createAttachmentService } from './attachments'
import { createAdminService } from './admin'
import { createAuthService } from './auth'
import { createCameraChecksService } from './cameraChecks'
import { createCameraService } from './cameras'
import { createCatalogService } from './catalog'
import { createFleetService } from './fleet'
import { createHealthService } from './health'
import type { LoginLimiter } from './loginLimiter'
import { createReportService } from './reports'
import { createRoundService } from './rounds'
import { createSiteService } from './sites'
import { createSyncService } from './sync'
import type { AccessTokens } from './tokens'
import { createUserService } from './users'
import { createWorkOrderService } from './workOrders'

export interface ServiceDeps {
  config: Config
  db: Db
  tokens: AccessTokens
  limiter: LoginLimiter
  now: () => Date
  logger?: Logger
  /** Where uploaded check images go (default: DATA_DIR/uploads). */
  storage?: ObjectStorage
}

/** Use-case functions over the database; routes call these and nothing below them. */
export function createServices({ config, db, tokens, limiter, now, ...deps }: ServiceDeps) {
  const logger = deps.logger ?? consoleLogger
  const storage = deps.storage ?? createStorage(config.dataDir)
  return {
    auth: createAuthService({ db, tokens, limiter, now }),
    users: createUserService(db),
    sites: createSiteService(db),
    cameras: createCameraService(db, now),
    cameraChecks: createCameraChecksService(db),
    catalog: createCatalogService(db),
    health: createHealthService(db),
    mailbox: { list: () => readMailbox(mailboxDir(config.dataDir)) },
    workOrders: createWorkOrderService({ db, config, now }),
    fleet: createFleetService(db, now),
    rounds: createRoundService(db, now),
    admin: createAdminService(db, now),
    reports: createReportService(db, now),
    sync: createSyncService({ db, now, logger, settleMs: config.syncSettleMs }),
    attachments: createAttachmentService({
      db,
      storage,
      now,
      frameRetentionDays: config.uploads.frameRetentionDays,
      maxBytes: config.uploads.maxBytes,
    }),
  }
}

export type Services = ReturnType<typeof createServices>
