// CSV exports of checks and of measurements with the fleet filters applied. Units are in the
// column names; rows come in capture order, read in batches so memory stays flat.
import { and, asc, count, eq, inArray } from 'drizzle-orm'
import {
  CHECK_CSV_COLUMNS,
  MAX_EXPORT_ROWS,
  MEASUREMENT_CSV_COLUMNS,
} from '../../../shared/schemas/reports'
import type { ExportQuery } from '../../../shared/schemas/reports'
import type { Db } from '../../db/client'
import { cameraModels, cameras, checks, measurements, sites, tasks, users } from '../../db/schema'
import { AppError } from '../../errors'
import { csvChunk } from './csvCells'
import type { Cell } from './csvCells'
import { after, exportConditions, fileDate } from './exportFilter'

const BATCH = 2000

export interface CsvExport {
  fileName: string
  rows: number
  chunks: AsyncGenerator<string>
}

function selectChecks(db: Db) {
  return db
    .select({
      k: checks,
      assetTag: cameras.assetTag,
      location: cameras.locationText,
      camMin: cameras.minMtf50CyPx,
      camPx: cameras.requiredPxPerM,
      siteName: sites.name,
      taskName: tasks.name,
      taskMin: tasks.minMtf50CyPx,
      taskPx: tasks.requiredPxPerM,
      modelName: cameraModels.name,
      inspector: users.name,
    })
    .from(checks)
    .innerJoin(cameras, eq(cameras.id, checks.cameraId))
    .innerJoin(sites, eq(sites.id, cameras.siteId))
    .innerJoin(tasks, eq(tasks.id, cameras.taskId))
    .innerJoin(cameraModels, eq(cameraModels.id, cameras.cameraModelId))
    .innerJoin(users, eq(users.id, checks.inspectorId))
}
type CheckRow = Awaited<ReturnType<ReturnType<typeof selectChecks>['where']>>[number]

/** Every matching check, batch by batch, in capture order. */
async function* checkBatches(db: Db, q: ExportQuery, now: Date): AsyncGenerator<CheckRow[]> {
  const { where } = exportConditions(q, now)
  let last: { capturedAt: Date; id: string } | null = null
  for (;;) {
    const batch: CheckRow[] = await selectChecks(db)
      .where(and(where, after(last)))
      .orderBy(asc(checks.capturedAt), asc(checks.id))
      .limit(BATCH)
    if (batch.length === 0) return
    yield batch
    const end = batch[batch.length - 1].k
    last = { capturedAt: end.capturedAt, id: end.id }
    if (batch.length < BATCH) return
  }
}

async function countRows(db: Db, q: ExportQuery, now: Date, perMeasurement: boolean) {
  const { where, period } = exportConditions(q, now)
  const base = perMeasurement
    ? db
        .select({ n: count() })
        .from(measurements)
        .innerJoin(checks, eq(checks.id, measurements.checkId))
    : db.select({ n: count() }).from(checks)
  const [{ n }] = await base.innerJoin(cameras, eq(cameras.id, checks.cameraId)).where(where)
  const rows = Number(n)
  if (rows > MAX_EXPORT_ROWS)
    throw new AppError(
      'export.too_large',
      `The export would hold ${rows} rows; at most ${MAX_EXPORT_ROWS} fit in one file. Narrow the period or the filters.`,
      413,
    )
  return { rows, period }
}

function checkCells(r: CheckRow, measurementCount: number): Cell[] {
  const k = r.k
  return [
    k.id,
    k.capturedAt,
    r.assetTag,
    r.siteName,
    r.location,
    r.taskName,
    r.modelName,
    k.mode,
    k.verdict,
    k.medianMtf50CyPx,
    r.camMin ?? r.taskMin,
    k.baselineRatio,
    k.pixelDensityPxPerM,
    r.camPx ?? r.taskPx,
    measurementCount,
    r.inspector,
    k.targetId,
    k.reasons.map((x) => x.text).join('; '),
    k.notes,
  ]
}

export async function exportChecksCsv(db: Db, q: ExportQuery, now: Date): Promise<CsvExport> {
  const { rows, period } = await countRows(db, q, now, false)
  async function* chunks() {
    yield '\uFEFF' + csvChunk(CHECK_CSV_COLUMNS, [], true)
    for await (const batch of checkBatches(db, q, now)) {
      const ids = batch.map((b) => b.k.id)
      const counts = await db
        .select({ checkId: measurements.checkId, n: count() })
        .from(measurements)
        .where(inArray(measurements.checkId, ids))
        .groupBy(measurements.checkId)
      const byCheck = new Map(counts.map((c) => [c.checkId, Number(c.n)]))
      yield csvChunk(
        CHECK_CSV_COLUMNS,
        batch.map((r) => checkCells(r, byCheck.get(r.k.id) ?? 0)),
        false,
      )
    }
  }
  return {
    fileName: `sharpfield-checks-${fileDate(period.from)}-to-${fileDate(new Date(period.to.getTime() - 1))}.csv`,
    rows,
    chunks: chunks(),
  }
}

export async function exportMeasurementsCsv(db: Db, q: ExportQuery, now: Date): Promise<CsvExport> {
  const { rows, period } = await countRows(db, q, now, true)
  async function* chunks() {
    yield '\uFEFF' + csvChunk(MEASUREMENT_CSV_COLUMNS, [], true)
    for await (const batch of checkBatches(db, q, now)) {
      const byId = new Map(batch.map((b) => [b.k.id, b]))
      const ms = await db
        .select()
        .from(measurements)
        .where(inArray(measurements.checkId, [...byId.keys()]))
      const order = new Map(batch.map((b, i) => [b.k.id, i]))
      ms.sort((a, b) => order.get(a.checkId)! - order.get(b.checkId)! || a.id.localeCompare(b.id))
      yield csvChunk(
        MEASUREMENT_CSV_COLUMNS,
        ms.map((m) => {
          const r = byId.get(m.checkId)!
          return [
            m.checkId,
            m.id,
            r.k.capturedAt,
            r.assetTag,
            r.siteName,
            r.k.mode,
            r.k.verdict,
            m.orientation,
            m.angleDeg,
            m.roiX,
            m.roiY,
            m.roiW,
            m.roiH,
            m.mtf50CyPx,
            m.mtf50pCyPx,
            m.mtf10CyPx,
            m.mtfNyquist,
            m.rise1090Px,
            m.overshoot,
            m.noise,
            m.psfModel,
            m.sigmaPx,
            m.radiusPx,
            m.psfRms,
            m.serverMtf50CyPx,
            m.disagreement,
            m.warnings.join('; '),
          ]
        }),
        false,
      )
    }
  }
  return {
    fileName: `sharpfield-measurements-${fileDate(period.from)}-to-${fileDate(new Date(period.to.getTime() - 1))}.csv`,
    rows,
    chunks: chunks(),
  }
}
