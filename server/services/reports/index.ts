// Reports: CSV exports and printable PDF records (an acceptance record per check, a summary
// per site and period).
import { and, asc, count, desc, eq, gte, lt, sql } from 'drizzle-orm'
import type { FleetFilter } from '../../../shared/schemas/fleet'
import type { ExportQuery } from '../../../shared/schemas/reports'
import type { Db } from '../../db/client'
import { cameraModels, cameras, checks, sites, tasks, users } from '../../db/schema'
import { checkDetail } from '../fleet/history'
import { cameraScope, num, periodOf } from '../fleet/scope'
import { fleetSummary } from '../fleet/summary'
import { exportChecksCsv, exportMeasurementsCsv } from './csvExport'
import { acceptancePdf } from './pdf/acceptance'
import { summaryPdf } from './pdf/summary'
import type { SummaryCameraLine } from './pdf/summary'

const LIST_LIMIT = 300
const CHECK_LIMIT = 500

async function scopeName(db: Db, f: FleetFilter): Promise<string> {
  const parts: string[] = []
  if (f.siteId !== undefined) {
    const [s] = await db.select({ name: sites.name }).from(sites).where(eq(sites.id, f.siteId))
    parts.push(s?.name ?? `site ${f.siteId}`)
  } else parts.push('All sites')
  if (f.taskId !== undefined) {
    const [t] = await db.select({ name: tasks.name }).from(tasks).where(eq(tasks.id, f.taskId))
    parts.push(`task ${t?.name ?? f.taskId}`)
  }
  if (f.cameraModelId !== undefined) {
    const [m] = await db
      .select({ name: cameraModels.name })
      .from(cameraModels)
      .where(eq(cameraModels.id, f.cameraModelId))
    parts.push(`model ${m?.name ?? f.cameraModelId}`)
  }
  return parts.join(', ')
}

export function createReportService(db: Db, now: () => Date) {
  return {
    checksCsv: (q: ExportQuery) => exportChecksCsv(db, q, now()),
    measurementsCsv: (q: ExportQuery) => exportMeasurementsCsv(db, q, now()),

    async acceptancePdf(checkId: string): Promise<{ fileName: string; pdf: Buffer }> {
      const detail = await checkDetail(db, checkId)
      const day = detail.capturedAt.slice(0, 10)
      return {
        fileName: `sharpfield-acceptance-${detail.camera.assetTag.replace(/[^A-Za-z0-9._-]/g, '_')}-${day}.pdf`,
        pdf: await acceptancePdf(detail, now()),
      }
    },

    async summaryPdf(f: FleetFilter): Promise<{ fileName: string; pdf: Buffer }> {
      const t = now()
      const p = periodOf(f, t)
      const scope = cameraScope(f)
      const summary = await fleetSummary(db, f, t)
      const [failRows] = (await db.execute(sql`
        select cameras.asset_tag as assetTag, sites.name as siteName,
          cameras.location_text as locationText, l.captured_at as capturedAt,
          l.median_mtf50_cy_px as mtf
        from (
          select camera_id, verdict, captured_at, median_mtf50_cy_px,
            row_number() over (partition by camera_id order by captured_at desc, id desc) as rn
          from checks where captured_at >= ${p.from} and captured_at < ${p.to}
        ) l
        join cameras on cameras.id = l.camera_id
        join sites on sites.id = cameras.site_id
        where l.rn = 1 and l.verdict = 'fail' and ${scope}
        order by sites.name, cameras.asset_tag
        limit ${LIST_LIMIT}`)) as unknown as [Record<string, unknown>[]]
      const failing: SummaryCameraLine[] = failRows.map((r) => ({
        assetTag: String(r.assetTag),
        siteName: String(r.siteName),
        locationText: String(r.locationText ?? ''),
        detail: `${new Date(r.capturedAt as Date).toISOString().slice(0, 10)}, MTF50 ${
          r.mtf === null ? '—' : num(r.mtf).toFixed(3)
        }`,
      }))
      const overdueRows = await db
        .select({
          assetTag: cameras.assetTag,
          siteName: sites.name,
          locationText: cameras.locationText,
          nextDueAt: cameras.nextDueAt,
        })
        .from(cameras)
        .innerJoin(sites, eq(sites.id, cameras.siteId))
        .where(and(scope, lt(cameras.nextDueAt, t)))
        .orderBy(asc(cameras.nextDueAt))
        .limit(LIST_LIMIT)
      const inPeriod = and(scope, gte(checks.capturedAt, p.from), lt(checks.capturedAt, p.to))
      const checkRows = await db
        .select({
          capturedAt: checks.capturedAt,
          assetTag: cameras.assetTag,
          siteName: sites.name,
          mode: checks.mode,
          verdict: checks.verdict,
          medianMtf50CyPx: checks.medianMtf50CyPx,
          inspector: users.name,
        })
        .from(checks)
        .innerJoin(cameras, eq(cameras.id, checks.cameraId))
        .innerJoin(sites, eq(sites.id, cameras.siteId))
        .innerJoin(users, eq(users.id, checks.inspectorId))
        .where(inPeriod)
        .orderBy(desc(checks.capturedAt), desc(checks.id))
        .limit(CHECK_LIMIT)
      const [{ n }] = await db
        .select({ n: count() })
        .from(checks)
        .innerJoin(cameras, eq(cameras.id, checks.cameraId))
        .where(inPeriod)
      const name = await scopeName(db, f)
      const pdf = await summaryPdf({
        scopeName: name,
        summary,
        failing,
        overdue: overdueRows.map((r) => ({
          assetTag: r.assetTag,
          siteName: r.siteName,
          locationText: r.locationText,
          detail: r.nextDueAt ? r.nextDueAt.toISOString().slice(0, 10) : '—',
        })),
        checks: checkRows,
        checksLeftOut: Math.max(0, Number(n) - checkRows.length),
        generatedAt: t,
      })
      const slug = name
        .replace(/[^A-Za-z0-9]+/g, '-')
        .replace(/^-|-$/g, '')
        .toLowerCase()
      return {
        fileName: `sharpfield-summary-${slug}-${p.from.toISOString().slice(0, 10)}.pdf`,
        pdf,
      }
    },
  }
}

export type ReportService = ReturnType<typeof createReportService>
