// Reading a camera inventory CSV: bytes → text → header + rows. File-level problems (not text,
// wrong columns, too many rows) throw an AppError with a sentence; row problems are found later.
import Papa from 'papaparse'
import {
  CAMERA_CSV_COLUMNS,
  CAMERA_CSV_REQUIRED,
  CSV_IMPORT_ERRORS,
  CSV_IMPORT_LIMITS,
} from '../../../shared/schemas/csv'
import { AppError } from '../../errors'

export interface ParsedCsv {
  columns: string[]
  /** Each row's cells in column order, with the line it starts on (header = line 1). */
  rows: { line: number; cells: string[] }[]
}

const bad = (message: string, status = 400) =>
  new AppError(CSV_IMPORT_ERRORS.badFile, message, status)

function decode(bytes: Uint8Array): string {
  if (bytes.length === 0) throw bad('The file is empty.')
  if (bytes.length > CSV_IMPORT_LIMITS.maxBytes)
    throw new AppError(
      CSV_IMPORT_ERRORS.tooLarge,
      `The file is larger than ${CSV_IMPORT_LIMITS.maxBytes / 1024 / 1024} MB; split it into smaller files.`,
      413,
    )
  if (bytes.includes(0)) throw bad('This is not a text CSV file (it contains binary data).')
  try {
    return new TextDecoder('utf-8', { fatal: true }).decode(bytes).replace(/^\uFEFF/, '')
  } catch {
    throw bad('The file is not UTF-8 text; save it from your spreadsheet as "CSV UTF-8".')
  }
}

export function parseCameraCsv(bytes: Uint8Array): ParsedCsv {
  // One kind of line end (files edited on different systems may mix them).
  const text = decode(bytes).replace(/\r\n?/g, '\n')
  const result = Papa.parse<string[]>(text, { header: false, skipEmptyLines: false, newline: '\n' })
  const quoteError = result.errors.find((e) => e.type === 'Quotes')
  if (quoteError)
    throw bad(`The CSV is malformed: ${quoteError.message.toLowerCase()}. Check the quotes.`)
  // Number every record by the physical line it starts on (quoted cells may span lines) and
  // drop blank lines.
  const records: { line: number; cells: string[] }[] = []
  let line = 1
  for (const cells of result.data) {
    if (cells.some((c) => c.trim() !== '')) records.push({ line, cells })
    line += 1 + cells.reduce((n, c) => n + (c.match(/\n/g)?.length ?? 0), 0)
  }
  const [head, ...rows] = records
  if (!head) throw bad('The file has no header line.')
  const columns = head.cells.map((h) => h.trim().toLowerCase())
  const known = new Set<string>(CAMERA_CSV_COLUMNS)
  const unknown = columns.filter((c) => !known.has(c))
  const missing = CAMERA_CSV_REQUIRED.filter((c) => !columns.includes(c))
  const dupes = columns.filter((c, i) => c && columns.indexOf(c) !== i)
  const problems: string[] = []
  const plural = (n: number) => (n > 1 ? 's' : '')
  if (missing.length)
    problems.push(`missing column${plural(missing.length)}: ${missing.join(', ')}`)
  if (unknown.length)
    problems.push(
      `unknown column${plural(unknown.length)}: ${unknown.map((u) => u || '(empty)').join(', ')}`,
    )
  if (dupes.length) problems.push(`repeated column${plural(dupes.length)}: ${dupes.join(', ')}`)
  if (problems.length)
    throw bad(
      `The header does not match the template (${problems.join('; ')}). ` +
        `Expected columns: ${CAMERA_CSV_COLUMNS.join(', ')}.`,
    )
  if (rows.length === 0) throw bad('The file has a header but no camera rows.')
  if (rows.length > CSV_IMPORT_LIMITS.maxRows)
    throw new AppError(
      CSV_IMPORT_ERRORS.tooLarge,
      `The file has ${rows.length} rows; at most ${CSV_IMPORT_LIMITS.maxRows} can be imported at once.`,
      413,
    )
  return { columns, rows }
}

/** The template: the header and two example rows (invented names). */
export function cameraCsvTemplate(): string {
  return (
    Papa.unparse({
      fields: [...CAMERA_CSV_COLUMNS],
      data: [
        [
          'GATE-07',
          'Example Site',
          'Example Model',
          'recognise',
          'North gate, pole 2',
          '',
          '',
          '',
          '6',
          '12',
        ],
        [
          'LINE3-CAM1',
          'Example Site',
          'Example Model',
          'process_inspection',
          'Line 3 capper',
          '',
          '0.3',
          '30',
          '',
          '',
        ],
      ],
    }) + '\r\n'
  )
}
