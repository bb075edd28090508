import { and, eq, isNull, sql } from 'drizzle-orm'
import type { CheckCreatePayload } from '../../shared/schemas/checks'
import type { DbOrTx } from '../db/client'
import { roundCameras, rounds } from '../db/schema'
import { recordChanges, SYNC_ENTITIES } from './sync/changes'
import type { OpContext } from './sync/registry'

export interface RoundLink {
  /** The round the check counts for, or null. */
  roundId: number | null
  /** The round the device named but the server refused, with why (kept in the audit log). */
  dropped: { roundId: number; why: string } | null
}

/**
 * A check names the round it was made for. The server's round is authoritative: when the round
 * is gone, not the inspector's, or no longer lists the camera, the check is still stored (it is a
 * fact) but counts for no round, and the device's round id goes to the audit log.
 */
async function validate(tx: DbOrTx, p: CheckCreatePayload, ctx: OpContext): Promise<RoundLink> {
  if (p.roundId === undefined || p.roundId === null) return { roundId: null, dropped: null }
  const drop = (why: string): RoundLink => ({
    roundId: null,
    dropped: { roundId: p.roundId as number, why },
  })
  const [round] = await tx.select().from(rounds).where(eq(rounds.id, p.roundId))
  if (!round) return drop('the round no longer exists')
  if (round.assigneeId !== ctx.user.id && ctx.user.role === 'inspector') {
    return drop('the round is assigned to someone else')
  }
  const [member] = await tx
    .select({ cameraId: roundCameras.cameraId })
    .from(roundCameras)
    .where(and(eq(roundCameras.roundId, round.id), eq(roundCameras.cameraId, p.cameraId)))
  if (!member) return drop('the round no longer includes this camera')
  return { roundId: round.id, dropped: null }
}

/**
 * Marks the camera done in the round (the first check made for it counts) and closes the round
 * (`done`) once every camera in it has a check.
 */
async function link(tx: DbOrTx, roundId: number, p: CheckCreatePayload): Promise<void> {
  const [res] = await tx
    .update(roundCameras)
    .set({ checkId: p.id })
    .where(
      and(
        eq(roundCameras.roundId, roundId),
        eq(roundCameras.cameraId, p.cameraId),
        isNull(roundCameras.checkId),
      ),
    )
  if (res.affectedRows === 0) return
  const [{ open }] = await tx
    .select({ open: sql<number>`count(*)` })
    .from(roundCameras)
    .where(and(eq(roundCameras.roundId, roundId), isNull(roundCameras.checkId)))
  await tx
    .update(rounds)
    .set({
      version: sql`${rounds.version} + 1`,
      ...(Number(open) === 0 ? { status: 'done' as const } : {}),
    })
    .where(and(eq(rounds.id, roundId), eq(rounds.status, 'open')))
  await recordChanges(tx, SYNC_ENTITIES.round, [roundId])
}

export const recordRoundCheck = { validate, link }
