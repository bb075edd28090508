import { z } from 'zod'
import { isoDateTime } from './common'
import { cameraStateSchema, checkModeSchema, verdictSchema } from './enums'
import { mtfPointSchema, verdictReasonSchema } from './checks'

// Fleet overview (supervisor; admin may read): counts for a period, the camera table, a camera's
// history, one check with its curves, and the chart series. Times are UTC; weeks start on Monday.

const DAY_MS = 86_400_000
/** Default period: the last 90 days. Longest period: a little over 5 years. */
export const FLEET_DEFAULT_PERIOD_DAYS = 90
export const FLEET_MAX_PERIOD_DAYS = 1900

const id = z.coerce.number().int('must be a whole number').positive('must be positive')

/** A day (YYYY-MM-DD, whole UTC day) or an exact instant (ISO 8601 with offset). */
export const periodBoundSchema = z.union([z.iso.date(), z.iso.datetime({ offset: true })], {
  error: 'must be a date (YYYY-MM-DD) or an ISO 8601 time',
})

/** Filters shared by the counts, charts and exports. */
export const fleetFilterSchema = z.object({
  /** Start of the period (a day counts from its start). Default: `to` − 90 days. */
  from: periodBoundSchema.optional(),
  /** End of the period (a day counts to its end). Default: now. */
  to: periodBoundSchema.optional(),
  siteId: id.optional(),
  taskId: z.string().trim().min(1).max(32).optional(),
  cameraModelId: id.optional(),
})
export type FleetFilter = z.infer<typeof fleetFilterSchema>

export interface Period {
  from: Date
  to: Date
}

/**
 * Turns the query's bounds into a half-open UTC interval [from, to). A date-only `to` includes
 * that whole day. Throws RangeError for an empty or over-long period.
 */
export function resolvePeriod(f: Pick<FleetFilter, 'from' | 'to'>, now: Date): Period {
  const parse = (v: string, end: boolean) => {
    if (/^\d{4}-\d{2}-\d{2}$/.test(v)) {
      const t = Date.parse(`${v}T00:00:00Z`)
      return new Date(end ? t + DAY_MS : t)
    }
    return new Date(v)
  }
  const to = f.to ? parse(f.to, true) : now
  const from = f.from
    ? parse(f.from, false)
    : new Date(to.getTime() - FLEET_DEFAULT_PERIOD_DAYS * DAY_MS)
  if (from.getTime() >= to.getTime()) throw new RangeError('The period must start before it ends.')
  if (to.getTime() - from.getTime() > FLEET_MAX_PERIOD_DAYS * DAY_MS)
    throw new RangeError(`The period may be at most ${FLEET_MAX_PERIOD_DAYS} days long.`)
  return { from, to }
}

/**
 * Counts for a group of cameras over a period. A camera's result for the period is its latest
 * check in the period; `overdue` is as of now (the next check date has passed).
 */
export const fleetCountsSchema = z.object({
  cameras: z.number().int().nonnegative(),
  checked: z.number().int().nonnegative(),
  passed: z.number().int().nonnegative(),
  marginal: z.number().int().nonnegative(),
  failing: z.number().int().nonnegative(),
  /** passed / checked; null when no camera was checked. */
  passRate: z.number().min(0).max(1).nullable(),
  overdue: z.number().int().nonnegative(),
})
export type FleetCounts = z.infer<typeof fleetCountsSchema>

export const fleetSummarySchema = z.object({
  period: z.object({ from: isoDateTime, to: isoDateTime }),
  overall: fleetCountsSchema,
  bySite: z.array(fleetCountsSchema.extend({ siteId: z.number().int(), siteName: z.string() })),
  byTask: z.array(fleetCountsSchema.extend({ taskId: z.string(), taskName: z.string() })),
})
export type FleetSummary = z.infer<typeof fleetSummarySchema>

export const FLEET_SORTS = [
  'assetTag',
  'site',
  'task',
  'model',
  'state',
  'lastCheckAt',
  'nextDueAt',
  'lastMtf50CyPx',
] as const
export type FleetSort = (typeof FLEET_SORTS)[number]

