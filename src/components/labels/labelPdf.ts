// The camera-label PDF, made on the device with the same small PDF writer and QR encoder as the
// target sheet: vector QR modules (sharp at any printer resolution) and the standard fonts.
import {
  labelSheetLayout,
  type LabelCamera,
  type LabelPaper,
  type LabelSheetLayout,
} from '@shared/target/labelSheet'
import { qrModuleRects } from '@shared/target/qrModules'
import { PdfDocument } from '@/services/pdf/pdfDocument'
import { qrMatrixFor } from '@/services/targetDrawing'

/** Cut lines: thin enough to cut along, dark enough to see. */
const CUT_LINE_MM = 0.2

export interface LabelPdf {
  bytes: Uint8Array<ArrayBuffer>
  fileName: string
  layout: LabelSheetLayout
}

/** Characters a file name keeps; others (e.g. "/" in an asset tag) become "_". */
const safeName = (text: string) => text.replace(/[^A-Za-z0-9._-]/g, '_')

export function createLabelPdf(cameras: readonly LabelCamera[], paper: LabelPaper): LabelPdf {
  const layout = labelSheetLayout(cameras, paper)
  const { grid, colours } = layout
  const doc = new PdfDocument()
  for (const sheet of layout.pages) {
    const page = doc.addPage(grid.paper.widthMm, grid.paper.heightMm)
    page.stroke(colours.cutLine, CUT_LINE_MM)
    for (const label of sheet.labels) page.strokeRect(label.cell)
    page.fill(colours.ink)
    for (const label of sheet.labels) {
      page.rects(qrModuleRects(qrMatrixFor(label.payload), label.qrBox))
      for (const t of label.texts) page.text(t)
    }
    page.text(sheet.header)
  }
  const count = cameras.length
  const bytes = doc.toBytes({
    title: count === 1 ? `Sharpfield label ${cameras[0].assetTag}` : `Sharpfield camera labels`,
    subject: `${count} camera label${count === 1 ? '' : 's'} on ${paper}`,
  })
  const fileName =
    count === 1
      ? `sharpfield-label-${safeName(cameras[0].assetTag)}-${paper}.pdf`
      : `sharpfield-labels-${count}-${paper}.pdf`
  return { bytes, fileName, layout }
}
