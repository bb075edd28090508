import { TARGET_INK } from '@shared/target/colours'
import { wrapText, type FontWeight } from '@shared/target/fontMetrics'
import type { InstructionSection } from '@shared/target/instructions'
import type { TargetLayout } from '@shared/target/layout'
import type { PdfPage } from './pdf/pdfPage'

const MARGIN_MM = 18
const BODY_MM = 3.5 // ≈ 10 pt
const LINE = 1.38
const INDENT_MM = 6

/** Page 2: title, the how-to as numbered steps and the safety notes as bullets. */
export function drawInstructionsPage(
  page: PdfPage,
  layout: TargetLayout,
  sections: InstructionSection[],
): void {
  const width = page.widthMm - 2 * MARGIN_MM
  let y = MARGIN_MM
  const put = (text: string, x: number, sizeMm: number, weight: FontWeight = 'regular') => {
    page.text({ text, x, y, sizeMm, weight, align: 'start' })
  }
  page.fill(TARGET_INK)
  y += 6
  put(`Sharpfield focus target ${layout.targetId}`, MARGIN_MM, 6, 'bold')
  y += 6
  const { sheet } = layout
  put(
    `Page 1 prints at ${sheet.widthMm} × ${sheet.heightMm} mm (${sheet.custom ? 'custom size' : sheet.name}). This page fits office paper.`,
    MARGIN_MM,
    BODY_MM,
  )
  for (const [index, section] of sections.entries()) {
    y += 11
    put(section.title, MARGIN_MM, 4.6, 'bold')
    y += 3
    section.items.forEach((item, i) => {
      const marker = index === 0 ? `${i + 1}.` : '•'
      const lines = wrapText(item, BODY_MM, width - INDENT_MM)
      y += BODY_MM * LINE * 1.3
      put(marker, MARGIN_MM, BODY_MM, index === 0 ? 'bold' : 'regular')
      lines.forEach((line, k) => {
        if (k > 0) y += BODY_MM * LINE
        put(line, MARGIN_MM + INDENT_MM, BODY_MM)
      })
    })
  }
  y += 12
  put(`QR code text: ${layout.payload}`, MARGIN_MM, 3, 'regular')
  if (y > page.heightMm - MARGIN_MM) {
    throw new RangeError('The instructions do not fit on one page; shorten them.')
  }
}
