import { describe, expect, it } from 'vitest'
import { customSheet, ISO_SHEETS, standardSheet, US_SHEETS } from '../sheets'

describe('sheet sizes', () => {
  it('match ISO 216 and the US Letter/Tabloid sizes', () => {
    // ISO 216 [std]: A4 210 × 297, A3 297 × 420, A2 420 × 594, A1 594 × 841, A0 841 × 1189 mm.
    expect(ISO_SHEETS.map((s) => [s.name, s.widthMm, s.heightMm])).toEqual([
      ['A4', 210, 297],
      ['A3', 297, 420],
      ['A2', 420, 594],
      ['A1', 594, 841],
      ['A0', 841, 1189],
    ])
    // Letter 8.5 × 11 in and Tabloid 11 × 17 in, 25.4 mm per inch [std, ANSI/ASME Y14.1].
    const inch = 25.4
    const expected = [
      ['Letter', 8.5, 11],
      ['Tabloid', 11, 17],
    ] as const
    US_SHEETS.forEach((s, i) => {
      expect(s.name).toBe(expected[i][0])
      expect(s.widthMm).toBeCloseTo(expected[i][1] * inch, 9)
      expect(s.heightMm).toBeCloseTo(expected[i][2] * inch, 9)
    })
  })

  it('look a standard size up by name, whatever the case', () => {
    expect(standardSheet('a3').heightMm).toBe(420)
    expect(() => standardSheet('B5')).toThrow(/not a sheet size/)
  })

  it('make a custom sheet with the √2 aspect, rounded to 0.1 mm', () => {
    expect(customSheet(1500)).toEqual({
      name: 'Custom',
      widthMm: 1500,
      heightMm: 2121.3,
      custom: true,
    })
    expect(() => customSheet(50)).toThrow(RangeError)
    expect(() => customSheet(Number.NaN)).toThrow(TypeError)
  })
})
