// Turning values into CSV cells that are safe to open in a spreadsheet.
import Papa from 'papaparse'

/** Cells starting with one of these are run as formulas by spreadsheet programs. */
const FORMULA_START = /^[=+\-@\t\r]/

/**
 * A text cell that a spreadsheet would treat as a formula (= + - @, tab or carriage return
 * first, also after leading spaces) gets a leading apostrophe, which makes it plain text.
 * Numbers are written as numbers (a negative number is not a formula).
 */
export function neutraliseText(value: string): string {
  return FORMULA_START.test(value) || FORMULA_START.test(value.trimStart()) ? `'${value}` : value
}

export type Cell = string | number | boolean | Date | null | undefined

/** One cell: numbers to at most 6 decimals, times in ISO 8601 UTC, text neutralised. */
export function cell(v: Cell): string | number {
  if (v === null || v === undefined) return ''
  if (typeof v === 'number') return Number.isFinite(v) ? Number(v.toFixed(6)) : ''
  if (typeof v === 'boolean') return v ? 'true' : 'false'
  if (v instanceof Date) return v.toISOString()
  return neutraliseText(v)
}

/** CSV text for some rows (CRLF line ends), with the header line when asked. */
export function csvChunk(fields: readonly string[], rows: Cell[][], withHeader: boolean): string {
  if (rows.length === 0 && !withHeader) return ''
  const text = Papa.unparse(
    { fields: [...fields], data: rows.map((r) => r.map(cell)) },
    { header: withHeader, newline: '\r\n', quotes: false },
  )
  return text ? `${text}\r\n` : ''
}
