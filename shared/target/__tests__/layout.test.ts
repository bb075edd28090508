import { describe, expect, it } from 'vitest'
import { textWidth } from '../fontMetrics'
import { boundingRect, rectsOverlap, type PointMm, type RectMm } from '../geometry'
import { squareSideForWidthMm, targetLayout } from '../layout'
import { decodeTargetPayload } from '../payload'
import { customSheet, ISO_SHEETS, standardSheet, US_SHEETS } from '../sheets'

const SHEETS = [...ISO_SHEETS, ...US_SHEETS, customSheet(1500), customSheet(120)]
const ID = 'SFT-7K2M9Q'
const deg = (rad: number) => (rad * 180) / Math.PI
const dist = (a: PointMm, b: PointMm) => Math.hypot(a.x - b.x, a.y - b.y)
const inside = (r: RectMm, outer: RectMm, eps = 1e-9) =>
  r.x >= outer.x - eps &&
  r.y >= outer.y - eps &&
  r.x + r.w <= outer.x + outer.w + eps &&
  r.y + r.h <= outer.y + outer.h + eps
function gapBetween(a: RectMm, b: RectMm): number {
  const dx = Math.max(b.x - (a.x + a.w), a.x - (b.x + b.w), 0)
  const dy = Math.max(b.y - (a.y + a.h), a.y - (b.y + b.h), 0)
  return Math.max(dx, dy)
}
function textRect(t: {
  text: string
  x: number
  y: number
  sizeMm: number
  weight: 'regular' | 'bold'
  align: string
}): RectMm {
  const w = textWidth(t.text, t.sizeMm, t.weight)
  const x = t.align === 'end' ? t.x - w : t.align === 'middle' ? t.x - w / 2 : t.x
  // Helvetica ascender 0.718 em, descender 0.207 em (AFM).
  return { x, y: t.y - 0.718 * t.sizeMm, w, h: 0.925 * t.sizeMm }
}

