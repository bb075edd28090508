import { nonNegative } from './validate'

export type IecScheme = '2014' | '2025-draft'

export interface IecLevel {
  /** Stable id for storage and code. */
  id: string
  /** Plain-words name for the UI. */
  label: string
  /** Minimum pixel density at the object, px/m. */
  minPxPerM: number
  scheme: IecScheme
  /** Provenance, shown where the level is shown. */
  source: string
}

const STD_2014 = 'IEC 62676-4:2014 / EN 62676-4:2015 [std]'
const DRAFT_2025 = 'IEC 62676-4 2025 edition [std, draft; level names unverified]'

/** IEC 62676-4:2014 / EN 62676-4:2015 object-resolution levels (DOMAIN.md), ascending. */
export const IEC_62676_4_2014: readonly IecLevel[] = [
  { id: 'monitor', label: 'Monitor', minPxPerM: 12.5, scheme: '2014', source: STD_2014 },
  { id: 'detect', label: 'Detect', minPxPerM: 25, scheme: '2014', source: STD_2014 },
  { id: 'observe', label: 'Observe', minPxPerM: 62.5, scheme: '2014', source: STD_2014 },
  { id: 'recognise', label: 'Recognise', minPxPerM: 125, scheme: '2014', source: STD_2014 },
  { id: 'identify', label: 'Identify', minPxPerM: 250, scheme: '2014', source: STD_2014 },
  { id: 'inspect', label: 'Inspect', minPxPerM: 1000, scheme: '2014', source: STD_2014 },
]

/**
 * The 2025 edition's seven px/m values (DOMAIN.md, draft). Their names are not verified against
 * the published text, so the levels are numbered, not named.
 */
export const IEC_62676_4_2025_DRAFT: readonly IecLevel[] = [20, 40, 80, 125, 250, 500, 1500].map(
  (minPxPerM, i) => ({
    id: `draft-level-${i + 1}`,
    label: `Draft level ${i + 1} (${minPxPerM} px/m; name unverified)`,
    minPxPerM,
    scheme: '2025-draft' as const,
    source: DRAFT_2025,
  }),
)

/** The highest level of `scheme` whose minimum density is met, or null below the lowest. */
export function iecLevelFor(pxPerM: number, scheme: IecScheme = '2014'): IecLevel | null {
  nonNegative('pxPerM', pxPerM)
  const levels = schemeLevels(scheme)
  let best: IecLevel | null = null
  for (const level of levels) if (pxPerM >= level.minPxPerM) best = level
  return best
}

/** The highest level met in both schemes. */
export function iecLevelsFor(pxPerM: number): {
  iec2014: IecLevel | null
  draft2025: IecLevel | null
} {
  return { iec2014: iecLevelFor(pxPerM, '2014'), draft2025: iecLevelFor(pxPerM, '2025-draft') }
}

function schemeLevels(scheme: IecScheme): readonly IecLevel[] {
  if (scheme === '2014') return IEC_62676_4_2014
  if (scheme === '2025-draft') return IEC_62676_4_2025_DRAFT
  throw new TypeError(
    `Unknown IEC 62676-4 scheme ${JSON.stringify(scheme)}: use '2014' or '2025-draft'.`,
  )
}
