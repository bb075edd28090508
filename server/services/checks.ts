import { eq } from 'drizzle-orm'
import type { CheckCreatePayload } from '../../shared/schemas/checks'
import type { DbOrTx } from '../db/client'
import { cameras, checks, measurements, tasks } from '../db/schema'
import { runCheckHooks } from './checkHooks'
import type { CameraRow } from './checkHooks'
import { cameraStatusAfterCheck } from './checksCameraStatus'
import { recordRoundCheck } from './checksRound'
import { audit } from './sync/audit'
import { recordChanges, SYNC_ENTITIES } from './sync/changes'
import { isDuplicateEntry } from '../db/mysqlErrors'
import { OpRejection } from './sync/registry'
import type { OpContext, OpOutcome } from './sync/registry'

/** Devices' clocks drift; a capture time further ahead of the server than this is refused. */
export const MAX_CLOCK_AHEAD_MS = 10 * 60_000

/** Locks the camera row for the rest of the transaction (serialises checks of one camera). */
export async function lockCamera(tx: DbOrTx, cameraId: number): Promise<CameraRow> {
  const [camera] = await tx.select().from(cameras).where(eq(cameras.id, cameraId)).for('update')
  if (!camera) {
    throw new OpRejection(
      'camera.not_found',
      `There is no camera with id ${cameraId} on the server.`,
    )
  }
  return camera
}

async function existingCheck(tx: DbOrTx, id: string) {
  const [row] = await tx
    .select({ id: checks.id, cameraId: checks.cameraId, inspectorId: checks.inspectorId })
    .from(checks)
    .where(eq(checks.id, id))
  return row
}

/** The camera's task's check interval (cameras without their own interval follow their task). */
async function taskIntervalDays(tx: DbOrTx, taskId: string): Promise<number> {
  const [task] = await tx
    .select({ days: tasks.checkIntervalDays })
    .from(tasks)
    .where(eq(tasks.id, taskId))
  return task?.days ?? 365
}

function sameCheckOrReject(
  row: { cameraId: number; inspectorId: number },
  p: CheckCreatePayload,
  ctx: OpContext,
): OpOutcome {
  if (row.cameraId === p.cameraId && row.inspectorId === ctx.user.id) {
    return { status: 'duplicate', result: { checkId: p.id } }
  }
  throw new OpRejection('check.id_taken', 'Another check on the server already uses this id.')
}

function measurementRows(p: CheckCreatePayload) {
  return p.measurements.map((m) => ({
    id: m.id,
    checkId: p.id,
    roiX: m.roi.x,
    roiY: m.roi.y,
    roiW: m.roi.w,
    roiH: m.roi.h,
    orientation: m.orientation,
    angleDeg: m.angleDeg,
    mtf50CyPx: m.mtf50CyPx,
    mtf50pCyPx: m.mtf50pCyPx ?? null,
    mtf10CyPx: m.mtf10CyPx ?? null,
    mtfNyquist: m.mtfNyquist ?? null,
    rise1090Px: m.rise1090Px ?? null,
    overshoot: m.overshoot ?? null,
    noise: m.noise ?? null,
    psfModel: m.psf?.model ?? null,
    sigmaPx: m.psf?.sigmaPx ?? null,
    radiusPx: m.psf?.radiusPx ?? null,
    psfRms: m.psf?.rmsResidual ?? null,
    mtfCurve: m.mtfCurve,
    warnings: m.warnings,
  }))
}

/**
 * Applies `check.create`: stores the check (device UUID) and its measurements, links it to its
 * round, updates the camera's status (newest check wins, see checksCameraStatus.ts), runs the
 * onCheckRecorded hooks and writes the change feed — all in the caller's transaction.
 * The same check id sent again (under any operation id) is a duplicate with no further effect.
 */
