// Rounds: a supervisor gives cameras (or a whole site) to an inspector with a due date, lists
// them and cancels them. Every write lands in the change feed (entity `round`) so the
// inspector's device receives it on its next pull, and in the audit log.
import { and, asc, count, desc, eq, inArray, isNotNull, sql } from 'drizzle-orm'
import type { SQL } from 'drizzle-orm'
import type {
  Round,
  RoundAssignee,
  RoundCreate,
  RoundDetail,
  RoundList,
  RoundListQuery,
} from '../../../shared/schemas/rounds'
import type { Db } from '../../db/client'
import { cameras, roundCameras, rounds, sites, users } from '../../db/schema'
import { AppError } from '../../errors'
import { audit } from '../sync/audit'
import { recordChanges, SYNC_ENTITIES } from '../sync/changes'
import type { AuthUser } from '../tokens'
import { alias } from 'drizzle-orm/mysql-core'

export const ROUND_ERRORS = {
  notFound: 'round.not_found',
  badAssignee: 'round.bad_assignee',
  badCameras: 'round.bad_cameras',
  pastDue: 'round.past_due',
  notOpen: 'round.not_open',
  notAllowed: 'round.not_allowed',
} as const

const creator = alias(users, 'creator')

function selectRounds(db: Db, cond: SQL | undefined) {
  return db
    .select({
      r: rounds,
      siteName: sites.name,
      assigneeName: users.name,
      createdByName: creator.name,
      cameraCount: sql<number>`(select count(*) from round_cameras rc where rc.round_id = ${rounds.id})`,
      doneCount: sql<number>`(select count(*) from round_cameras rc where rc.round_id = ${rounds.id} and rc.check_id is not null)`,
    })
    .from(rounds)
    .leftJoin(sites, eq(sites.id, rounds.siteId))
    .innerJoin(users, eq(users.id, rounds.assigneeId))
    .innerJoin(creator, eq(creator.id, rounds.createdBy))
    .where(cond)
}

type Row = Awaited<ReturnType<typeof selectRounds>>[number]

function toRound(x: Row, now: Date): Round {
  const r = x.r
  return {
    id: r.id,
    name: r.name,
    siteId: r.siteId,
    siteName: x.siteName,
    assigneeId: r.assigneeId,
    assigneeName: x.assigneeName,
    dueAt: r.dueAt.toISOString(),
    overdue: r.status === 'open' && r.dueAt.getTime() < now.getTime(),
    status: r.status,
    cameraCount: Number(x.cameraCount),
    doneCount: Number(x.doneCount),
    createdById: r.createdBy,
    createdByName: x.createdByName,
    createdAt: r.createdAt.toISOString(),
    version: r.version,
  }
}

/** Inspectors only see their own rounds. */
function visibleTo(user: AuthUser): SQL | undefined {
  return user.role === 'inspector' ? eq(rounds.assigneeId, user.id) : undefined
}

