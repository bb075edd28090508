// Page furniture for Sharpfield's printed records (pdfkit, A4, built-in Helvetica): a header
// band, label/value rows, simple tables, signature lines and a footer on every page.
import PDFDocument from 'pdfkit'

export type Pdf = PDFKit.PDFDocument

export const INK = '#13201f'
export const MUTED = '#5c6b6a'
export const RULE = '#c9d4d2'
export const BRAND = '#0f3d3e'
export const VERDICT_COLOUR = { pass: '#17693a', marginal: '#8a5300', fail: '#b42318' } as const

export const MARGIN = 48

export function newPdf(title: string, subject: string): Pdf {
  const doc = new PDFDocument({
    size: 'A4',
    margins: { top: MARGIN, bottom: MARGIN + 16, left: MARGIN, right: MARGIN },
    bufferPages: true,
    info: { Title: title, Subject: subject, Author: 'Sharpfield', Creator: 'Sharpfield' },
  })
  doc.font('Helvetica').fontSize(10).fillColor(INK)
  return doc
}

export const contentWidth = (doc: Pdf) =>
  doc.page.width - doc.page.margins.left - doc.page.margins.right

/** The title band at the top of the first page. */
export function titleBand(doc: Pdf, title: string, subtitle: string): void {
  const x = doc.page.margins.left
  doc.rect(x, doc.y, contentWidth(doc), 4).fill(BRAND)
  doc.moveDown(0.6)
  doc.fillColor(BRAND).font('Helvetica-Bold').fontSize(18).text(title, x)
  doc.fillColor(MUTED).font('Helvetica').fontSize(10).text(subtitle, x)
  doc.moveDown(0.8)
  doc.fillColor(INK)
}

export function sectionHeading(doc: Pdf, text: string): void {
  ensureSpace(doc, 60)
  doc.moveDown(0.6)
  doc.font('Helvetica-Bold').fontSize(12).fillColor(BRAND).text(text, doc.page.margins.left)
  const y = doc.y + 2
  doc
    .moveTo(doc.page.margins.left, y)
    .lineTo(doc.page.margins.left + contentWidth(doc), y)
    .lineWidth(0.5)
    .strokeColor(RULE)
    .stroke()
  doc.moveDown(0.5)
  doc.font('Helvetica').fontSize(10).fillColor(INK)
}

/** Starts a new page when less than `height` points are left on this one. */
export function ensureSpace(doc: Pdf, height: number): void {
  if (doc.y + height > doc.page.height - doc.page.margins.bottom) doc.addPage()
}

/** Two columns of label: value pairs. */
export function fieldGrid(doc: Pdf, pairs: [string, string][]): void {
  const x0 = doc.page.margins.left
  const colW = contentWidth(doc) / 2
  for (let i = 0; i < pairs.length; i += 2) {
    ensureSpace(doc, 30)
    const y = doc.y
    let bottom = y
    for (let j = 0; j < 2 && i + j < pairs.length; j++) {
      const [label, value] = pairs[i + j]
      const x = x0 + j * colW
      doc
        .font('Helvetica')
        .fontSize(8)
        .fillColor(MUTED)
        .text(label.toUpperCase(), x, y, { width: colW - 12 })
      doc
        .font('Helvetica')
        .fontSize(10.5)
        .fillColor(INK)
        .text(value || '—', x, doc.y + 1, { width: colW - 12 })
      bottom = Math.max(bottom, doc.y)
    }
    doc.y = bottom + 6
  }
  doc.x = x0
}

export interface Column {
  header: string
  width: number
  align?: 'left' | 'right'
}

