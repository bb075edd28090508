// The summary of a site (or every site) over a period: the counts, the cameras that need
// attention and the checks made, with a line for the reviewer to sign.
import type { FleetSummary } from '../../../../shared/schemas/fleet'
import {
  fieldGrid,
  fixed,
  footers,
  newPdf,
  sectionHeading,
  signatureBlock,
  table,
  titleBand,
  toBuffer,
  MUTED,
  INK,
} from './layout'

export interface SummaryCheckLine {
  capturedAt: Date
  assetTag: string
  siteName: string
  mode: string
  verdict: string
  medianMtf50CyPx: number | null
  inspector: string
}

export interface SummaryCameraLine {
  assetTag: string
  siteName: string
  locationText: string
  detail: string
}

export interface SummaryData {
  scopeName: string
  summary: FleetSummary
  failing: SummaryCameraLine[]
  overdue: SummaryCameraLine[]
  checks: SummaryCheckLine[]
  /** Checks in the period beyond those listed. */
  checksLeftOut: number
  generatedAt: Date
}

const pct = (r: number | null) => (r === null ? '—' : `${Math.round(r * 100)} %`)
const day = (iso: string | Date) => new Date(iso).toISOString().slice(0, 10)

function countsRow(name: string, c: FleetSummary['overall']): string[] {
  return [
    name,
    String(c.cameras),
    String(c.checked),
    String(c.passed),
    String(c.marginal),
    String(c.failing),
    pct(c.passRate),
    String(c.overdue),
  ]
}

const COUNT_COLUMNS = [
  { header: '', width: 0.3 },
  { header: 'Cameras', width: 0.1, align: 'right' as const },
  { header: 'Checked', width: 0.1, align: 'right' as const },
  { header: 'Passed', width: 0.1, align: 'right' as const },
  { header: 'Marginal', width: 0.1, align: 'right' as const },
  { header: 'Failing', width: 0.1, align: 'right' as const },
  { header: 'Pass rate', width: 0.1, align: 'right' as const },
  { header: 'Overdue', width: 0.1, align: 'right' as const },
]

export async function summaryPdf(d: SummaryData): Promise<Buffer> {
  const s = d.summary
  const periodText = `${day(s.period.from)} to ${day(new Date(Date.parse(s.period.to) - 1))}`
  const doc = newPdf(`Fleet summary ${d.scopeName}`, periodText)
  titleBand(doc, 'Camera fleet summary', `${d.scopeName} · ${periodText} (UTC)`)

  fieldGrid(doc, [
    ['Cameras in service', String(s.overall.cameras)],
    [
      'Checked in the period',
      `${s.overall.checked} (${pct(s.overall.cameras ? s.overall.checked / s.overall.cameras : null)} of cameras)`,
    ],
    ['Pass rate', `${pct(s.overall.passRate)} of checked cameras`],
    ['Marginal / failing', `${s.overall.marginal} / ${s.overall.failing}`],
    ['Overdue now', String(s.overall.overdue)],
    ['Generated', `${d.generatedAt.toISOString().slice(0, 16).replace('T', ' ')} UTC`],
  ])
  doc
    .fontSize(8.5)
    .fillColor(MUTED)
    .text(
      'A camera counts by its latest check in the period. Overdue: the next check date has passed (as of the time generated).',
    )
  doc.fillColor(INK)

  if (s.bySite.length > 1) {
    sectionHeading(doc, 'By site')
    table(
      doc,
      [{ ...COUNT_COLUMNS[0], header: 'Site' }, ...COUNT_COLUMNS.slice(1)],
      s.bySite.map((x) => countsRow(x.siteName, x)),
    )
  }
  sectionHeading(doc, 'By task')
  table(
    doc,
    [{ ...COUNT_COLUMNS[0], header: 'Task' }, ...COUNT_COLUMNS.slice(1)],
    s.byTask.map((x) => countsRow(x.taskName, x)),
  )

  const cameraTable = (title: string, rows: SummaryCameraLine[], detailHeader: string) => {
    sectionHeading(doc, title)
    if (!rows.length) {
      doc.fontSize(9.5).text('None.')
      return
    }
    table(
      doc,
      [
        { header: 'Asset tag', width: 0.18 },
        { header: 'Site', width: 0.24 },
        { header: 'Location', width: 0.3 },
        { header: detailHeader, width: 0.28 },
      ],
      rows.map((r) => [r.assetTag, r.siteName, r.locationText, r.detail]),
    )
  }
  cameraTable('Failing in the period', d.failing, 'Latest check')
  cameraTable('Overdue for a check', d.overdue, 'Due since')

  sectionHeading(doc, 'Checks in the period')
  if (!d.checks.length) doc.fontSize(9.5).text('No checks in this period.')
  else
    table(
      doc,
      [
        { header: 'Date (UTC)', width: 0.18 },
        { header: 'Asset tag', width: 0.15 },
        { header: 'Site', width: 0.2 },
        { header: 'Mode', width: 0.08 },
        { header: 'Result', width: 0.1 },
        { header: 'MTF50 (c/px)', width: 0.12, align: 'right' },
        { header: 'Inspector', width: 0.17 },
      ],
      d.checks.map((k) => [
        k.capturedAt.toISOString().slice(0, 16).replace('T', ' '),
        k.assetTag,
        k.siteName,
        k.mode,
        k.verdict,
        fixed(k.medianMtf50CyPx, 3),
        k.inspector,
      ]),
    )
  if (d.checksLeftOut > 0)
    doc
      .moveDown(0.3)
      .fontSize(8.5)
      .fillColor(MUTED)
      .text(`${d.checksLeftOut} more checks are not listed; export the CSV for all of them.`)
  doc.fillColor(INK)

  signatureBlock(doc, ['reviewed by'])
  footers(doc, `Sharpfield fleet summary · ${d.scopeName} · ${periodText}`)
  return toBuffer(doc)
}
