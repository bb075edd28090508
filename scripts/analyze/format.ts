import { EDGE_WARNING_MESSAGES } from '../../shared/analysis/mtf/warnings'
import type {
  EdgeMeasurement,
  FrameAnalysis,
  RejectedRegion,
  Roi,
} from '../../shared/analysis/types'

const round = (v: number | null, digits = 6) =>
  v === null || !Number.isFinite(v) ? null : Number(v.toFixed(digits))

/** One edge in the runtime contract's field order (DESIGN.md, `npm run analyze --json`). */
export function edgeRecord(e: EdgeMeasurement) {
  return {
    roi: { x: e.roi.x, y: e.roi.y, w: e.roi.w, h: e.roi.h },
    orientation: e.orientation,
    angleDeg: round(e.angleDeg, 4),
    mtf50: round(e.mtf50),
    mtf50p: round(e.mtf50p),
    mtf10: round(e.mtf10),
    mtfNyquist: round(e.mtfNyquist),
    mtf: e.mtf.map(([f, m]) => [round(f, 4), round(m, 5)]),
    rise1090Px: round(e.rise1090Px, 4),
    overshoot: round(e.overshoot),
    psf: {
      model: e.psf.model,
      ...(e.psf.model === 'gaussian'
        ? { sigmaPx: round(e.psf.sigmaPx ?? null, 4) }
        : { radiusPx: round(e.psf.radiusPx ?? null, 4) }),
      rmsResidual: round(e.psf.rmsResidual),
    },
    warnings: [...e.warnings],
  }
}

/** The JSON line of one file (no trailing newline). */
export function jsonLine(file: string, a: FrameAnalysis): string {
  return JSON.stringify({
    file,
    width: a.width,
    height: a.height,
    edges: a.edges.map(edgeRecord),
    focus: {
      laplacianVariance: a.focus.laplacianVariance,
      tenengrad: a.focus.tenengrad,
      brenner: a.focus.brenner,
    },
  })
}

const fmt = (v: number | null, digits: number) => (v === null ? '—' : v.toFixed(digits))

const plural = (n: number, word: string) => `${n} ${word}${n === 1 ? '' : 's'}`
const roiText = (r: Roi) => `${r.x},${r.y},${r.w},${r.h}`

/** The found regions the measurement turned down, each with its reason (empty when none). */
function rejectedLines(rejected: RejectedRegion[]): string[] {
  if (rejected.length === 0) return []
  const width = Math.max(...rejected.map((r) => roiText(r.roi).length))
  return [
    `  not measured: ${plural(rejected.length, 'found region')} turned down`,
    ...rejected.map((r) => `    ${roiText(r.roi).padEnd(width)}  ${r.reason}`),
  ]
}

/**
 * A readable summary of one file: header line, one table row per edge, warnings spelled out,
 * then the found regions that were not measured and why.
 */
export function tableText(file: string, a: FrameAnalysis): string {
  const turnedDown = a.rejected.length ? `, ${a.rejected.length} turned down` : ''
  const lines = [
    `${file}: ${a.width} × ${a.height} px, ${plural(a.edges.length, 'edge')}${turnedDown}`,
    `  focus: Laplacian variance ${a.focus.laplacianVariance.toPrecision(4)}, Tenengrad ${a.focus.tenengrad.toPrecision(4)}, Brenner ${a.focus.brenner.toPrecision(4)}`,
  ]
  if (a.edges.length === 0) {
    lines.push('  no usable slanted edge found (give regions with --roi x,y,w,h)')
    lines.push(...rejectedLines(a.rejected))
    return lines.join('\n')
  }
  const header = [
    '#',
    'region x,y,w,h',
    'orient.',
    'angle°',
    'MTF50',
    'MTF50P',
    'MTF10',
    'MTF@Nyq',
    'rise px',
    'oversh.',
    'kernel',
  ]
  const rows = a.edges.map((e, i) => [
    String(i + 1),
    roiText(e.roi),
    e.orientation,
    e.angleDeg.toFixed(2),
    fmt(e.mtf50, 4),
    fmt(e.mtf50p, 4),
    fmt(e.mtf10, 4),
    e.mtfNyquist.toFixed(3),
    e.rise1090Px.toFixed(2),
    `${(100 * e.overshoot).toFixed(1)} %`,
    e.psf.model === 'gaussian'
      ? `Gaussian σ ${fmt(e.psf.sigmaPx ?? null, 2)}`
      : `disk R ${fmt(e.psf.radiusPx ?? null, 2)}`,
  ])
  const widths = header.map((h, c) => Math.max(h.length, ...rows.map((r) => r[c].length)))
  const line = (cells: string[]) =>
    '  ' +
    cells
      .map((c, i) => c.padEnd(widths[i]))
      .join('  ')
      .trimEnd()
  lines.push(line(header))
  for (const r of rows) lines.push(line(r))
  a.edges.forEach((e, i) => {
    for (const w of e.warnings) lines.push(`  #${i + 1} ${w}: ${EDGE_WARNING_MESSAGES[w]}`)
  })
  lines.push('  (frequencies in cycles/pixel along the edge normal; Nyquist = 0.5)')
  lines.push(...rejectedLines(a.rejected))
  return lines.join('\n')
}
