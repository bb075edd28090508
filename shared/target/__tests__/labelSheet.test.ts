import QRCode from 'qrcode'
import { describe, expect, it } from 'vitest'
import { encodeCameraLabel } from '../cameraLabel'
import { rectsOverlap } from '../geometry'
import { textWidth } from '../fontMetrics'
import {
  cameraLabelLayout,
  LABEL_NOTE,
  LABEL_QR_BOX_MM,
  labelGrid,
  labelModuleMm,
  labelSheetLayout,
  MAX_LABELS_PER_PDF,
  MIN_PAGE_MARGIN_MM,
  pxPerModuleAt,
  type LabelCamera,
  type PlacedLabel,
} from '../labelSheet'
import { CAP_HEIGHT_EM, DESCENDER_EM } from '../labelText'

const camera = (i: number, over: Partial<LabelCamera> = {}): LabelCamera => ({
  assetTag: `HBR-${String(i).padStart(3, '0')}`,
  siteName: 'Harbour Depot',
  locationText: `Gate ${i}, pole ${i % 4}`,
  ...over,
})
const cameras = (n: number) => Array.from({ length: n }, (_, i) => camera(i + 1))

/** Dark-module size the real encoder gives this payload in the label's QR box. */
function encodedModuleMm(payload: string): number {
  const size = QRCode.create(payload, { errorCorrectionLevel: 'M' }).modules.size
  return LABEL_QR_BOX_MM / (size + 8)
}

function expectTextsInside(label: PlacedLabel): void {
  const { cell, qrBox } = label
  for (const t of label.texts) {
    const width = textWidth(t.text, t.sizeMm, t.weight)
    expect(t.x, t.text).toBeGreaterThanOrEqual(cell.x + 1)
    expect(t.x + width, t.text).toBeLessThanOrEqual(cell.x + cell.w - 1)
    expect(t.y - CAP_HEIGHT_EM * t.sizeMm, t.text).toBeGreaterThanOrEqual(qrBox.y + qrBox.h)
    expect(t.y + DESCENDER_EM * t.sizeMm, t.text).toBeLessThanOrEqual(cell.y + cell.h - 1)
  }
}

