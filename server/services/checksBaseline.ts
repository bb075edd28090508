import { eq } from 'drizzle-orm'
import type { MarkBaselinePayload } from '../../shared/schemas/checks'
import type { DbOrTx } from '../db/client'
import { cameras, checks } from '../db/schema'
import { lockCamera } from './checks'
import { audit } from './sync/audit'
import { recordChanges, SYNC_ENTITIES } from './sync/changes'
import { OpRejection } from './sync/registry'
import type { OpContext, OpOutcome } from './sync/registry'

/**
 * Applies `check.markBaseline`: the check becomes its camera's commissioning baseline.
 * A supervisor may always set (or replace) it; an inspector only for a camera that has no
 * baseline yet (commissioning), and only with a check of their own. When two devices commission
 * the same camera offline, the first to reach the server wins and the second is rejected with
 * the reason; a replaced baseline is kept in the audit log.
 */
export async function markBaseline(
  tx: DbOrTx,
  p: MarkBaselinePayload,
  ctx: OpContext,
): Promise<OpOutcome> {
  const camera = await lockCamera(tx, p.cameraId)
  const [check] = await tx
    .select({ id: checks.id, cameraId: checks.cameraId, inspectorId: checks.inspectorId })
    .from(checks)
    .where(eq(checks.id, p.checkId))
  if (!check) {
    throw new OpRejection(
      'check.not_found',
      'The check is not on the server yet; it has to be synced before it can become the baseline.',
    )
  }
  if (check.cameraId !== camera.id) {
    throw new OpRejection('check.wrong_camera', 'That check was made on a different camera.')
  }
  if (camera.baselineCheckId === check.id) {
    return { status: 'duplicate', result: { baselineCheckId: check.id } }
  }
  if (ctx.user.role !== 'supervisor') {
    if (camera.baselineCheckId !== null) {
      throw new OpRejection(
        'baseline.exists',
        `Camera ${camera.assetTag} already has a baseline (check ${camera.baselineCheckId}); only a supervisor can replace it.`,
      )
    }
    if (check.inspectorId !== ctx.user.id) {
      throw new OpRejection(
        'baseline.not_own_check',
        'An inspector can only make one of their own checks the baseline.',
      )
    }
  }
  const previous = camera.baselineCheckId
  if (previous) await tx.update(checks).set({ isBaseline: false }).where(eq(checks.id, previous))
  await tx.update(checks).set({ isBaseline: true }).where(eq(checks.id, check.id))
  await tx
    .update(cameras)
    .set({ baselineCheckId: check.id, version: camera.version + 1 })
    .where(eq(cameras.id, camera.id))
  await audit(tx, {
    actorId: ctx.user.id,
    action: 'camera.baseline',
    entity: 'camera',
    entityId: camera.id,
    detail: {
      previousBaselineCheckId: previous,
      baselineCheckId: check.id,
      opId: ctx.opId,
      deviceId: ctx.deviceId,
      deviceCameraVersion: p.cameraVersion ?? null,
      serverCameraVersion: camera.version,
    },
  })
  await recordChanges(tx, SYNC_ENTITIES.camera, [camera.id])
  return { status: 'applied', result: { baselineCheckId: check.id, previous } }
}
