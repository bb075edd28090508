import type { Response } from 'express'
import { fleetFilterSchema } from '../../shared/schemas/fleet'
import { checkIdParamSchema, exportQuerySchema } from '../../shared/schemas/reports'
import type { CsvExport } from '../services/reports/csvExport'
import { defineRoute } from './define'

// Exports (CSV) and printable records (PDF) for supervisors; admins may read them too.
const REPORT_READERS = ['supervisor', 'admin'] as const

function attachment(res: Response, type: string, fileName: string): void {
  res.setHeader('Content-Type', type)
  res.setHeader('Content-Disposition', `attachment; filename="${fileName.replace(/"/g, '')}"`)
}

async function sendCsv(res: Response, csv: CsvExport): Promise<void> {
  attachment(res, 'text/csv; charset=utf-8', csv.fileName)
  res.setHeader('X-Row-Count', String(csv.rows))
  res.status(200)
  for await (const chunk of csv.chunks) {
    if (!res.write(chunk)) await new Promise((resolve) => res.once('drain', resolve))
  }
  res.end()
}

function sendPdf(res: Response, out: { fileName: string; pdf: Buffer }): void {
  attachment(res, 'application/pdf', out.fileName)
  res.status(200).end(out.pdf)
}

export const reportRoutes = [
  defineRoute({
    method: 'get',
    path: '/api/reports/checks.csv',
    access: REPORT_READERS,
    summary: 'CSV of the checks matching the filters (units in the column names).',
    query: exportQuerySchema,
    async handler({ services, query, res }) {
      await sendCsv(res, await services.reports.checksCsv(query))
    },
  }),
  defineRoute({
    method: 'get',
    path: '/api/reports/measurements.csv',
    access: REPORT_READERS,
    summary: 'CSV of the edge measurements of the checks matching the filters.',
    query: exportQuerySchema,
    async handler({ services, query, res }) {
      await sendCsv(res, await services.reports.measurementsCsv(query))
    },
  }),
  defineRoute({
    method: 'get',
    path: '/api/reports/checks/:id/acceptance.pdf',
    access: REPORT_READERS,
    summary:
      'PDF acceptance record of one check (camera, visit, result, MTF chart, signature lines).',
    params: checkIdParamSchema,
    async handler({ services, params, res }) {
      sendPdf(res, await services.reports.acceptancePdf(params.id))
    },
  }),
  defineRoute({
    method: 'get',
    path: '/api/reports/summary.pdf',
    access: REPORT_READERS,
    summary: 'PDF summary of a site (or all sites) over a period.',
    query: fleetFilterSchema,
    async handler({ services, query, res }) {
      sendPdf(res, await services.reports.summaryPdf(query))
    },
  }),
]
