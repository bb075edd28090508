import { describe, expect, it } from 'vitest'
import { textWidth } from '../fontMetrics'
import { CAP_HEIGHT_EM, fitAssetTag, fitLine, printableText } from '../labelText'

describe('label words', () => {
  it('keep a name that fits as it is', () => {
    // "Harbour Depot" at 3.2 mm: Helvetica widths sum to 6558/1000 em → 20.99 mm [Helvetica.afm].
    expect(textWidth('Harbour Depot', 3.2)).toBeCloseTo(20.99, 2)
    expect(fitLine('Harbour Depot', 3.2, 58)).toBe('Harbour Depot')
  })

  it('cut a long name with an ellipsis so it stays inside the line', () => {
    const long = 'Riverside Logistics Park, Warehouse 14, loading bay camera mast east'
    const fitted = fitLine(long, 3, 58)
    expect(fitted.endsWith('…')).toBe(true)
    expect(textWidth(fitted, 3)).toBeLessThanOrEqual(58)
    expect(long.startsWith(fitted.slice(0, -1))).toBe(true)
    // The next longer cut (past any space) would not have fitted.
    let m = fitted.length
    while (long.slice(0, m).trimEnd().length < fitted.length) m++
    expect(textWidth(long.slice(0, m).trimEnd() + '…', 3)).toBeGreaterThan(58)
    expect(fitLine('MMMMMMMM', 3, 1)).toBe('')
  })

  it('print accented and foreign letters without failing the PDF', () => {
    expect(printableText('Café  du\tPort')).toBe('Cafe du Port')
    expect(printableText('Gare Saint-Lazare – quai 3')).toBe('Gare Saint-Lazare – quai 3')
    expect(printableText('Хаб 7')).toBe('??? 7')
  })

  it('set a short asset tag on one line at the largest size', () => {
    const fitted = fitAssetTag('MTD-004', { maxWidthMm: 58, bandHeightMm: 7, maxSizeMm: 7 })
    expect(fitted).toEqual({ sizeMm: 7, lines: ['MTD-004'] })
  })

  it('shrink or break a long asset tag, never shorten it, and keep it in its box', () => {
    const box = { maxWidthMm: 58, bandHeightMm: 7, maxSizeMm: 7 }
    for (const tag of ['NORTHGATE-LOADING-DOCK-07', 'W'.repeat(64), 'site.7/pole-12/cam_3-east']) {
      const fitted = fitAssetTag(tag, box)
      expect(fitted.lines.join('')).toBe(tag)
      for (const line of fitted.lines)
        expect(textWidth(line, fitted.sizeMm, 'bold')).toBeLessThanOrEqual(58 + 1e-9)
      const height = fitted.sizeMm * (CAP_HEIGHT_EM + (fitted.lines.length - 1) * 1.1)
      expect(height).toBeLessThanOrEqual(7 + 1e-9)
    }
    // 64 × W (944/1000 em bold) on one line would need 60.4 em: 0.96 mm type. Three lines of
    // 21–22 characters give 2.57 mm, limited by the band: 7 / (0.718 + 2 × 1.1) [calc].
    const worst = fitAssetTag('W'.repeat(64), box)
    expect(worst.lines).toHaveLength(3)
    expect(worst.sizeMm).toBeCloseTo(7 / (0.718 + 2.2), 6)
  })

  it('break a tag after a dash rather than inside a word', () => {
    const box = { maxWidthMm: 58, bandHeightMm: 7, maxSizeMm: 7 }
    expect(fitAssetTag('NORTHGATE-LOADING-DOCK-07', box).lines).toEqual([
      'NORTHGATE-',
      'LOADING-DOCK-07',
    ])
    const fitted = fitAssetTag('RIVERSIDE-WAREHOUSE-14', {
      maxWidthMm: 30,
      bandHeightMm: 9,
      maxSizeMm: 7,
    })
    expect(fitted.lines.length).toBeGreaterThan(1)
    for (const line of fitted.lines.slice(0, -1)) expect(line.endsWith('-')).toBe(true)
  })
})
