// Which measured regions count for the verdict, and their warnings in plain words.
import {
  EDGE_WARNING_MESSAGES,
  median,
  type EdgeMeasurement,
  type EdgeOrientation,
  type EdgeWarning,
  type Roi,
  type VerdictEdge,
} from '@shared/analysis'
import type { EdgeProfile } from '@/workers/types'

/** A region in the editor: found by the engine or drawn by hand, measured or not (yet). */
export interface RegionState {
  id: string
  roi: Roi
  orientation?: EdgeOrientation
  source: 'found' | 'manual'
  enabled: boolean
  status: 'pending' | 'measuring' | 'measured' | 'failed'
  measurement: EdgeMeasurement | null
  profile: EdgeProfile | null
  error: string | null
}

/**
 * Warnings that make a region's MTF untrustworthy, so it is left out of the verdict
 * (DOMAIN.md: reject clipped regions; a narrow region or too few phase cycles reads high).
 * Low contrast and sharpening are reported but the region still counts.
 */
export const REJECTING_WARNINGS: readonly EdgeWarning[] = [
  'roi-too-narrow',
  'few-phase-cycles',
  'critical-angle',
  'clipping',
]

export function isValidRegion(r: RegionState): boolean {
  const m = r.measurement
  if (r.status !== 'measured' || !m || m.mtf50 === null) return false
  return !m.warnings.some((w) => REJECTING_WARNINGS.includes(w))
}

/** A few words per warning, for lists of reasons. */
const WARNING_SHORT: Record<EdgeWarning, string> = {
  'roi-too-narrow': 'region too narrow',
  'few-phase-cycles': 'too few phase cycles',
  'critical-angle': 'critical angle',
  clipping: 'clipped',
  'low-contrast': 'low contrast',
  sharpening: 'sharpened',
}

export interface RegionProblem {
  text: string
  /** A few words for lists. */
  short: string
  rejects: boolean
}

/** First clause of an engine message (up to a colon, semicolon or sentence end). */
function firstClause(text: string): string {
  return text
    .split(/:|;|\.\s/)[0]
    .trim()
    .replace(/\.$/, '')
    .toLowerCase()
}

/** Plain-words problems of a region, rejecting ones first. */
export function regionProblems(r: RegionState): RegionProblem[] {
  if (r.status === 'failed') {
    const text = r.error ?? 'The region could not be measured.'
    return [{ text, short: firstClause(text), rejects: true }]
  }
  const m = r.measurement
  if (!m) return []
  const out: RegionProblem[] = m.warnings.map((w) => ({
    text: EDGE_WARNING_MESSAGES[w] ?? w,
    short: WARNING_SHORT[w] ?? w,
    rejects: REJECTING_WARNINGS.includes(w),
  }))
  if (m.mtf50 === null) {
    out.push({
      text: 'The MTF does not fall to 0.5 below 1 c/p, so MTF50 is undefined.',
      short: 'no MTF50',
      rejects: true,
    })
  }
  return out.sort((a, b) => Number(b.rejects) - Number(a.rejects))
}

/** The verdict's view of the enabled regions (turned-off regions are not mentioned at all). */
export function verdictEdges(regions: readonly RegionState[]): VerdictEdge[] {
  return regions
    .filter((r) => r.enabled && r.status !== 'pending' && r.status !== 'measuring')
    .map((r) => ({
      valid: isValidRegion(r),
      mtf50CyPx: r.measurement?.mtf50 ?? null,
      mtf: r.measurement?.mtf,
      rise1090Px: r.measurement?.rise1090Px ?? null,
      warnings: regionProblems(r)
        .filter((p) => p.rejects)
        .map((p) => p.short),
    }))
}

/**
 * The item whose value is nearest `center` (by default the median of the values), the first on
 * ties; null for no items. The rule that picks the edge whose kernel stands for a check.
 */
export function nearestToMedian<T>(
  items: readonly T[],
  valueOf: (item: T) => number,
  center: number | null = null,
): T | null {
  if (!items.length) return null
  const c = center ?? median(items.map(valueOf))
  return items.reduce((best, item) =>
    Math.abs(valueOf(item) - c) < Math.abs(valueOf(best) - c) ? item : best,
  )
}

/** The valid enabled region whose MTF50 is nearest the median: its kernel stands for the frame. */
export function representativeRegion(regions: readonly RegionState[]): RegionState | null {
  return nearestToMedian(
    regions.filter((r) => r.enabled && isValidRegion(r)),
    (r) => r.measurement!.mtf50 as number,
  )
}
