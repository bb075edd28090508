// A camera's history (the trend chart: MTF50 over time with its threshold and baseline) and one
// check with everything it recorded (the MTF curves of its edges).
import { asc, eq } from 'drizzle-orm'
import type { CameraHistory, CheckDetail } from '../../../shared/schemas/fleet'
import type { Db } from '../../db/client'
import { cameraModels, cameras, checks, measurements, sites, tasks, users } from '../../db/schema'
import { AppError } from '../../errors'
import { checksPage } from '../cameraChecks'
import { rowsByIds } from './cameraTable'
import { FLEET_ERRORS, iso } from './scope'

export async function cameraHistory(
  db: Db,
  cameraId: number,
  limit: number,
  now: Date,
): Promise<CameraHistory> {
  const [row] = await rowsByIds(db, [cameraId], now)
  if (!row)
    throw new AppError(FLEET_ERRORS.cameraNotFound, `There is no camera with id ${cameraId}.`, 404)
  const [extra] = await db
    .select({
      requiredPxPerM: cameras.requiredPxPerM,
      checkIntervalDays: cameras.checkIntervalDays,
      baselineCheckId: cameras.baselineCheckId,
      taskPx: tasks.requiredPxPerM,
      taskInterval: tasks.checkIntervalDays,
      marginalBand: tasks.marginalBand,
    })
    .from(cameras)
    .innerJoin(tasks, eq(tasks.id, cameras.taskId))
    .where(eq(cameras.id, cameraId))
  const page = await checksPage(db, cameraId, extra.baselineCheckId, limit)
  return {
    camera: {
      ...row,
      requiredPxPerM: extra.requiredPxPerM ?? extra.taskPx,
      checkIntervalDays: extra.checkIntervalDays ?? extra.taskInterval,
      marginalBand: extra.marginalBand,
    },
    ...page,
  }
}

export async function checkDetail(db: Db, checkId: string): Promise<CheckDetail> {
  const [r] = await db
    .select({
      k: checks,
      cam: cameras,
      siteName: sites.name,
      siteTimeZone: sites.timeZone,
      task: tasks,
      modelName: cameraModels.name,
      inspectorName: users.name,
    })
    .from(checks)
    .innerJoin(cameras, eq(cameras.id, checks.cameraId))
    .innerJoin(sites, eq(sites.id, cameras.siteId))
    .innerJoin(tasks, eq(tasks.id, cameras.taskId))
    .innerJoin(cameraModels, eq(cameraModels.id, cameras.cameraModelId))
    .innerJoin(users, eq(users.id, checks.inspectorId))
    .where(eq(checks.id, checkId))
  if (!r)
    throw new AppError(FLEET_ERRORS.checkNotFound, `There is no check with id ${checkId}.`, 404)
  const ms = await db
    .select()
    .from(measurements)
    .where(eq(measurements.checkId, checkId))
    .orderBy(asc(measurements.orientation), asc(measurements.roiY), asc(measurements.roiX))
  const k = r.k
  return {
    id: k.id,
    camera: {
      id: r.cam.id,
      assetTag: r.cam.assetTag,
      siteName: r.siteName,
      siteTimeZone: r.siteTimeZone,
      locationText: r.cam.locationText,
      taskId: r.task.id,
      taskName: r.task.name,
      cameraModelName: r.modelName,
      minMtf50CyPx: r.cam.minMtf50CyPx ?? r.task.minMtf50CyPx,
      requiredPxPerM: r.cam.requiredPxPerM ?? r.task.requiredPxPerM,
    },
    inspector: { id: k.inspectorId, name: r.inspectorName },
    roundId: k.roundId,
    capturedAt: k.capturedAt.toISOString(),
    mode: k.mode,
    verdict: k.verdict,
    reasons: k.reasons,
    medianMtf50CyPx: k.medianMtf50CyPx,
    pixelDensityPxPerM: k.pixelDensityPxPerM,
    baselineRatio: k.baselineRatio,
    targetId: k.targetId,
    notes: k.notes,
    isBaseline: k.isBaseline,
    syncedAt: iso(k.syncedAt),
    measurements: ms.map((m) => ({
      id: m.id,
      roi: { x: m.roiX, y: m.roiY, w: m.roiW, h: m.roiH },
      orientation: m.orientation,
      angleDeg: m.angleDeg,
      mtf50CyPx: m.mtf50CyPx,
      mtf50pCyPx: m.mtf50pCyPx,
      mtf10CyPx: m.mtf10CyPx,
      mtfNyquist: m.mtfNyquist,
      rise1090Px: m.rise1090Px,
      overshoot: m.overshoot,
      noise: m.noise,
      psf: m.psfModel
        ? { model: m.psfModel, sigmaPx: m.sigmaPx, radiusPx: m.radiusPx, rmsResidual: m.psfRms }
        : null,
      mtfCurve: m.mtfCurve,
      warnings: m.warnings,
      serverMtf50CyPx: m.serverMtf50CyPx,
      disagreement: m.disagreement,
    })),
  }
}