describe('a sheet of camera labels', () => {
  it('holds nine 64 × 86 mm labels on A4 and on US Letter, inside the printable margins', () => {
    for (const [paper, widthMm, heightMm] of [
      ['A4', 210, 297], // ISO 216
      ['Letter', 215.9, 279.4], // 8.5 × 11 in
    ] as const) {
      const grid = labelGrid(paper)
      expect([grid.columns, grid.rows, grid.perPage]).toEqual([3, 3, 9])
      expect(grid.paper).toMatchObject({ widthMm, heightMm })
      for (const c of grid.cells) {
        expect(c.x).toBeGreaterThanOrEqual(MIN_PAGE_MARGIN_MM)
        expect(c.y).toBeGreaterThanOrEqual(MIN_PAGE_MARGIN_MM)
        expect(c.x + c.w).toBeLessThanOrEqual(widthMm - MIN_PAGE_MARGIN_MM + 1e-9)
        expect(c.y + c.h).toBeLessThanOrEqual(heightMm - MIN_PAGE_MARGIN_MM + 1e-9)
      }
      grid.cells.forEach((a, i) =>
        grid.cells.slice(i + 1).forEach((b) => expect(rectsOverlap(a, b)).toBe(false)),
      )
      // The header's cap line stays clear of a ¼ in (6.35 mm) unprinted edge, common practice.
      const [page] = labelSheetLayout(cameras(1), paper).pages
      expect(page.header.y - CAP_HEIGHT_EM * page.header.sizeMm).toBeGreaterThan(6.35)
      expect(page.header.y).toBeLessThan(grid.cells[0].y)
      const headerWidth = textWidth(page.header.text, page.header.sizeMm)
      expect(page.header.x + headerWidth).toBeLessThanOrEqual(widthMm - MIN_PAGE_MARGIN_MM)
    }
  })

  it('fills pages in order, nine labels a page, the last page with what is left', () => {
    const layout = labelSheetLayout(cameras(20), 'A4')
    expect(layout.pages.map((p) => p.labels.length)).toEqual([9, 9, 2])
    expect(layout.pages[1].labels[0].assetTag).toBe('HBR-010')
    expect(layout.pages[2].labels[1].payload).toBe('sharpfield-camera:v1;tag=HBR-020')
    expect(layout.pages[2].header.text).toMatch(/page 3 of 3 · print at 100 %/)
  })

  it('gives typical tags QR modules of 1.5 mm or more: about 2 camera pixels at half a metre', () => {
    // 17 lower-case characters: all byte mode, the largest symbol a 17-character tag can need.
    for (const tag of ['MTD-004', 'HBR-118', 'a'.repeat(17)]) {
      const payload = encodeCameraLabel({ assetTag: tag })
      expect(encodedModuleMm(payload)).toBeGreaterThanOrEqual(1.5)
      expect(labelModuleMm(payload)).toBeGreaterThanOrEqual(1.5)
      expect(pxPerModuleAt(encodedModuleMm(payload), 0.5)).toBeGreaterThanOrEqual(2)
    }
  })

  it('keeps modules well above 0.5 mm for the longest tag a label takes', () => {
    const payload = encodeCameraLabel({ assetTag: 'a'.repeat(64) })
    // 89 bytes → version 6, 41 modules + 8 of quiet zone: 58 / 49 = 1.18 mm [calc].
    expect(encodedModuleMm(payload)).toBeCloseTo(58 / 49, 6)
    expect(labelModuleMm(payload)).toBeCloseTo(58 / 49, 6)
    expect(labelModuleMm(payload)).toBeGreaterThan(0.5)
  })

  it('works out camera pixels per module with the pinhole formula', () => {
    // 90° across at 0.5 m sees 2 · 500 · tan 45° = 1000 mm; 1000 px → 1 px per mm [calc].
    expect(pxPerModuleAt(1, 0.5, { hfovDeg: 90, framePx: 1000 })).toBeCloseTo(1, 12)
    // 70°, 960 px: 960 / (1000 · tan 35°) = 1.3710 px per mm [calc].
    expect(pxPerModuleAt(1, 0.5)).toBeCloseTo(1.371, 3)
    expect(() => pxPerModuleAt(1, 0)).toThrow(RangeError)
  })

  it('prints tag, site, location and the whole note inside the label, below the code', () => {
    const label = cameraLabelLayout(camera(4), labelGrid('Letter').cells[4])
    expect(label.texts.map((t) => t.text)).toEqual([
      'HBR-004',
      'Harbour Depot',
      'Gate 4, pole 0',
      ...label.texts.slice(3).map((t) => t.text),
    ])
    expect(label.texts[0]).toMatchObject({ sizeMm: 7, weight: 'bold' })
    expect(
      label.texts
        .slice(3)
        .map((t) => t.text)
        .join(' '),
    ).toBe(LABEL_NOTE)
    expect(label.texts.length).toBeLessThanOrEqual(5)
    expectTextsInside(label)
  })

  it('truncates long names with an ellipsis and keeps every line inside the label', () => {
    const long = camera(1, {
      assetTag: 'W'.repeat(64),
      siteName: 'Riverside Logistics Park and Container Terminal, North Quay',
      locationText: 'Warehouse 14, loading bay 3, camera mast on the east corner of the roof',
    })
    const label = cameraLabelLayout(long, labelGrid('A4').cells[8])
    const shown = label.texts.map((t) => t.text)
    expect(shown.slice(0, 3).join('')).toBe('W'.repeat(64))
    expect(shown[3]).toMatch(/^Riverside Logistics Park.*…$/)
    expect(shown[4]).toMatch(/^Warehouse 14, loading bay.*…$/)
    expectTextsInside(label)
  })

  it('leaves out a location that is not given', () => {
    const label = cameraLabelLayout(camera(1, { locationText: '  ' }), labelGrid('A4').cells[0])
    expect(label.texts.map((t) => t.text).slice(0, 2)).toEqual(['HBR-001', 'Harbour Depot'])
    expect(label.texts.map((t) => t.text)).not.toContain('')
  })

  it('refuses an empty list, more than the cap, and an asset tag a label cannot carry', () => {
    expect(() => labelSheetLayout([], 'A4')).toThrow(/at least one camera/)
    expect(labelSheetLayout(cameras(MAX_LABELS_PER_PDF), 'A4').pages).toHaveLength(56)
    expect(() => labelSheetLayout(cameras(MAX_LABELS_PER_PDF + 1), 'A4')).toThrow(
      /at most 500 labels; 501 were asked for/,
    )
    expect(() => labelSheetLayout([camera(1, { assetTag: 'bad tag' })], 'A4')).toThrow(RangeError)
  })
})