/** GET /api/fleet/cameras: the camera table, filtered, sorted and paged on the server. */
export const fleetCameraQuerySchema = z.object({
  siteId: id.optional(),
  taskId: z.string().trim().min(1).max(32).optional(),
  cameraModelId: id.optional(),
  state: cameraStateSchema.optional(),
  lastVerdict: verdictSchema.optional(),
  overdue: z.stringbool().optional(),
  /** Part of an asset tag or location. */
  q: z.string().trim().min(1).max(100).optional(),
  /** Include retired cameras (default: active only). */
  includeRetired: z.stringbool().default(false),
  sort: z.enum(FLEET_SORTS).default('assetTag'),
  order: z.enum(['asc', 'desc']).default('asc'),
  limit: z.coerce.number().int().min(1).max(200).default(25),
  offset: z.coerce.number().int().min(0).max(10_000_000).default(0),
})
export type FleetCameraQuery = z.infer<typeof fleetCameraQuerySchema>

export const fleetCameraRowSchema = z.object({
  id: z.number().int().positive(),
  assetTag: z.string(),
  siteId: z.number().int(),
  siteName: z.string(),
  locationText: z.string(),
  taskId: z.string(),
  taskName: z.string(),
  cameraModelId: z.number().int(),
  cameraModelName: z.string(),
  state: cameraStateSchema,
  lastCheckAt: isoDateTime.nullable(),
  lastVerdict: verdictSchema.nullable(),
  lastMtf50CyPx: z.number().nullable(),
  /** The effective minimum (camera override or task default). */
  minMtf50CyPx: z.number(),
  nextDueAt: isoDateTime.nullable(),
  overdue: z.boolean(),
  active: z.boolean(),
})
export type FleetCameraRow = z.infer<typeof fleetCameraRowSchema>

export const fleetCameraPageSchema = z.object({
  items: z.array(fleetCameraRowSchema),
  total: z.number().int().nonnegative(),
  limit: z.number().int(),
  offset: z.number().int(),
})
export type FleetCameraPage = z.infer<typeof fleetCameraPageSchema>

/** One check in a camera's history (the trend chart's points). */
export const historyCheckSchema = z.object({
  id: z.string(),
  capturedAt: isoDateTime,
  mode: checkModeSchema,
  verdict: verdictSchema,
  medianMtf50CyPx: z.number().nullable(),
  pixelDensityPxPerM: z.number().nullable(),
  baselineRatio: z.number().nullable(),
  isBaseline: z.boolean(),
  inspectorName: z.string(),
})
export type HistoryCheck = z.infer<typeof historyCheckSchema>

export const cameraHistoryQuerySchema = z.object({
  limit: z.coerce.number().int().min(1).max(1000).default(200),
})

/** GET /api/fleet/cameras/:id/history: the camera, its thresholds, baseline and checks. */
export const cameraHistorySchema = z.object({
  camera: fleetCameraRowSchema.extend({
    requiredPxPerM: z.number(),
    checkIntervalDays: z.number().int(),
    marginalBand: z.number(),
  }),
  baseline: z.object({ checkId: z.string(), mtf50CyPx: z.number().nullable() }).nullable(),
  /** Newest first. */
  checks: z.array(historyCheckSchema),
  /** More checks exist than were sent. */
  truncated: z.boolean(),
})
export type CameraHistory = z.infer<typeof cameraHistorySchema>

export const checkMeasurementSchema = z.object({
  id: z.string(),
  roi: z.object({ x: z.number(), y: z.number(), w: z.number(), h: z.number() }),
  orientation: z.enum(['vertical', 'horizontal']),
  angleDeg: z.number(),
  mtf50CyPx: z.number(),
  mtf50pCyPx: z.number().nullable(),
  mtf10CyPx: z.number().nullable(),
  mtfNyquist: z.number().nullable(),
  rise1090Px: z.number().nullable(),
  overshoot: z.number().nullable(),
  noise: z.number().nullable(),
  psf: z
    .object({
      model: z.enum(['gaussian', 'disk']),
      sigmaPx: z.number().nullable(),
      radiusPx: z.number().nullable(),
      rmsResidual: z.number().nullable(),
    })
    .nullable(),
  mtfCurve: z.array(mtfPointSchema),
  warnings: z.array(z.string()),
  serverMtf50CyPx: z.number().nullable(),
  disagreement: z.boolean(),
})
export type CheckMeasurement = z.infer<typeof checkMeasurementSchema>

