import { describe, expect, it } from 'vitest'
import { encodeCameraLabel, pxPerModuleAt, type LabelCamera } from '@shared/target'
import { PT_PER_MM } from '@/services/pdf/format'
import { latin1, parsePdf } from '@/services/__tests__/pdfParse'
import { decodeQrPixels } from '@/components/scan/qrPixels'
import { createLabelPdf } from '../labelPdf'
import { rasteriseRects, toRgba } from './rasterise'

const CAMERAS: LabelCamera[] = Array.from({ length: 11 }, (_, i) => ({
  assetTag: `HBR-${String(i + 1).padStart(3, '0')}`,
  siteName: 'Harbour Depot',
  locationText: `Quay ${i + 1}, mast ${(i % 3) + 1}`,
}))

/** Reads the QR code drawn in `cell` (mm, top-left origin) of a page, at `dpi`. */
function readCode(
  content: string,
  pageHeightMm: number,
  cell: { x: number; y: number; w: number; h: number },
  dpi: number,
): string | null {
  const area = {
    x: cell.x * PT_PER_MM,
    y: (pageHeightMm - cell.y - cell.h) * PT_PER_MM,
    w: cell.w * PT_PER_MM,
    h: cell.h * PT_PER_MM,
  }
  const image = rasteriseRects(content, area, dpi)
  return decodeQrPixels(toRgba(image), image.width, image.height)
}

describe('the camera-label PDF', () => {
  it('puts nine labels on a page, on A4 or US Letter', () => {
    const a4 = createLabelPdf(CAMERAS, 'A4')
    expect(latin1(a4.bytes.subarray(0, 5))).toBe('%PDF-')
    const pages = parsePdf(a4.bytes).pages
    expect(pages).toHaveLength(2)
    // A4 = 595.28 × 841.89 pt [std: 210 × 297 mm at 72/25.4 pt per mm].
    expect(pages[0].mediaBox[2]).toBeCloseTo(595.28, 2)
    expect(pages[0].mediaBox[3]).toBeCloseTo(841.89, 2)
    const letter = parsePdf(createLabelPdf(CAMERAS, 'Letter').bytes).pages
    // Letter = 612 × 792 pt [std: 8.5 × 11 in].
    expect(letter[1].mediaBox.slice(2).map((v) => Math.round(v * 100) / 100)).toEqual([612, 792])
    expect(pages[0].content.match(/\(HBR-\d{3}\) Tj/g)).toHaveLength(9)
    expect(pages[1].content.match(/\(HBR-\d{3}\) Tj/g)).toHaveLength(2)
  })

  it('draws QR codes that read back to each camera’s exact label text, where the label is', () => {
    for (const paper of ['A4', 'Letter'] as const) {
      const { bytes, layout } = createLabelPdf(CAMERAS, paper)
      const pages = parsePdf(bytes).pages
      layout.pages.forEach((sheet, p) => {
        sheet.labels.forEach((label, i) => {
          const text = readCode(pages[p].content, layout.grid.paper.heightMm, label.cell, 150)
          expect(text, `${paper} page ${p + 1} label ${i + 1}`).toBe(
            encodeCameraLabel({ assetTag: CAMERAS[p * 9 + i].assetTag }),
          )
        })
      })
    }
  })

  it('reads a longest-tag label too, and prints its tag whole', () => {
    const camera = { assetTag: `N/${'q'.repeat(62)}`, siteName: 'Depot', locationText: '' }
    const { bytes, layout, fileName } = createLabelPdf([camera], 'A4')
    const [page] = parsePdf(bytes).pages
    const cell = layout.pages[0].labels[0].cell
    expect(readCode(page.content, 297, cell, 150)).toBe(encodeCameraLabel(camera))
    const shown = [...page.content.matchAll(/\((.*)\) Tj/g)].map((m) => m[1])
    expect(shown.indexOf('Depot')).toBeGreaterThan(1) // the tag took more than one line
    expect(shown.slice(0, shown.indexOf('Depot')).join('')).toBe(camera.assetTag)
    expect(fileName).toBe(`sharpfield-label-N_${'q'.repeat(62)}-A4.pdf`)
  })

  it('reads a typical label at the detail a phone sees from half a metre', () => {
    // 1.371 px per mm: a 70° phone camera read at 960 px across, 0.5 m away [calc, see labelSheet].
    const pxPerMm = pxPerModuleAt(1, 0.5)
    const { bytes, layout } = createLabelPdf(CAMERAS.slice(0, 1), 'A4')
    const [page] = parsePdf(bytes).pages
    const cell = layout.pages[0].labels[0].cell
    expect(readCode(page.content, 297, cell, pxPerMm * 25.4)).toBe(encodeCameraLabel(CAMERAS[0]))
  })

  it('shows a cut-short site name with an ellipsis and names the file after the count', () => {
    const long = {
      assetTag: 'HBR-900',
      siteName: 'Riverside Logistics Park and Container Terminal, North Quay',
      locationText: 'Crane 4',
    }
    const one = createLabelPdf([long], 'Letter')
    const [page] = parsePdf(one.bytes).pages
    // "…" is byte 0x85 in WinAnsiEncoding (PDF 1.7, Annex D), written as \205.
    expect(page.content).toMatch(/\(Riverside Logistics Park[^)]*\\205\) Tj/)
    expect(page.content).toContain('(Crane 4) Tj')
    expect(one.fileName).toBe('sharpfield-label-HBR-900-Letter.pdf')
    expect(createLabelPdf(CAMERAS, 'A4').fileName).toBe('sharpfield-labels-11-A4.pdf')
  })
})
