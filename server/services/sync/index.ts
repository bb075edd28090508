import type {
  PullQuery,
  PushRequest,
  PushResponse,
  PullResponse,
} from '../../../shared/schemas/sync'
import type { Db } from '../../db/client'
import type { Logger } from '../../errors'
import type { AuthUser } from '../tokens'
import { registerBuiltInOps } from './ops'
import { pullChanges } from './pull'
import { pushOps } from './push'

export interface SyncServiceDeps {
  db: Db
  now: () => Date
  logger: Logger
  settleMs: number
}

/** Push (operations from devices) and pull (changes for devices). See README.md here. */
export function createSyncService(deps: SyncServiceDeps) {
  registerBuiltInOps()
  return {
    async push(user: AuthUser, body: PushRequest): Promise<PushResponse> {
      const results = await pushOps(deps, user, body)
      return { results, serverTime: deps.now().toISOString() }
    },
    pull(user: AuthUser, query: PullQuery): Promise<PullResponse> {
      return pullChanges(deps, user, query)
    },
  }
}

export type SyncService = ReturnType<typeof createSyncService>
export { registerOp, OpRejection } from './registry'
export type { OpDef, OpContext, OpOutcome } from './registry'
export { recordChanges, SYNC_ENTITIES } from './changes'
