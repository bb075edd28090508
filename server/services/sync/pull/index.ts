import { and, asc, gt, lte, max, sql } from 'drizzle-orm'
import type { PullQuery, PullResponse, SyncRemoved } from '../../../../shared/schemas/sync'
import type { Db, DbOrTx } from '../../../db/client'
import { changes } from '../../../db/schema'
import type { AuthUser } from '../../tokens'
import { PULL_SOURCES } from './sources'

export interface PullDeps {
  db: Db
  now: () => Date
  /** Changes younger than this are left for the next pull (see SYNC_SETTLE_MS). */
  settleMs: number
}

type Lists = Pick<
  PullResponse,
  'sites' | 'cameras' | 'tasks' | 'cameraModels' | 'rounds' | 'workOrders'
>

const LIST_OF = {
  site: 'sites',
  camera: 'cameras',
  task: 'tasks',
  camera_model: 'cameraModels',
  round: 'rounds',
  work_order: 'workOrders',
} as const satisfies Record<(typeof PULL_SOURCES)[number]['entity'], keyof Lists>

function emptyRemoved(): SyncRemoved {
  return { sites: [], cameras: [], tasks: [], cameraModels: [], rounds: [], workOrders: [] }
}

function emptyLists(): Lists {
  return { sites: [], cameras: [], tasks: [], cameraModels: [], rounds: [], workOrders: [] }
}

const settled = (settleMs: number) =>
  lte(changes.at, sql`NOW(3) - INTERVAL ${Math.round(settleMs * 1000)} MICROSECOND`)

function pushRemoved(removed: SyncRemoved, key: keyof SyncRemoved, ids: string[]): void {
  if (key === 'tasks') removed.tasks.push(...ids)
  else removed[key].push(...ids.map(Number).filter((n) => Number.isInteger(n)))
}

/** A first download: everything the user may see, and the cursor to continue from. */
async function fullPull(tx: DbOrTx, deps: PullDeps, user: AuthUser, now: Date) {
  const [{ horizon }] = await tx
    .select({ horizon: max(changes.seq) })
    .from(changes)
    .where(settled(deps.settleMs))
  const lists = emptyLists()
  for (const source of PULL_SOURCES) {
    ;(lists[LIST_OF[source.entity]] as unknown[]) = await source.load(tx, user, null, now)
  }
  return {
    cursor: Number(horizon ?? 0),
    hasMore: false,
    full: true,
    ...lists,
    removed: emptyRemoved(),
  }
}

/** The changes after `cursor`: current records of what changed, and what to drop. */
async function incrementalPull(
  tx: DbOrTx,
  deps: PullDeps,
  user: AuthUser,
  q: PullQuery,
  now: Date,
) {
  const rows = await tx
    .select({
      seq: changes.seq,
      entity: changes.entity,
      entityId: changes.entityId,
      action: changes.action,
    })
    .from(changes)
    .where(and(gt(changes.seq, q.cursor), settled(deps.settleMs)))
    .orderBy(asc(changes.seq))
    .limit(q.limit + 1)
  const hasMore = rows.length > q.limit
  const page = rows.slice(0, q.limit)
  const latest = new Map<string, Map<string, 'upsert' | 'delete'>>()
  for (const r of page) {
    let ids = latest.get(r.entity)
    if (!ids) latest.set(r.entity, (ids = new Map()))
    ids.delete(r.entityId) // keep insertion order = order of the last change
    ids.set(r.entityId, r.action)
  }
  const lists = emptyLists()
  const removed = emptyRemoved()
  for (const source of PULL_SOURCES) {
    const ids = latest.get(source.entity)
    if (!ids) continue
    const upserts = [...ids].filter(([, a]) => a === 'upsert').map(([id]) => id)
    const deletes = [...ids].filter(([, a]) => a === 'delete').map(([id]) => id)
    const items = upserts.length ? await source.load(tx, user, upserts, now) : []
    ;(lists[LIST_OF[source.entity]] as unknown[]) = items
    const seen = new Set(items.map((i) => String(i.id)))
    pushRemoved(removed, source.removedKey, [...deletes, ...upserts.filter((id) => !seen.has(id))])
  }
  const cursor = page.length ? page[page.length - 1].seq : q.cursor
  return { cursor, hasMore, full: false, ...lists, removed }
}

/**
 * GET /api/sync/pull. Cursor 0 (or a cursor the server never issued, e.g. after a database
 * reset) gives a full download (`full: true`: the device replaces what it holds); otherwise the
 * records changed after the cursor, with ids to drop under `removed` (deleted, or no longer
 * visible to this user). Reads run in one consistent snapshot.
 */
export async function pullChanges(
  deps: PullDeps,
  user: AuthUser,
  q: PullQuery,
): Promise<PullResponse> {
  const now = deps.now()
  const body = await deps.db.transaction(
    async (tx) => {
      const [{ top }] = await tx.select({ top: max(changes.seq) }).from(changes)
      const full = q.cursor === 0 || q.cursor > Number(top ?? 0)
      return full ? fullPull(tx, deps, user, now) : incrementalPull(tx, deps, user, q, now)
    },
    { isolationLevel: 'repeatable read', withConsistentSnapshot: true },
  )
  return { ...body, serverTime: now.toISOString() }
}
