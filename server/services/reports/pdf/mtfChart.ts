// The MTF chart of a check drawn as vector paths: modulation against spatial frequency
// (cycles/pixel, 0 to Nyquist), one line per measured edge, the 50 % level and the task's
// minimum MTF50 as reference lines.
import type { MtfPoint } from '../../../../shared/schemas/checks'
import { INK, MUTED, RULE } from './layout'
import type { Pdf } from './layout'

export interface ChartCurve {
  label: string
  points: MtfPoint[]
}

// Distinct line colours and dash patterns so curves stay apart in grey print too.
const STYLES: { colour: string; dash: number[] | null }[] = [
  { colour: '#0f3d3e', dash: null },
  { colour: '#c06a00', dash: [5, 2] },
  { colour: '#3f5fa8', dash: [1.5, 1.5] },
  { colour: '#7a3b69', dash: [6, 2, 1.5, 2] },
  { colour: '#4d7d2a', dash: [3, 3] },
  { colour: '#5c6b6a', dash: [8, 3] },
]

const F_MAX = 0.5 // Nyquist, cycles/pixel
const M_MAX = 1.1

export function drawMtfChart(
  doc: Pdf,
  curves: ChartCurve[],
  opts: { x: number; y: number; width: number; height: number; minMtf50CyPx: number | null },
): number {
  const left = opts.x + 34
  const top = opts.y + 6
  const w = opts.width - 44
  const h = opts.height - 40
  const px = (f: number) => left + (Math.min(Math.max(f, 0), F_MAX) / F_MAX) * w
  const py = (m: number) => top + h - (Math.min(Math.max(m, 0), M_MAX) / M_MAX) * h

  doc.save()
  // Grid and axis labels.
  doc.lineWidth(0.4).strokeColor(RULE)
  doc.font('Helvetica').fontSize(7).fillColor(MUTED)
  for (let f = 0; f <= F_MAX + 1e-9; f += 0.1) {
    doc
      .moveTo(px(f), top)
      .lineTo(px(f), top + h)
      .stroke()
    doc.text(f.toFixed(1), px(f) - 10, top + h + 3, {
      width: 20,
      align: 'center',
      lineBreak: false,
    })
  }
  for (let m = 0; m <= 1 + 1e-9; m += 0.2) {
    doc
      .moveTo(left, py(m))
      .lineTo(left + w, py(m))
      .stroke()
    doc.text(m.toFixed(1), left - 26, py(m) - 3, { width: 22, align: 'right', lineBreak: false })
  }
  doc.lineWidth(0.8).strokeColor(INK).rect(left, top, w, h).stroke()
  doc.fontSize(8).fillColor(INK)
  doc.text('Spatial frequency (cycles/pixel)', left, top + h + 14, {
    width: w,
    align: 'center',
    lineBreak: false,
  })
  doc.save()
  doc.rotate(-90, { origin: [opts.x + 6, top + h / 2] })
  doc.text('Modulation (MTF)', opts.x + 6 - 40, top + h / 2 - 4, {
    width: 80,
    align: 'center',
    lineBreak: false,
  })
  doc.restore()

  // Reference lines: 50 % modulation and the minimum MTF50 the task asks for.
  doc.lineWidth(0.7).strokeColor(MUTED).dash(2, { space: 2 })
  doc
    .moveTo(left, py(0.5))
    .lineTo(left + w, py(0.5))
    .stroke()
  if (opts.minMtf50CyPx !== null && opts.minMtf50CyPx <= F_MAX) {
    doc.strokeColor('#b42318')
    doc
      .moveTo(px(opts.minMtf50CyPx), top)
      .lineTo(px(opts.minMtf50CyPx), top + h)
      .stroke()
    doc.undash().fontSize(7).fillColor('#b42318')
    doc.text(`minimum MTF50 ${opts.minMtf50CyPx.toFixed(3)}`, px(opts.minMtf50CyPx) + 3, top + 3, {
      lineBreak: false,
    })
  }
  doc.undash()

  // Curves, clipped to the plot area.
  doc.save()
  doc.rect(left, top, w, h).clip()
  curves.forEach((c, i) => {
    const pts = c.points.filter(([f]) => f <= F_MAX + 1e-9)
    if (pts.length < 2) return
    const s = STYLES[i % STYLES.length]
    doc.lineWidth(1.3).strokeColor(s.colour)
    if (s.dash) doc.dash(s.dash[0], { space: s.dash[1] })
    doc.moveTo(px(pts[0][0]), py(pts[0][1]))
    for (const [f, m] of pts.slice(1)) doc.lineTo(px(f), py(m))
    doc.stroke()
    doc.undash()
  })
  doc.restore()

  // Legend under the chart, wrapping onto more lines when needed.
  let lx = left
  let ly = top + h + 28
  doc.fontSize(7.5)
  curves.forEach((c, i) => {
    const s = STYLES[i % STYLES.length]
    const labelW = doc.widthOfString(c.label) + 30
    if (lx + labelW > left + w && lx > left) {
      lx = left
      ly += 11
    }
    doc.lineWidth(1.3).strokeColor(s.colour)
    if (s.dash) doc.dash(s.dash[0], { space: s.dash[1] })
    doc
      .moveTo(lx, ly + 3)
      .lineTo(lx + 18, ly + 3)
      .stroke()
    doc.undash()
    doc.fillColor(INK).text(c.label, lx + 22, ly, { lineBreak: false })
    lx += labelW
  })
  doc.restore()
  doc.fillColor(INK).strokeColor(INK).lineWidth(1)
  return ly + 12
}
