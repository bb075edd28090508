import { describe, expect, it } from 'vitest'
import { FIELD_SAFETY } from '@shared/target/instructions'
import { customSheet, standardSheet } from '@shared/target/sheets'
import { pdfNumber } from '../pdf/format'
import { createTargetPdf } from '../targetPdf'
import { latin1, parsePdf } from './pdfParse'

const ID = 'SFT-7K2M9Q'

describe('target PDF', () => {
  it('is a two-page PDF: the target at the sheet size, then the notes on office paper', () => {
    const { bytes } = createTargetPdf(standardSheet('A4'), ID)
    expect(latin1(bytes.subarray(0, 5))).toBe('%PDF-')
    const { pages } = parsePdf(bytes)
    expect(pages).toHaveLength(2)
    // A4 = 595.28 × 841.89 pt [std: 210 × 297 mm at 72/25.4 pt per mm].
    for (const page of pages) {
      expect(page.mediaBox[2]).toBeCloseTo(595.28, 2)
      expect(page.mediaBox[3]).toBeCloseTo(841.89, 2)
    }
  })

  it('sizes page 1 to the chosen sheet and page 2 to the matching office paper', () => {
    const letter = parsePdf(createTargetPdf(standardSheet('Letter'), ID).bytes).pages
    // Letter = 612 × 792 pt [std: 8.5 × 11 in].
    expect(letter.map((p) => p.mediaBox.slice(2).map((v) => Math.round(v * 100) / 100))).toEqual([
      [612, 792],
      [612, 792],
    ])
    const a0 = parsePdf(createTargetPdf(standardSheet('A0'), ID).bytes).pages
    // A0 = 841 × 1189 mm = 2383.94 × 3370.39 pt [calc].
    expect(a0[0].mediaBox[2]).toBeCloseTo(2383.94, 2)
    expect(a0[0].mediaBox[3]).toBeCloseTo(3370.39, 2)
    expect(a0[1].mediaBox[2]).toBeCloseTo(595.28, 2)
    const custom = parsePdf(createTargetPdf(customSheet(1500), ID).bytes).pages
    expect(custom[0].mediaBox[2]).toBeCloseTo((1500 * 72) / 25.4, 2)
  })

  it('draws the four tilted squares in dark grey at their layout corners, in millimetres', () => {
    const { bytes, drawing } = createTargetPdf(standardSheet('A4'), ID)
    const [page1] = parsePdf(bytes).pages
    const darkFill = `${pdfNumber(124 / 255)} ${pdfNumber(124 / 255)} ${pdfNumber(124 / 255)} rg`
    const afterDark = page1.content.slice(page1.content.indexOf(darkFill))
    expect(afterDark.length).toBeLessThan(page1.content.length)
    const polygons = [
      ...afterDark.matchAll(/^(\S+ \S+) m (\S+ \S+) l (\S+ \S+) l (\S+ \S+) l h f$/gm),
    ].slice(0, 4)
    expect(polygons).toHaveLength(4)
    polygons.forEach((m, i) => {
      const corners = m.slice(1, 5).map((pair) => pair.split(' ').map(Number))
      drawing.layout.squares[i].corners.forEach((c, k) => {
        expect(corners[k][0]).toBeCloseTo(c.x, 3)
        expect(corners[k][1]).toBeCloseTo(c.y, 3)
      })
      // Independent check of the tilt from the printed numbers: top edge at 5.0° (±0.01°).
      const [a, b] = corners
      expect((Math.atan2(a[1] - b[1], b[0] - a[0]) * 180) / Math.PI).toBeCloseTo(5.0, 2)
    })
    expect(page1.content).toContain(
      `${pdfNumber(232 / 255)} ${pdfNumber(232 / 255)} ${pdfNumber(232 / 255)} rg`,
    )
  })

  it('prints the id, the printed size, the scale bar and every QR module', () => {
    const { bytes, drawing } = createTargetPdf(standardSheet('A4'), ID)
    const [page1, page2] = parsePdf(bytes).pages
    expect(page1.content).toContain(`(Target ${ID}) Tj`)
    expect(page1.content).toContain(
      '(Printed size 210 \\327 297 mm \\(A4\\) \\227 print at 100 %) Tj',
    )
    expect(page1.content).toContain('(100 mm) Tj')
    const bar = drawing.layout.scaleBar.outline
    expect(page1.content).toContain(
      `${pdfNumber(bar.x)} ${pdfNumber(bar.y)} 100 ${pdfNumber(bar.h)} re S`,
    )
    const rects = page1.content.match(/ re$/gm) ?? []
    expect(rects.length).toBe(drawing.qrRects.length + drawing.layout.scaleBar.filled.length)
    expect(page2.content).toContain(`(Sharpfield focus target ${ID}) Tj`)
    expect(page2.content).toContain(`(QR code text: sharpfield-target:v1;id=${ID};w=210;h=297) Tj`)
  })

  it('puts the how-to and every safety note on page 2, inside its margins', () => {
    const [, page2] = parsePdf(createTargetPdf(standardSheet('A4'), ID).bytes).pages
    expect(page2.content).toContain('(Using this target) Tj')
    expect(page2.content).toContain('(Safety on site) Tj')
    const shown = [...page2.content.matchAll(/\((.*)\) Tj/g)].map((m) => m[1]).join(' ')
    for (const item of FIELD_SAFETY.items) {
      const firstWords = item.split(' ').slice(0, 3).join(' ')
      expect(shown).toContain(firstWords)
    }
    const baselines = [...page2.content.matchAll(/1 0 0 -1 (\S+) (\S+) Tm/g)].map((m) =>
      Number(m[2]),
    )
    expect(Math.max(...baselines)).toBeLessThan(297 - 18)
  })

  it('names the file after the id and the size', () => {
    expect(createTargetPdf(standardSheet('A3'), ID).fileName).toBe(`sharpfield-target-${ID}-A3.pdf`)
    expect(createTargetPdf(customSheet(1500), ID).fileName).toBe(
      `sharpfield-target-${ID}-1500mm.pdf`,
    )
  })
})
