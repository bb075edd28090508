// The fleet's camera table: filtered, sorted and paged on the server. Deep pages stay fast with
// a deferred join: the page's ids are found on the cameras table (and its indexes) alone, then
// only those rows are joined with their site, task and model.
import { and, asc, count, desc, eq, inArray, like, lt, or, sql } from 'drizzle-orm'
import type { AnyColumn, SQL } from 'drizzle-orm'
import type {
  FleetCameraPage,
  FleetCameraQuery,
  FleetCameraRow,
  FleetSort,
} from '../../../shared/schemas/fleet'
import type { Db } from '../../db/client'
import { cameraModels, cameras, sites, tasks } from '../../db/schema'
import { iso } from './scope'

function conditions(q: FleetCameraQuery, now: Date): SQL | undefined {
  const where: SQL[] = []
  if (!q.includeRetired) where.push(eq(cameras.active, true))
  if (q.siteId !== undefined) where.push(eq(cameras.siteId, q.siteId))
  if (q.taskId !== undefined) where.push(eq(cameras.taskId, q.taskId))
  if (q.cameraModelId !== undefined) where.push(eq(cameras.cameraModelId, q.cameraModelId))
  if (q.state !== undefined) where.push(eq(cameras.state, q.state))
  if (q.lastVerdict !== undefined) where.push(eq(cameras.lastVerdict, q.lastVerdict))
  if (q.overdue === true) where.push(lt(cameras.nextDueAt, now))
  if (q.overdue === false)
    where.push(sql`(${cameras.nextDueAt} is null or ${cameras.nextDueAt} >= ${now})`)
  if (q.q !== undefined) {
    const pattern = `%${q.q.replace(/[\\%_]/g, (m) => `\\${m}`)}%`
    where.push(or(like(cameras.assetTag, pattern), like(cameras.locationText, pattern)) as SQL)
  }
  return where.length ? and(...where) : undefined
}

const SORT_COLUMN: Record<FleetSort, AnyColumn> = {
  assetTag: cameras.assetTag,
  site: sites.name,
  task: tasks.name,
  model: cameraModels.name,
  state: cameras.state,
  lastCheckAt: cameras.lastCheckAt,
  nextDueAt: cameras.nextDueAt,
  lastMtf50CyPx: cameras.lastMtf50CyPx,
}

async function pageIds(db: Db, q: FleetCameraQuery, cond: SQL | undefined): Promise<number[]> {
  const dir = q.order === 'desc' ? desc : asc
  // Ties fall back to the id (name sorts to the asset tag first) in the same direction, so
  // every row has one place and paging never repeats or skips a camera. (column, id) orders
  // follow the cameras indexes, which hold the id, so deep pages need no sort.
  const byName = q.sort === 'site' || q.sort === 'task' || q.sort === 'model'
  const order = byName
    ? [dir(SORT_COLUMN[q.sort]), dir(cameras.assetTag), dir(cameras.id)]
    : [dir(SORT_COLUMN[q.sort]), dir(cameras.id)]
  let ids = db.select({ id: cameras.id }).from(cameras).$dynamic()
  if (q.sort === 'site') ids = ids.innerJoin(sites, eq(sites.id, cameras.siteId))
  if (q.sort === 'task') ids = ids.innerJoin(tasks, eq(tasks.id, cameras.taskId))
  if (q.sort === 'model')
    ids = ids.innerJoin(cameraModels, eq(cameraModels.id, cameras.cameraModelId))
  const rows = await ids
    .where(cond)
    .orderBy(...order)
    .limit(q.limit)
    .offset(q.offset)
  return rows.map((r) => r.id)
}

export async function fleetCameraPage(
  db: Db,
  q: FleetCameraQuery,
  now: Date,
): Promise<FleetCameraPage> {
  const cond = conditions(q, now)
  const [ids, [{ total }]] = await Promise.all([
    pageIds(db, q, cond),
    db.select({ total: count() }).from(cameras).where(cond),
  ])
  const items = ids.length ? await rowsByIds(db, ids, now) : []
  return { items, total: Number(total), limit: q.limit, offset: q.offset }
}

/** Camera rows with their names, in the order of `ids`. */
export async function rowsByIds(db: Db, ids: number[], now: Date): Promise<FleetCameraRow[]> {
  const rows = await db
    .select({
      c: cameras,
      siteName: sites.name,
      taskName: tasks.name,
      taskMin: tasks.minMtf50CyPx,
      modelName: cameraModels.name,
    })
    .from(cameras)
    .innerJoin(sites, eq(sites.id, cameras.siteId))
    .innerJoin(tasks, eq(tasks.id, cameras.taskId))
    .innerJoin(cameraModels, eq(cameraModels.id, cameras.cameraModelId))
    .where(inArray(cameras.id, ids))
  const byId = new Map(rows.map((r) => [r.c.id, r]))
  return ids.flatMap((id) => {
    const r = byId.get(id)
    if (!r) return []
    const c = r.c
    return [
      {
        id: c.id,
        assetTag: c.assetTag,
        siteId: c.siteId,
        siteName: r.siteName,
        locationText: c.locationText,
        taskId: c.taskId,
        taskName: r.taskName,
        cameraModelId: c.cameraModelId,
        cameraModelName: r.modelName,
        state: c.state,
        lastCheckAt: iso(c.lastCheckAt),
        lastVerdict: c.lastVerdict,
        lastMtf50CyPx: c.lastMtf50CyPx,
        minMtf50CyPx: c.minMtf50CyPx ?? r.taskMin,
        nextDueAt: iso(c.nextDueAt),
        overdue: c.nextDueAt !== null && c.nextDueAt.getTime() < now.getTime(),
        active: c.active,
      },
    ]
  })
}