export async function recordCheck(
  tx: DbOrTx,
  p: CheckCreatePayload,
  ctx: OpContext,
): Promise<OpOutcome> {
  const capturedAt = new Date(p.capturedAt)
  if (capturedAt.getTime() > ctx.now.getTime() + MAX_CLOCK_AHEAD_MS) {
    throw new OpRejection(
      'check.in_future',
      `The check's capture time ${p.capturedAt} is ahead of the server's clock; check the phone's date and time.`,
    )
  }
  const camera = await lockCamera(tx, p.cameraId)
  const round = await recordRoundCheck.validate(tx, p, ctx)

  const row = {
    id: p.id,
    cameraId: p.cameraId,
    inspectorId: ctx.user.id,
    roundId: round.roundId,
    capturedAt,
    mode: p.mode,
    verdict: p.verdict,
    reasons: p.reasons,
    medianMtf50CyPx: p.medianMtf50CyPx,
    pixelDensityPxPerM: p.pixelDensityPxPerM ?? null,
    baselineRatio: p.baselineRatio ?? null,
    targetId: p.targetId ?? null,
    notes: p.notes ?? null,
    isBaseline: false,
    shareFrame: p.shareFrame,
    deviceId: ctx.deviceId,
    createdAt: ctx.now,
    syncedAt: ctx.now,
  }
  try {
    await tx.insert(checks).values(row)
  } catch (err) {
    if (!isDuplicateEntry(err, 'PRIMARY')) throw err
    // The check id is stored already: sent before under another operation id, or by another
    // operation that committed while this one waited for the camera's lock.
    const raced = await existingCheck(tx, p.id)
    if (raced) return sameCheckOrReject(raced, p, ctx)
    throw err
  }
  if (p.measurements.length) {
    try {
      await tx.insert(measurements).values(measurementRows(p))
    } catch (err) {
      if (!isDuplicateEntry(err)) throw err
      throw new OpRejection(
        'measurement.id_taken',
        'A measurement id of this check is already used by another check.',
      )
    }
  }
  if (round.roundId !== null) await recordRoundCheck.link(tx, round.roundId, p)

  const interval = camera.checkIntervalDays ?? (await taskIntervalDays(tx, camera.taskId))
  const status = cameraStatusAfterCheck(camera, row, interval, ctx.now)
  const changed = Object.keys(status.set).length > 0
  if (changed) {
    await tx
      .update(cameras)
      .set({ ...status.set, version: camera.version + 1 })
      .where(eq(cameras.id, camera.id))
  }
  const cameraAfter: CameraRow = changed
    ? { ...camera, ...status.set, version: camera.version + 1 }
    : camera

  await recordConflicts(tx, p, ctx, camera, status.isLatest, round.dropped)
  await runCheckHooks(tx, {
    check: row,
    cameraBefore: camera,
    cameraAfter,
    isLatest: status.isLatest,
    actor: ctx.user,
    deviceId: ctx.deviceId,
    now: ctx.now,
  })
  await recordChanges(tx, SYNC_ENTITIES.camera, [camera.id])
  return { status: 'applied', result: { checkId: p.id, isLatest: status.isLatest } }
}

/** Where the device's view differed from the server's, the losing value goes to the audit log. */
async function recordConflicts(
  tx: DbOrTx,
  p: CheckCreatePayload,
  ctx: OpContext,
  camera: CameraRow,
  isLatest: boolean,
  droppedRound: { roundId: number; why: string } | null,
): Promise<void> {
  const base = { actorId: ctx.user.id, entity: 'check', entityId: p.id }
  const op = { opId: ctx.opId, deviceId: ctx.deviceId, kind: ctx.kind }
  if (p.cameraVersion !== undefined && p.cameraVersion !== camera.version) {
    await audit(tx, {
      ...base,
      action: 'sync.conflict.camera_version',
      detail: {
        ...op,
        cameraId: camera.id,
        deviceCameraVersion: p.cameraVersion,
        serverCameraVersion: camera.version,
        kept: 'the check as measured and judged on the device',
      },
    })
  }
  if (!isLatest) {
    await audit(tx, {
      ...base,
      action: 'sync.conflict.older_check',
      detail: {
        ...op,
        cameraId: camera.id,
        capturedAt: p.capturedAt,
        cameraLastCheckAt: camera.lastCheckAt?.toISOString() ?? null,
        deviceVerdict: p.verdict,
        kept: 'in the check history; the camera keeps the newer result',
      },
    })
  }
  if (droppedRound) {
    await audit(tx, {
      ...base,
      action: 'sync.conflict.round',
      detail: { ...op, deviceRoundId: droppedRound.roundId, why: droppedRound.why },
    })
  }
}
