import QRCode from 'qrcode'
import { describe, expect, it } from 'vitest'
import { encodeTargetPayload } from '../payload'
import { QR_QUIET_ZONE_MODULES, qrModuleRects } from '../qrModules'

const payload = encodeTargetPayload({ id: 'SFT-7K2M9Q', widthMm: 210, heightMm: 297 })
const matrix = QRCode.create(payload, { errorCorrectionLevel: 'M' }).modules
const box = { x: 145, y: 210, w: 52.5, h: 52.5 }

describe('QR modules as rectangles', () => {
  const rects = qrModuleRects(matrix, box)
  const moduleMm = box.w / (matrix.size + 2 * QR_QUIET_ZONE_MODULES)

  it('cover exactly the dark modules of the symbol', () => {
    let dark = 0
    for (let r = 0; r < matrix.size; r++)
      for (let c = 0; c < matrix.size; c++) dark += matrix.get(r, c) ? 1 : 0
    const area = rects.reduce((sum, r) => sum + r.w * r.h, 0)
    expect(area / moduleMm ** 2).toBeCloseTo(dark, 6)
    for (const r of rects) {
      const row = Math.round((r.y - box.y) / moduleMm) - QR_QUIET_ZONE_MODULES
      const c0 = Math.round((r.x - box.x) / moduleMm) - QR_QUIET_ZONE_MODULES
      const len = Math.round(r.w / moduleMm)
      for (let c = c0; c < c0 + len; c++) expect(matrix.get(row, c)).toBeTruthy()
    }
  })

  it('keep a 4-module quiet zone inside the box (ISO/IEC 18004)', () => {
    for (const r of rects) {
      expect(r.x).toBeGreaterThanOrEqual(box.x + 4 * moduleMm - 1e-9)
      expect(r.y).toBeGreaterThanOrEqual(box.y + 4 * moduleMm - 1e-9)
      expect(r.x + r.w).toBeLessThanOrEqual(box.x + box.w - 4 * moduleMm + 1e-9)
      expect(r.y + r.h).toBeLessThanOrEqual(box.y + box.h - 4 * moduleMm + 1e-9)
    }
  })

  it('draw the top-left finder pattern as a 7-module dark bar on its first row', () => {
    const first = rects.filter((r) => Math.abs(r.y - (box.y + 4 * moduleMm)) < 1e-9)
    expect(first[0].x).toBeCloseTo(box.x + 4 * moduleMm, 9)
    expect(first[0].w / moduleMm).toBeCloseTo(7, 9)
  })

  it('refuse something that is not a QR symbol', () => {
    expect(() => qrModuleRects({ size: 5, get: () => 1 }, box)).toThrow(RangeError)
  })
})
