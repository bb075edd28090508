// A camera's checks on the server, newest first, with its baseline: the camera screen's history
// and trend, and what a device keeps to judge drift while offline.
import { desc, eq } from 'drizzle-orm'
import type { CameraChecks } from '../../shared/schemas/cameraChecks'
import type { Db } from '../db/client'
import { cameras, checks, users } from '../db/schema'
import { AppError } from '../errors'

/**
 * The camera's checks, newest first (at most `limit`, `truncated` when there are more), and its
 * baseline check's MTF50. Shared by the camera screen's list and the fleet history.
 */
export async function checksPage(
  db: Db,
  cameraId: number,
  baselineCheckId: string | null,
  limit: number,
): Promise<Pick<CameraChecks, 'baseline' | 'checks' | 'truncated'>> {
  const rows = await db
    .select({
      id: checks.id,
      capturedAt: checks.capturedAt,
      mode: checks.mode,
      verdict: checks.verdict,
      medianMtf50CyPx: checks.medianMtf50CyPx,
      pixelDensityPxPerM: checks.pixelDensityPxPerM,
      baselineRatio: checks.baselineRatio,
      isBaseline: checks.isBaseline,
      inspectorName: users.name,
    })
    .from(checks)
    .innerJoin(users, eq(users.id, checks.inspectorId))
    .where(eq(checks.cameraId, cameraId))
    .orderBy(desc(checks.capturedAt), desc(checks.id))
    .limit(limit + 1)
  let baseline: CameraChecks['baseline'] = null
  if (baselineCheckId) {
    const [b] = await db
      .select({ mtf: checks.medianMtf50CyPx })
      .from(checks)
      .where(eq(checks.id, baselineCheckId))
    baseline = { checkId: baselineCheckId, mtf50CyPx: b?.mtf ?? null }
  }
  return {
    baseline,
    checks: rows.slice(0, limit).map((c) => ({ ...c, capturedAt: c.capturedAt.toISOString() })),
    truncated: rows.length > limit,
  }
}

export function createCameraChecksService(db: Db) {
  return {
    async list(cameraId: number, limit: number): Promise<CameraChecks> {
      const [camera] = await db
        .select({ id: cameras.id, baselineCheckId: cameras.baselineCheckId })
        .from(cameras)
        .where(eq(cameras.id, cameraId))
      if (!camera) {
        throw new AppError('camera.not_found', `There is no camera with id ${cameraId}.`, 404)
      }
      return { cameraId, ...(await checksPage(db, cameraId, camera.baselineCheckId, limit)) }
    },
  }
}