/** GET /api/fleet/checks/:id: one check with everything it recorded. */
export const checkDetailSchema = z.object({
  id: z.string(),
  camera: z.object({
    id: z.number().int(),
    assetTag: z.string(),
    siteName: z.string(),
    siteTimeZone: z.string(),
    locationText: z.string(),
    taskId: z.string(),
    taskName: z.string(),
    cameraModelName: z.string(),
    minMtf50CyPx: z.number(),
    requiredPxPerM: z.number(),
  }),
  inspector: z.object({ id: z.number().int(), name: z.string() }),
  roundId: z.number().int().nullable(),
  capturedAt: isoDateTime,
  mode: checkModeSchema,
  verdict: verdictSchema,
  reasons: z.array(verdictReasonSchema),
  medianMtf50CyPx: z.number().nullable(),
  pixelDensityPxPerM: z.number().nullable(),
  baselineRatio: z.number().nullable(),
  targetId: z.string().nullable(),
  notes: z.string().nullable(),
  isBaseline: z.boolean(),
  syncedAt: isoDateTime.nullable(),
  measurements: z.array(checkMeasurementSchema),
})
export type CheckDetail = z.infer<typeof checkDetailSchema>

/** One week's share of passing checks (weeks start Monday 00:00 UTC). */
export const weekPointSchema = z.object({
  week: z.iso.date(),
  checks: z.number().int().nonnegative(),
  passed: z.number().int().nonnegative(),
  passRate: z.number().min(0).max(1).nullable(),
})
export type WeekPoint = z.infer<typeof weekPointSchema>

export const passRateTrendQuerySchema = fleetFilterSchema.extend({
  /** How many sites to send series for (those with the lowest pass rate first). */
  sites: z.coerce.number().int().min(1).max(50).default(8),
})

/**
 * GET /api/fleet/trends/pass-rate: share of checks that passed, per week, overall and by site,
 * over the whole weeks overlapping the period (retired cameras' checks included).
 */
export const passRateTrendSchema = z.object({
  period: z.object({ from: isoDateTime, to: isoDateTime }),
  weeks: z.array(z.iso.date()),
  overall: z.array(weekPointSchema),
  sites: z.array(
    z.object({
      siteId: z.number().int(),
      siteName: z.string(),
      checks: z.number().int(),
      passRate: z.number().nullable(),
      points: z.array(weekPointSchema),
    }),
  ),
  /** Sites with checks in the period that were left out of `sites`. */
  sitesLeftOut: z.number().int().nonnegative(),
})
export type PassRateTrend = z.infer<typeof passRateTrendSchema>

/** Histogram bin width for the MTF50 distribution, cycles/pixel. */
export const MTF50_BIN_CY_PX = 0.025
export const MTF50_BIN_COUNT = 24 // 0 … 0.6 c/p; larger values go in the last bin

/** GET /api/fleet/distribution/mtf50: checks' median MTF50 by camera model, whole weeks overlapping the period. */
export const mtfDistributionSchema = z.object({
  period: z.object({ from: isoDateTime, to: isoDateTime }),
  binWidthCyPx: z.number(),
  /** Lower edge of each bin, cycles/pixel. */
  binsCyPx: z.array(z.number()),
  models: z.array(
    z.object({
      cameraModelId: z.number().int(),
      name: z.string(),
      counts: z.array(z.number().int().nonnegative()),
      total: z.number().int().nonnegative(),
    }),
  ),
})
export type MtfDistribution = z.infer<typeof mtfDistributionSchema>
