// Checking each row of a camera CSV: formula cells, numbers, references by name, asset tags
// unique in the file and new to the inventory, then the same zod rules as the camera form.
import { inArray } from 'drizzle-orm'
import { FORMULA_START, PREVIEW_OK_ROWS } from '../../../shared/schemas/csv'
import type { CameraCsvColumn, CsvPreview, CsvRowError } from '../../../shared/schemas/csv'
import { cameraInputSchema } from '../../../shared/schemas/setup'
import type { CameraInput } from '../../../shared/schemas/setup'
import type { DbOrTx } from '../../db/client'
import { cameraModels, cameras, sites, tasks } from '../../db/schema'
import type { ParsedCsv } from './csvParse'

export interface ValidatedRow {
  line: number
  values: Record<string, string>
  errors: CsvRowError[]
  input: CameraInput | null
}

/** The camera field each CSV column fills (for mapping zod issues back to columns). */
const FIELD_OF: Record<CameraCsvColumn, keyof CameraInput> = {
  asset_tag: 'assetTag',
  site: 'siteId',
  camera_model: 'cameraModelId',
  task: 'taskId',
  location: 'locationText',
  required_px_per_m: 'requiredPxPerM',
  min_mtf50_cy_px: 'minMtf50CyPx',
  check_interval_days: 'checkIntervalDays',
  focal_length_mm: 'focalLengthMm',
  target_distance_m: 'targetDistanceM',
}
const COLUMN_OF = new Map(Object.entries(FIELD_OF).map(([col, field]) => [field as string, col]))

const NUMERIC: CameraCsvColumn[] = [
  'required_px_per_m',
  'min_mtf50_cy_px',
  'check_interval_days',
  'focal_length_mm',
  'target_distance_m',
]

export interface Lookups {
  siteByName: Map<string, number>
  modelByName: Map<string, number>
  taskByKey: Map<string, string>
  existingTags: Set<string>
}

const key = (s: string) => s.trim().toLowerCase()

/** Names of sites, models and tasks, and which of the file's asset tags exist already. */
export async function loadLookups(tx: DbOrTx, assetTags: string[]): Promise<Lookups> {
  const [siteRows, modelRows, taskRows] = await Promise.all([
    tx.select({ id: sites.id, name: sites.name }).from(sites),
    tx.select({ id: cameraModels.id, name: cameraModels.name }).from(cameraModels),
    tx.select({ id: tasks.id, name: tasks.name }).from(tasks),
  ])
  const existingTags = new Set<string>()
  const tags = [...new Set(assetTags.filter(Boolean))]
  for (let i = 0; i < tags.length; i += 1000) {
    const found = await tx
      .select({ tag: cameras.assetTag })
      .from(cameras)
      .where(inArray(cameras.assetTag, tags.slice(i, i + 1000)))
    for (const f of found) existingTags.add(key(f.tag))
  }
  const taskByKey = new Map<string, string>()
  for (const t of taskRows) {
    taskByKey.set(key(t.id), t.id)
    taskByKey.set(key(t.name), t.id)
  }
  return {
    siteByName: new Map(siteRows.map((s) => [key(s.name), s.id])),
    modelByName: new Map(modelRows.map((m) => [key(m.name), m.id])),
    taskByKey,
    existingTags,
  }
}

function parseNumber(raw: string): number | null | string {
  const v = raw.trim()
  if (v === '') return null
  if (/^\d+,\d+$/.test(v)) return 'Use a dot as the decimal separator (e.g. 0.25).'
  if (!/^\d+(\.\d+)?$/.test(v) && !/^\.\d+$/.test(v)) return `"${v}" is not a number.`
  return Number(v)
}

export function validateRows(parsed: ParsedCsv, lookups: Lookups): ValidatedRow[] {
  const firstLineOfTag = new Map<string, number>()
  return parsed.rows.map(({ line, cells }) => {
    const errors: CsvRowError[] = []
    const values: Record<string, string> = {}
    parsed.columns.forEach((c, i) => (values[c] = cells[i] ?? ''))
    if (cells.length !== parsed.columns.length) {
      errors.push({
        column: null,
        message: `The row has ${cells.length} cells; the header has ${parsed.columns.length}.`,
      })
      return { line, values, errors, input: null }
    }
    for (const [column, raw] of Object.entries(values)) {
      if (FORMULA_START.test(raw) || FORMULA_START.test(raw.trim()))
        errors.push({
          column,
          message: `Starts with "${raw.trim()[0] ?? raw[0]}", which spreadsheet programs may run as a formula; remove that character.`,
        })
    }
    if (errors.length) return { line, values, errors, input: null }

    const draft: Record<string, unknown> = {
      assetTag: values.asset_tag,
      locationText: values.location ?? '',
    }
    const site = lookups.siteByName.get(key(values.site))
    if (site === undefined)
      errors.push({ column: 'site', message: `There is no site named "${values.site.trim()}".` })
    else draft.siteId = site
    const model = lookups.modelByName.get(key(values.camera_model))
    if (model === undefined)
      errors.push({
        column: 'camera_model',
        message: `There is no camera model named "${values.camera_model.trim()}".`,
      })
    else draft.cameraModelId = model
    const task = lookups.taskByKey.get(key(values.task))
    if (task === undefined)
      errors.push({ column: 'task', message: `There is no task "${values.task.trim()}".` })
    else draft.taskId = task
    for (const column of NUMERIC) {
      if (!(column in values)) continue
      const n = parseNumber(values[column])
      if (typeof n === 'string') errors.push({ column, message: n })
      else draft[FIELD_OF[column]] = n
    }
    const tag = key(values.asset_tag)
    if (tag) {
      const first = firstLineOfTag.get(tag)
      if (first !== undefined)
        errors.push({ column: 'asset_tag', message: `The same asset tag as line ${first}.` })
      else firstLineOfTag.set(tag, line)
      if (lookups.existingTags.has(tag))
        errors.push({
          column: 'asset_tag',
          message: 'A camera with this asset tag exists already.',
        })
    }
    const checked = cameraInputSchema.safeParse(draft)
    if (!checked.success) {
      for (const issue of checked.error.issues) {
        const column = COLUMN_OF.get(String(issue.path[0])) ?? null
        // References already reported by name above.
        if (column && errors.some((e) => e.column === column)) continue
        errors.push({ column, message: issue.message })
      }
    }
    return { line, values, errors, input: errors.length ? null : (checked.data ?? null) }
  })
}

export function toPreview(columns: string[], rows: ValidatedRow[]): CsvPreview {
  const bad = rows.filter((r) => r.errors.length > 0)
  const good = rows.filter((r) => r.errors.length === 0).slice(0, PREVIEW_OK_ROWS)
  return {
    columns,
    rowCount: rows.length,
    errorRowCount: bad.length,
    valid: bad.length === 0,
    rows: [...bad, ...good].map(({ line, values, errors }) => ({ line, values, errors })),
  }
}
