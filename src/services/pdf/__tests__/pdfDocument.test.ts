import { describe, expect, it } from 'vitest'
import { latin1, parsePdf } from '../../__tests__/pdfParse'
import { pdfNumber, pdfString, PT_PER_MM } from '../format'
import { PdfDocument } from '../pdfDocument'

describe('PDF writer', () => {
  it('writes a file a reader can walk: header, objects at their xref offsets, trailer', () => {
    const doc = new PdfDocument()
    doc.addPage(210, 297).fill({ r: 0, g: 0, b: 0 }).rect({ x: 10, y: 20, w: 30, h: 40 })
    doc.addPage(100, 50)
    const bytes = doc.toBytes({ title: 'Test – 5°' })
    const text = latin1(bytes)
    expect(text.startsWith('%PDF-1.4\n%')).toBe(true)
    expect(bytes[10]).toBeGreaterThan(127) // binary marker line, so transfers keep it binary
    expect(text.endsWith('%%EOF\n')).toBe(true)
    const { pages, objects } = parsePdf(bytes)
    expect(pages).toHaveLength(2)
    expect([...objects.values()].some((o) => o.includes('/Title (Test \\226 5\\260)'))).toBe(true)
  })

  it('sizes pages in points from millimetres (1 pt = 25.4/72 mm)', () => {
    const doc = new PdfDocument()
    doc.addPage(210, 297)
    const [page] = parsePdf(doc.toBytes()).pages
    // A4 = 595.28 × 841.89 pt [std: ISO 216 with 72 pt per inch].
    expect(page.mediaBox[0]).toBe(0)
    expect(page.mediaBox[1]).toBe(0)
    expect(page.mediaBox[2]).toBeCloseTo(595.28, 2)
    expect(page.mediaBox[3]).toBeCloseTo(841.89, 2)
  })

  it('draws in the caller’s millimetres under one mm → pt transform that flips y', () => {
    const doc = new PdfDocument()
    doc.addPage(210, 297).polygon([
      { x: 1, y: 2 },
      { x: 3.25, y: 4 },
      { x: 5, y: 6.125 },
    ])
    const [page] = parsePdf(doc.toBytes()).pages
    expect(page.content.startsWith('q 2.83464567 0 0 -2.83464567 0 841.889764 cm\n')).toBe(true)
    expect(page.content).toContain('1 2 m 3.25 4 l 5 6.125 l h f')
    expect(page.content.trimEnd().endsWith('Q')).toBe(true)
  })

  it('right-aligns text with the Helvetica widths and flips glyphs upright', () => {
    const doc = new PdfDocument()
    doc
      .addPage(100, 100)
      .text({ text: 'Hi', x: 50, y: 20, sizeMm: 10, weight: 'bold', align: 'end' })
    const [page] = parsePdf(doc.toBytes()).pages
    // Bold "Hi" = H 722 + i 278 = 1000 units → 10 mm at size 10 [Helvetica-Bold.afm]: starts at x = 40.
    expect(page.content).toContain('BT /F2 10 Tf 1 0 0 -1 40 20 Tm (Hi) Tj ET')
  })

  it('refuses an empty document, bad pages and bad numbers', () => {
    expect(() => new PdfDocument().toBytes()).toThrow(/at least one page/)
    expect(() => new PdfDocument().addPage(0, 10)).toThrow(RangeError)
    expect(() => pdfNumber(Number.NaN)).toThrow(RangeError)
    expect(() => new PdfDocument().addPage(10, 10).polygon([{ x: 0, y: 0 }])).toThrow(RangeError)
  })
})

describe('PDF numbers and strings', () => {
  it('writes numbers plainly with at most 4 decimals', () => {
    expect(pdfNumber(595.2755905511812)).toBe('595.2756')
    expect(pdfNumber(-0.00001)).toBe('0')
    expect(pdfNumber(1e-7)).toBe('0')
    expect(pdfNumber(12)).toBe('12')
    expect(PT_PER_MM).toBeCloseTo(2.834645669, 9)
  })

  it('escapes parentheses, backslashes and non-ASCII characters', () => {
    expect(pdfString('a(b)c\\')).toBe('(a\\(b\\)c\\\\)')
    expect(pdfString('210 × 297 mm')).toBe('(210 \\327 297 mm)')
    expect(() => pdfString('≥')).toThrow(RangeError)
  })
})
