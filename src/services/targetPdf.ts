import { FIELD_SAFETY, targetHowTo } from '@shared/target/instructions'
import type { Sheet } from '@shared/target/sheets'
import { PdfDocument } from './pdf/pdfDocument'
import type { PdfPage } from './pdf/pdfPage'
import { drawInstructionsPage } from './targetInstructionsPage'
import { targetDrawing, type TargetDrawing } from './targetDrawing'

/** Page 1: the target itself, every length in the layout's millimetres. */
function drawTargetPage(page: PdfPage, { layout, qrRects }: TargetDrawing): void {
  const { colours } = layout
  page.fill(colours.light).rect(layout.panel)
  page.fill(colours.dark)
  for (const square of layout.squares) page.polygon(square.corners)
  page.fill(colours.ink)
  for (const mark of layout.fiducials) page.polygon(mark)
  page.rects(layout.scaleBar.filled)
  page.stroke(colours.ink, 0.25 * (layout.sheet.widthMm / 210)).strokeRect(layout.scaleBar.outline)
  page.rects(qrRects)
  for (const text of layout.texts) page.text(text)
}

export interface TargetPdf {
  bytes: Uint8Array<ArrayBuffer>
  fileName: string
  drawing: TargetDrawing
}

/**
 * The two-page target PDF: page 1 the target at the sheet's exact size, page 2 the how-to and the
 * safety notes on office paper (A4, or Letter when the target is on a US size).
 */
export function createTargetPdf(sheet: Sheet, targetId: string): TargetPdf {
  const drawing = targetDrawing(sheet, targetId)
  const doc = new PdfDocument()
  drawTargetPage(doc.addPage(sheet.widthMm, sheet.heightMm), drawing)
  const us = sheet.name === 'Letter' || sheet.name === 'Tabloid'
  const notes = us ? doc.addPage(215.9, 279.4) : doc.addPage(210, 297)
  const howTo = targetHowTo({
    scaleBarMm: drawing.layout.scaleBar.lengthMm,
    squareSideMm: drawing.layout.squareSideMm,
  })
  drawInstructionsPage(notes, drawing.layout, [howTo, FIELD_SAFETY])
  const bytes = doc.toBytes({
    title: `Sharpfield focus target ${targetId}`,
    subject: `Printed size ${sheet.widthMm} × ${sheet.heightMm} mm`,
  })
  const size = sheet.custom ? `${Math.round(sheet.widthMm)}mm` : sheet.name
  return { bytes, fileName: `sharpfield-target-${targetId}-${size}.pdf`, drawing }
}
