import { z } from 'zod'

// Camera inventory CSV import: the columns, the limits and the preview/commit answers.
// Cameras refer to their site and camera model by name and to their task by code or name.

export const CSV_IMPORT_LIMITS = {
  maxBytes: 2 * 1024 * 1024,
  maxRows: 10_000,
} as const

export const CAMERA_CSV_REQUIRED = ['asset_tag', 'site', 'camera_model', 'task'] as const
export const CAMERA_CSV_OPTIONAL = [
  'location',
  'required_px_per_m',
  'min_mtf50_cy_px',
  'check_interval_days',
  'focal_length_mm',
  'target_distance_m',
] as const
export const CAMERA_CSV_COLUMNS = [...CAMERA_CSV_REQUIRED, ...CAMERA_CSV_OPTIONAL] as const
export type CameraCsvColumn = (typeof CAMERA_CSV_COLUMNS)[number]

/** Characters that make spreadsheet programs treat a cell as a formula. */
export const FORMULA_START = /^[=+\-@\t\r]/

export const csvRowErrorSchema = z.object({
  /** The column the problem is in, or null for the whole row. */
  column: z.string().nullable(),
  message: z.string(),
})
export type CsvRowError = z.infer<typeof csvRowErrorSchema>

export const csvPreviewRowSchema = z.object({
  /** Line number in the file (the header is line 1). */
  line: z.number().int().positive(),
  values: z.record(z.string(), z.string()),
  errors: z.array(csvRowErrorSchema),
})
export type CsvPreviewRow = z.infer<typeof csvPreviewRowSchema>

export const csvPreviewSchema = z.object({
  columns: z.array(z.string()),
  rowCount: z.number().int().nonnegative(),
  errorRowCount: z.number().int().nonnegative(),
  /** True when every row is valid and the file can be imported. */
  valid: z.boolean(),
  /** Every row with an error, then the first valid rows (at most PREVIEW_OK_ROWS of them). */
  rows: z.array(csvPreviewRowSchema),
})
export type CsvPreview = z.infer<typeof csvPreviewSchema>
export const PREVIEW_OK_ROWS = 50

export const csvCommitSchema = z.object({
  imported: z.number().int().nonnegative(),
  cameraIds: z.array(z.number().int()),
})
export type CsvCommit = z.infer<typeof csvCommitSchema>

export const CSV_IMPORT_ERRORS = {
  badFile: 'import.bad_file',
  tooLarge: 'import.too_large',
  invalidRows: 'import.invalid_rows',
} as const