/** A plain table; repeats its header on new pages. Widths are fractions of the content width. */
export function table(doc: Pdf, columns: Column[], rows: string[][]): void {
  const x0 = doc.page.margins.left
  const total = contentWidth(doc)
  const widths = columns.map((c) => c.width * total)
  const header = () => {
    ensureSpace(doc, 40)
    const y = doc.y
    let x = x0
    doc.font('Helvetica-Bold').fontSize(8.5).fillColor(MUTED)
    const h = Math.max(
      ...columns.map((c, i) => doc.heightOfString(c.header, { width: widths[i] - 4 })),
    )
    columns.forEach((c, i) => {
      doc.text(c.header, x + 2, y, { width: widths[i] - 4, align: c.align ?? 'left' })
      x += widths[i]
    })
    const yLine = y + h + 2
    doc
      .moveTo(x0, yLine)
      .lineTo(x0 + total, yLine)
      .lineWidth(0.5)
      .strokeColor(RULE)
      .stroke()
    doc.y = yLine + 3
  }
  header()
  doc.font('Helvetica').fontSize(9).fillColor(INK)
  for (const row of rows) {
    const h = Math.max(...row.map((v, i) => doc.heightOfString(v || '—', { width: widths[i] - 4 })))
    if (doc.y + h + 4 > doc.page.height - doc.page.margins.bottom) {
      doc.addPage()
      header()
      doc.font('Helvetica').fontSize(9).fillColor(INK)
    }
    const y = doc.y
    let x = x0
    row.forEach((v, i) => {
      doc.text(v || '—', x + 2, y, { width: widths[i] - 4, align: columns[i].align ?? 'left' })
      x += widths[i]
    })
    doc.y = y + h + 4
  }
  doc.x = x0
}

/** Lines for names, signatures and dates. */
export function signatureBlock(doc: Pdf, roles: string[]): void {
  ensureSpace(doc, 40 + roles.length * 56)
  sectionHeading(doc, 'Signatures')
  const x0 = doc.page.margins.left
  const w = contentWidth(doc)
  const cols = [0.38, 0.38, 0.24]
  for (const role of roles) {
    const y = doc.y + 26
    let x = x0
    const labels = ['Name', 'Signature', 'Date']
    cols.forEach((c, i) => {
      const cw = c * w - 14
      doc
        .moveTo(x, y)
        .lineTo(x + cw, y)
        .lineWidth(0.6)
        .strokeColor(INK)
        .stroke()
      doc
        .font('Helvetica')
        .fontSize(8)
        .fillColor(MUTED)
        .text(`${labels[i]} (${role})`, x, y + 3, { width: cw })
      x += c * w
    })
    doc.y = y + 22
  }
  doc.x = x0
  doc.fillColor(INK).fontSize(10)
}

/** Page numbers and a line of provenance on every page (call before end()). */
export function footers(doc: Pdf, line: string): void {
  const range = doc.bufferedPageRange()
  for (let i = range.start; i < range.start + range.count; i++) {
    doc.switchToPage(i)
    const y = doc.page.height - doc.page.margins.bottom + 14
    const bottom = doc.page.margins.bottom
    doc.page.margins.bottom = 0 // let the footer sit below the content area
    doc.font('Helvetica').fontSize(7.5).fillColor(MUTED)
    doc.text(line, doc.page.margins.left, y, { width: contentWidth(doc) - 60, lineBreak: false })
    doc.text(`Page ${i + 1} of ${range.count}`, doc.page.margins.left, y, {
      width: contentWidth(doc),
      align: 'right',
      lineBreak: false,
    })
    doc.page.margins.bottom = bottom
  }
}

/** The whole document as bytes. */
export function toBuffer(doc: Pdf): Promise<Buffer> {
  return new Promise((resolve, reject) => {
    const chunks: Buffer[] = []
    doc.on('data', (c: Buffer) => chunks.push(c))
    doc.on('end', () => resolve(Buffer.concat(chunks)))
    doc.on('error', reject)
    doc.end()
  })
}

/** A time in a site's time zone, e.g. "12 Mar 2025, 14:05 (Europe/London)". */
export function siteTime(d: Date, timeZone: string): string {
  const fmt = new Intl.DateTimeFormat('en-GB', {
    timeZone,
    day: 'numeric',
    month: 'short',
    year: 'numeric',
    hour: '2-digit',
    minute: '2-digit',
  })
  return `${fmt.format(d)} (${timeZone})`
}

export const fixed = (v: number | null | undefined, digits: number) =>
  v === null || v === undefined || !Number.isFinite(v) ? '—' : v.toFixed(digits)
