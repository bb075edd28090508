import Papa from 'papaparse'
import { describe, expect, it } from 'vitest'
import { cell, csvChunk, neutraliseText } from '../csvCells'

// Spreadsheet formula injection: OWASP "CSV Injection" lists = + - @ tab and carriage return
// as the characters that start a formula; a leading apostrophe makes the cell plain text.
describe('CSV cells', () => {
  it('prefix text that a spreadsheet would run as a formula with an apostrophe', () => {
    for (const v of ['=1+1', '+SUM(A1)', '-2+3', '@cmd', '\tx', '\rx', '  =HYPERLINK("x")'])
      expect(neutraliseText(v)).toBe(`'${v}`)
  })

  it('catch a formula even when a line break follows it', () => {
    expect(neutraliseText('=1+2\nsecond line')).toBe("'=1+2\nsecond line")
  })

  it('leave ordinary text alone', () => {
    for (const v of ['North gate', 'GATE-01', 'a=b', '', 'x-1']) expect(neutraliseText(v)).toBe(v)
  })

  it('write numbers as numbers (negative ones too), rounded to 6 decimals', () => {
    expect(cell(-4.8)).toBe(-4.8)
    expect(cell(0.1 + 0.2)).toBe(0.3)
    expect(cell(Number.NaN)).toBe('')
    expect(cell(null)).toBe('')
    expect(cell(new Date('2025-06-01T09:00:00Z'))).toBe('2025-06-01T09:00:00.000Z')
    expect(cell(true)).toBe('true')
  })

  it('make CSV that reads back to the same values, quoted where needed', () => {
    const text = csvChunk(
      ['a', 'b'],
      [
        ['x, y', '=1'],
        [1.5, 'say "hi"'],
      ],
      true,
    )
    expect(text.endsWith('\r\n')).toBe(true)
    const back = Papa.parse<string[]>(text.trim()).data
    expect(back).toEqual([
      ['a', 'b'],
      ['x, y', "'=1"],
      ['1.5', 'say "hi"'],
    ])
  })
})
