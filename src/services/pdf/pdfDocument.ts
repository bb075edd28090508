import { pdfNumber as n, pdfString } from './format'
import { PdfPage } from './pdfPage'

// A minimal PDF 1.4 writer for vector pages: filled rectangles and polygons, strokes, and text in
// the standard Helvetica fonts (WinAnsi), which every PDF reader has built in, so nothing is
// embedded. Content streams are left uncompressed: a target page is a few tens of kilobytes.
//
// Why not pdfkit (0.20.2, installed): its standalone build is not in the package's exports map,
// so Vite cannot import it; its ESM browser build does bundle and run (checked), but needs
// registerStdFonts(), which its Node build (used by the unit tests) does not export, so tests and
// browser would run different code; and it adds about 540 kB (fontkit, line breaking, AES) for
// what is rectangles, polygons and two standard fonts. This writer is a few kilobytes, has no
// eval, and gives the same bytes in the browser and in tests.

export interface PdfInfo {
  title?: string
  subject?: string
}

export class PdfDocument {
  private readonly pages: PdfPage[] = []

  addPage(widthMm: number, heightMm: number): PdfPage {
    const page = new PdfPage(widthMm, heightMm)
    this.pages.push(page)
    return page
  }

  get pageCount(): number {
    return this.pages.length
  }

  /** The whole file; every character is one byte (Latin-1). */
  toLatin1(info: PdfInfo = {}): string {
    if (this.pages.length === 0) throw new RangeError('A PDF needs at least one page.')
    // Objects: 1 catalog, 2 page tree, 3–4 fonts, 5 info, then a page and its content per page.
    const objects: string[] = []
    const pageIds = this.pages.map((_, i) => 6 + 2 * i)
    objects[1] = '<< /Type /Catalog /Pages 2 0 R >>'
    objects[2] = `<< /Type /Pages /Kids [${pageIds.map((id) => `${id} 0 R`).join(' ')}] /Count ${this.pages.length} >>`
    objects[3] = '<< /Type /Font /Subtype /Type1 /BaseFont /Helvetica /Encoding /WinAnsiEncoding >>'
    objects[4] =
      '<< /Type /Font /Subtype /Type1 /BaseFont /Helvetica-Bold /Encoding /WinAnsiEncoding >>'
    const infoEntries = ['/Producer (Sharpfield)', '/Creator (Sharpfield)']
    if (info.title) infoEntries.push(`/Title ${pdfString(info.title)}`)
    if (info.subject) infoEntries.push(`/Subject ${pdfString(info.subject)}`)
    objects[5] = `<< ${infoEntries.join(' ')} >>`
    this.pages.forEach((page, i) => {
      const id = pageIds[i]
      const content = page.content()
      objects[id] =
        `<< /Type /Page /Parent 2 0 R /MediaBox [0 0 ${n(page.widthPt)} ${n(page.heightPt)}] ` +
        `/Resources << /Font << /F1 3 0 R /F2 4 0 R >> /ProcSet [/PDF /Text] >> /Contents ${id + 1} 0 R >>`
      objects[id + 1] = `<< /Length ${content.length} >>\nstream\n${content}endstream`
    })

    let out = '%PDF-1.4\n%\u00e2\u00e3\u00cf\u00d3\n'
    const offsets: number[] = []
    for (let id = 1; id < objects.length; id++) {
      offsets[id] = out.length
      out += `${id} 0 obj\n${objects[id]}\nendobj\n`
    }
    const xref = out.length
    out += `xref\n0 ${objects.length}\n0000000000 65535 f \n`
    for (let id = 1; id < objects.length; id++)
      out += `${String(offsets[id]).padStart(10, '0')} 00000 n \n`
    out += `trailer\n<< /Size ${objects.length} /Root 1 0 R /Info 5 0 R >>\nstartxref\n${xref}\n%%EOF\n`
    return out
  }

  toBytes(info: PdfInfo = {}): Uint8Array<ArrayBuffer> {
    const text = this.toLatin1(info)
    const bytes = new Uint8Array(text.length)
    for (let i = 0; i < text.length; i++) bytes[i] = text.charCodeAt(i)
    return bytes
  }
}
