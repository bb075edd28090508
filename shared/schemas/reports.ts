import { z } from 'zod'
import { cameraStateSchema, verdictSchema } from './enums'
import { fleetFilterSchema } from './fleet'

// Exports and printable records. CSV columns carry their units in their names.

/** GET /api/reports/checks.csv and /measurements.csv: the fleet filters plus a few more. */
export const exportQuerySchema = fleetFilterSchema.extend({
  cameraId: z.coerce.number().int().positive().optional(),
  state: cameraStateSchema.optional(),
  verdict: verdictSchema.optional(),
  overdue: z.stringbool().optional(),
})
export type ExportQuery = z.infer<typeof exportQuerySchema>

/** Most rows one export may hold; narrow the filters for more. */
export const MAX_EXPORT_ROWS = 250_000

/** GET /api/reports/summary.pdf: one site (or every site) over a period. */
export const summaryPdfQuerySchema = fleetFilterSchema
export type SummaryPdfQuery = z.infer<typeof summaryPdfQuerySchema>

export const checkIdParamSchema = z.object({ id: z.uuid('must be a check id (UUID)') })

export const CHECK_CSV_COLUMNS = [
  'check_id',
  'captured_at_utc',
  'asset_tag',
  'site',
  'location',
  'task',
  'camera_model',
  'mode',
  'verdict',
  'median_mtf50_cy_px',
  'min_mtf50_cy_px',
  'baseline_ratio',
  'pixel_density_px_per_m',
  'required_px_per_m',
  'measurement_count',
  'inspector',
  'target_id',
  'reasons',
  'notes',
] as const

export const MEASUREMENT_CSV_COLUMNS = [
  'check_id',
  'measurement_id',
  'captured_at_utc',
  'asset_tag',
  'site',
  'mode',
  'verdict',
  'orientation',
  'edge_angle_deg',
  'roi_x_px',
  'roi_y_px',
  'roi_width_px',
  'roi_height_px',
  'mtf50_cy_px',
  'mtf50p_cy_px',
  'mtf10_cy_px',
  'mtf_at_nyquist',
  'rise_10_90_px',
  'overshoot_ratio',
  'noise_rms',
  'psf_model',
  'psf_sigma_px',
  'psf_radius_px',
  'psf_rms_residual',
  'server_mtf50_cy_px',
  'disagreement',
  'warnings',
] as const