describe.each(SHEETS.map((s) => [`${s.name} ${s.widthMm} mm`, s] as const))(
  'target layout on %s',
  (_, sheet) => {
    const layout = targetLayout(sheet, ID)
    const page: RectMm = { x: 0, y: 0, w: sheet.widthMm, h: sheet.heightMm }

    it('has four dark squares of equal side, each tilted by 5.0°', () => {
      expect(layout.squares).toHaveLength(4)
      for (const sq of layout.squares) {
        const [a, b, c, d] = sq.corners
        for (const [p, q] of [
          [a, b],
          [b, c],
          [c, d],
          [d, a],
        ])
          expect(dist(p, q)).toBeCloseTo(sq.sideMm, 9)
        expect(dist(a, c)).toBeCloseTo(sq.sideMm * Math.SQRT2, 9) // a square, not a rhombus
        // Turned counter-clockwise on the page (y points down): the top edge rises to the right by
        // 5.0° and the left edge leans 5.0° from vertical with its top to the left.
        expect(deg(Math.atan2(a.y - b.y, b.x - a.x))).toBeCloseTo(5.0, 9)
        expect(deg(Math.atan2(d.x - a.x, d.y - a.y))).toBeCloseTo(5.0, 9)
        expect(sq.rotationDeg).toBe(5)
      }
    })

    it('keeps half a side of flat grey around every square, inside the panel and margins', () => {
      const s = layout.squareSideMm
      for (const [i, sq] of layout.squares.entries()) {
        const panel = layout.panel
        expect(inside(sq.bounds, panel)).toBe(true)
        expect(sq.bounds.x - panel.x).toBeGreaterThanOrEqual(0.5 * s - 1e-9)
        expect(sq.bounds.y - panel.y).toBeGreaterThanOrEqual(0.5 * s - 1e-9)
        expect(panel.x + panel.w - (sq.bounds.x + sq.bounds.w)).toBeGreaterThanOrEqual(
          0.5 * s - 1e-9,
        )
        expect(panel.y + panel.h - (sq.bounds.y + sq.bounds.h)).toBeGreaterThanOrEqual(
          0.5 * s - 1e-9,
        )
        for (const other of layout.squares.slice(i + 1)) {
          expect(rectsOverlap(sq.bounds, other.bounds)).toBe(false)
          expect(gapBetween(sq.bounds, other.bounds)).toBeGreaterThanOrEqual(0.5 * s - 1e-9)
        }
      }
      expect(layout.panel.x).toBeCloseTo(layout.marginMm, 9)
      expect(
        inside(layout.panel, {
          x: layout.marginMm,
          y: layout.marginMm,
          w: sheet.widthMm - 2 * layout.marginMm,
          h: sheet.heightMm - 2 * layout.marginMm,
        }),
      ).toBe(true)
    })

    it('sizes the squares from the sheet width: side = 0.88 W / (2 (cos 5° + sin 5°) + 1.5)', () => {
      // [calc] from the design: 6 % margins, 2 × 2 grid, half-side clearances (A4: 50.40 mm).
      const t = (5 * Math.PI) / 180
      const expected = (0.88 * sheet.widthMm) / (2 * (Math.cos(t) + Math.sin(t)) + 1.5)
      expect(layout.squareSideMm).toBeCloseTo(expected, 9)
      expect(squareSideForWidthMm(sheet.widthMm)).toBeCloseTo(expected, 9)
    })

    it('places the footer, texts, scale bar and QR code below the panel without overlaps', () => {
      const margins: RectMm = {
        x: layout.marginMm,
        y: layout.marginMm,
        w: sheet.widthMm - 2 * layout.marginMm,
        h: sheet.heightMm - 2 * layout.marginMm,
      }
      const boxes: RectMm[] = [layout.qrBox, layout.scaleBar.outline, ...layout.texts.map(textRect)]
      for (const box of boxes) {
        expect(inside(box, margins)).toBe(true)
        expect(box.y).toBeGreaterThan(layout.panel.y + layout.panel.h)
      }
      for (const t of layout.texts)
        expect(inside(textRect(t), layout.footerColumn, 1e-6)).toBe(true)
      expect(inside(layout.scaleBar.outline, layout.footerColumn)).toBe(true)
      expect(rectsOverlap(layout.footerColumn, layout.qrBox)).toBe(false)
      expect(layout.qrBox.w).toBe(layout.qrBox.h)
      for (let i = 0; i < layout.texts.length; i++) {
        for (let j = i + 1; j < layout.texts.length; j++)
          expect(rectsOverlap(textRect(layout.texts[i]), textRect(layout.texts[j]))).toBe(false)
        expect(rectsOverlap(textRect(layout.texts[i]), layout.scaleBar.outline)).toBe(false)
      }
    })

    it('puts an L-shaped corner mark in each sheet corner, clear of the content', () => {
      expect(layout.fiducials).toHaveLength(4)
      const corners = [
        { x: 0, y: 0 },
        { x: sheet.widthMm, y: 0 },
        { x: sheet.widthMm, y: sheet.heightMm },
        { x: 0, y: sheet.heightMm },
      ]
      layout.fiducials.forEach((mark, i) => {
        expect(mark).toHaveLength(6)
        const box = {
          x: Math.min(...mark.map((p) => p.x)),
          y: Math.min(...mark.map((p) => p.y)),
          w: 0,
          h: 0,
        }
        box.w = Math.max(...mark.map((p) => p.x)) - box.x
        box.h = Math.max(...mark.map((p) => p.y)) - box.y
        expect(inside(box, page)).toBe(true)
        const centre = { x: box.x + box.w / 2, y: box.y + box.h / 2 }
        expect(dist(centre, corners[i])).toBeLessThan(0.1 * sheet.widthMm)
        // The L is two thin bars: points 0-1-2 span one arm, points 0-4-5 the other.
        const arms = [
          boundingRect([mark[0], mark[1], mark[2]]),
          boundingRect([mark[0], mark[4], mark[5]]),
        ]
        for (const arm of arms) {
          for (const content of [
            layout.panel,
            layout.qrBox,
            layout.scaleBar.outline,
            ...layout.texts.map(textRect),
          ]) {
            expect(rectsOverlap(arm, content)).toBe(false)
          }
        }
        const armStroke = 0.006 * sheet.widthMm
        expect(Math.min(box.w, box.h)).toBeGreaterThan(armStroke)
      })
    })

    it('has a millimetre scale bar of a round length made of whole segments', () => {
      const bar = layout.scaleBar
      expect([50, 100, 150, 200, 250, 300, 400, 500, 750, 1000, 1500, 2000, 2500, 3000]).toContain(
        bar.lengthMm,
      )
      expect(bar.outline.w).toBe(bar.lengthMm)
      expect(bar.lengthMm % bar.segmentMm).toBe(0)
      expect(bar.filled).toHaveLength(Math.ceil(bar.lengthMm / bar.segmentMm / 2))
      for (const seg of bar.filled) expect(inside(seg, bar.outline)).toBe(true)
      expect(layout.texts.some((t) => t.text === `${bar.lengthMm} mm`)).toBe(true)
    })

    it('prints the id and the printed size as text and in the QR payload', () => {
      expect(layout.texts.some((t) => t.text.includes(ID))).toBe(true)
      const w = String(Math.round(sheet.widthMm * 10) / 10)
      const h = String(Math.round(sheet.heightMm * 10) / 10)
      expect(layout.texts.some((t) => t.text.includes(`${w} × ${h} mm`))).toBe(true)
      expect(decodeTargetPayload(layout.payload)).toEqual({
        id: ID,
        widthMm: sheet.widthMm,
        heightMm: sheet.heightMm,
      })
    })
  },
)

describe('target layout', () => {
  it('gives A4 squares of 50.4 mm and a 100 mm scale bar', () => {
    const a4 = targetLayout(standardSheet('A4'), ID)
    expect(a4.squareSideMm).toBeCloseTo(50.4, 1) // [calc] 184.8 / 3.6667
    expect(a4.scaleBar.lengthMm).toBe(100)
  })

  it('refuses a bad id and a sheet too short for the footer', () => {
    expect(() => targetLayout(standardSheet('A4'), 'x;y')).toThrow(RangeError)
    expect(() =>
      targetLayout({ name: 'Custom', widthMm: 300, heightMm: 300, custom: true }, ID),
    ).toThrow(/too short/)
  })
})