export function createRoundService(db: Db, now: () => Date) {
  async function get(user: AuthUser, id: number): Promise<RoundDetail> {
    const [row] = await selectRounds(db, and(eq(rounds.id, id), visibleTo(user)))
    if (!row) throw new AppError(ROUND_ERRORS.notFound, `There is no round with id ${id}.`, 404)
    const members = await db
      .select({
        cameraId: roundCameras.cameraId,
        checkId: roundCameras.checkId,
        assetTag: cameras.assetTag,
        siteName: sites.name,
        locationText: cameras.locationText,
      })
      .from(roundCameras)
      .innerJoin(cameras, eq(cameras.id, roundCameras.cameraId))
      .innerJoin(sites, eq(sites.id, cameras.siteId))
      .where(eq(roundCameras.roundId, id))
      .orderBy(asc(sites.name), asc(cameras.assetTag))
    return { ...toRound(row, now()), cameras: members }
  }

  async function camerasFor(input: RoundCreate): Promise<number[]> {
    if (input.cameraIds) {
      const wanted = [...new Set(input.cameraIds)]
      const found = await db
        .select({ id: cameras.id, siteId: cameras.siteId, active: cameras.active })
        .from(cameras)
        .where(inArray(cameras.id, wanted))
      const byId = new Map(found.map((c) => [c.id, c]))
      const missing = wanted.filter((id) => !byId.get(id)?.active)
      if (missing.length)
        throw new AppError(
          ROUND_ERRORS.badCameras,
          `These cameras do not exist or are retired: ${missing.slice(0, 10).join(', ')}.`,
          400,
          { cameraIds: missing },
        )
      if (input.siteId !== undefined) {
        const elsewhere = found.filter((c) => c.siteId !== input.siteId).map((c) => c.id)
        if (elsewhere.length)
          throw new AppError(
            ROUND_ERRORS.badCameras,
            `Some cameras are not at the chosen site: ${elsewhere.slice(0, 10).join(', ')}.`,
            400,
            { cameraIds: elsewhere },
          )
      }
      return wanted
    }
    const [site] = await db.select({ id: sites.id }).from(sites).where(eq(sites.id, input.siteId!))
    if (!site)
      throw new AppError(ROUND_ERRORS.badCameras, `There is no site with id ${input.siteId}.`, 400)
    const all = await db
      .select({ id: cameras.id })
      .from(cameras)
      .where(and(eq(cameras.siteId, input.siteId!), eq(cameras.active, true)))
    if (all.length === 0)
      throw new AppError(ROUND_ERRORS.badCameras, 'The site has no active cameras.', 400)
    return all.map((c) => c.id)
  }

  return {
    get,

    async list(user: AuthUser, q: RoundListQuery): Promise<RoundList> {
      const where: SQL[] = []
      const own = visibleTo(user)
      if (own) where.push(own)
      if (q.status) where.push(eq(rounds.status, q.status))
      if (q.assigneeId) where.push(eq(rounds.assigneeId, q.assigneeId))
      if (q.siteId) where.push(eq(rounds.siteId, q.siteId))
      const cond = where.length ? and(...where) : undefined
      const rows = await selectRounds(db, cond)
        .orderBy(asc(sql`(${rounds.status} <> 'open')`), asc(rounds.dueAt), desc(rounds.id))
        .limit(q.limit)
        .offset(q.offset)
      const [{ total }] = await db.select({ total: count() }).from(rounds).where(cond)
      const t = now()
      return {
        items: rows.map((r) => toRound(r, t)),
        total: Number(total),
        limit: q.limit,
        offset: q.offset,
      }
    },

    async assignees(): Promise<RoundAssignee[]> {
      return db
        .select({ id: users.id, name: users.name, email: users.email })
        .from(users)
        .where(and(eq(users.role, 'inspector'), eq(users.active, true)))
        .orderBy(asc(users.name))
    },

    async create(user: AuthUser, input: RoundCreate): Promise<RoundDetail> {
      const dueAt = new Date(input.dueAt)
      if (dueAt.getTime() < now().getTime())
        throw new AppError(ROUND_ERRORS.pastDue, 'The due date has already passed.', 400)
      const [assignee] = await db
        .select({ role: users.role, active: users.active })
        .from(users)
        .where(eq(users.id, input.assigneeId))
      if (!assignee || assignee.role !== 'inspector' || !assignee.active)
        throw new AppError(
          ROUND_ERRORS.badAssignee,
          'Rounds go to active inspectors only; choose one from the list.',
          400,
        )
      const cameraIds = await camerasFor(input)
      const id = await db.transaction(async (tx) => {
        const [ins] = await tx
          .insert(rounds)
          .values({
            name: input.name,
            siteId: input.siteId ?? null,
            assigneeId: input.assigneeId,
            dueAt,
            createdBy: user.id,
          })
          .$returningId()
        for (let i = 0; i < cameraIds.length; i += 500) {
          await tx
            .insert(roundCameras)
            .values(cameraIds.slice(i, i + 500).map((cameraId) => ({ roundId: ins.id, cameraId })))
        }
        await audit(tx, {
          actorId: user.id,
          action: 'round.create',
          entity: 'round',
          entityId: ins.id,
          detail: {
            after: {
              name: input.name,
              assigneeId: input.assigneeId,
              dueAt: input.dueAt,
              siteId: input.siteId ?? null,
            },
            cameraCount: cameraIds.length,
          },
        })
        await recordChanges(tx, SYNC_ENTITIES.round, [ins.id])
        return ins.id
      })
      return get(user, id)
    },

    async cancel(user: AuthUser, id: number, reason?: string): Promise<RoundDetail> {
      await db.transaction(async (tx) => {
        const [r] = await tx.select().from(rounds).where(eq(rounds.id, id)).for('update')
        if (!r) throw new AppError(ROUND_ERRORS.notFound, `There is no round with id ${id}.`, 404)
        if (r.status !== 'open')
          throw new AppError(ROUND_ERRORS.notOpen, `The round is already ${r.status}.`, 409)
        await tx
          .update(rounds)
          .set({ status: 'cancelled', version: sql`${rounds.version} + 1` })
          .where(eq(rounds.id, id))
        const [{ done }] = await tx
          .select({ done: count() })
          .from(roundCameras)
          .where(and(eq(roundCameras.roundId, id), isNotNull(roundCameras.checkId)))
        await audit(tx, {
          actorId: user.id,
          action: 'round.cancel',
          entity: 'round',
          entityId: id,
          detail: {
            before: { status: r.status },
            after: { status: 'cancelled' },
            reason: reason ?? null,
            camerasDone: Number(done),
          },
        })
        await recordChanges(tx, SYNC_ENTITIES.round, [id])
      })
      return get(user, id)
    },
  }
}

export type RoundService = ReturnType<typeof createRoundService>
