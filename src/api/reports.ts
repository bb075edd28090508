// Exports and printable records: the server makes the file, the browser saves it.
import { download } from './files'
import type { Query } from './http'

export const downloadChecksCsv = (query: Query) =>
  download('/api/reports/checks.csv', query, 'sharpfield-checks.csv')
export const downloadMeasurementsCsv = (query: Query) =>
  download('/api/reports/measurements.csv', query, 'sharpfield-measurements.csv')
export const downloadSummaryPdf = (query: Query) =>
  download('/api/reports/summary.pdf', query, 'sharpfield-summary.pdf')
export const downloadAcceptancePdf = (checkId: string) =>
  download(
    `/api/reports/checks/${encodeURIComponent(checkId)}/acceptance.pdf`,
    undefined,
    'sharpfield-acceptance.pdf',
  )
