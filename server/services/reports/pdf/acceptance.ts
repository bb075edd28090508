// The acceptance record of one check: what was checked, by whom and when, the result with its
// reasons and numbers, the MTF curves, and lines to sign.
import type { CheckDetail } from '../../../../shared/schemas/fleet'
import {
  contentWidth,
  ensureSpace,
  fieldGrid,
  fixed,
  footers,
  newPdf,
  sectionHeading,
  signatureBlock,
  siteTime,
  table,
  titleBand,
  toBuffer,
  INK,
  MUTED,
  VERDICT_COLOUR,
} from './layout'
import { drawMtfChart } from './mtfChart'

const VERDICT_WORD = { pass: 'PASS', marginal: 'MARGINAL', fail: 'FAIL' } as const

export async function acceptancePdf(c: CheckDetail, generatedAt: Date): Promise<Buffer> {
  const doc = newPdf(`Camera acceptance record ${c.camera.assetTag}`, `Check ${c.id}`)
  const captured = new Date(c.capturedAt)
  titleBand(
    doc,
    'Camera acceptance record',
    `Sharpness check by the slanted-edge method (ISO 12233) · camera ${c.camera.assetTag}`,
  )

  // Verdict box.
  const x0 = doc.page.margins.left
  const w = contentWidth(doc)
  const colour = VERDICT_COLOUR[c.verdict]
  const boxTop = doc.y
  doc
    .font('Helvetica-Bold')
    .fontSize(20)
    .fillColor(colour)
    .text(VERDICT_WORD[c.verdict], x0 + 12, boxTop + 10)
  doc.font('Helvetica').fontSize(10).fillColor(INK)
  const reasons = c.reasons.length
    ? c.reasons.map((r) => `• ${r.text}`)
    : ['• No reasons were recorded.']
  for (const line of reasons) doc.text(line, x0 + 12, doc.y + 2, { width: w - 24 })
  const boxBottom = doc.y + 10
  doc
    .lineWidth(1.5)
    .strokeColor(colour)
    .rect(x0, boxTop, w, boxBottom - boxTop)
    .stroke()
  doc.y = boxBottom + 8
  doc.strokeColor(INK).lineWidth(1)

  sectionHeading(doc, 'Camera and visit')
  fieldGrid(doc, [
    ['Asset tag', c.camera.assetTag],
    ['Site', c.camera.siteName],
    ['Location', c.camera.locationText],
    ['Camera model', c.camera.cameraModelName],
    ['Task', c.camera.taskName],
    ['Mode', c.mode === 'night' ? 'Night (infrared)' : 'Day'],
    ['Checked at', siteTime(captured, c.camera.siteTimeZone)],
    ['Checked at (UTC)', captured.toISOString().replace('T', ' ').slice(0, 16)],
    ['Inspector', c.inspector.name],
    ['Target', c.targetId ?? 'Not recorded'],
    ['Check id', c.id],
    ['Baseline check', c.isBaseline ? 'Yes: this check is the camera baseline' : 'No'],
  ])

  sectionHeading(doc, 'Results')
  const pdOk =
    c.pixelDensityPxPerM === null
      ? ''
      : c.pixelDensityPxPerM >= c.camera.requiredPxPerM
        ? ' (meets)'
        : ' (below)'
  fieldGrid(doc, [
    [
      'Median MTF50 (cycles/pixel)',
      `${fixed(c.medianMtf50CyPx, 3)} (minimum ${fixed(c.camera.minMtf50CyPx, 3)})`,
    ],
    [
      'Compared with baseline',
      c.baselineRatio === null
        ? 'No baseline'
        : `${(c.baselineRatio * 100).toFixed(0)} % of baseline MTF50`,
    ],
    [
      'Pixel density (px/m)',
      `${fixed(c.pixelDensityPxPerM, 0)} of ${fixed(c.camera.requiredPxPerM, 0)} required${pdOk}`,
    ],
    ['Edges measured', String(c.measurements.length)],
  ])

  sectionHeading(doc, 'MTF of the measured edges')
  const chartH = 230
  ensureSpace(doc, chartH + 30)
  const chartTop = doc.y
  const chartEnd = drawMtfChart(
    doc,
    c.measurements.map((m, i) => ({
      label: `Edge ${i + 1} (${m.orientation}, MTF50 ${m.mtf50CyPx.toFixed(3)})`,
      points: m.mtfCurve,
    })),
    { x: x0, y: chartTop, width: w, height: chartH, minMtf50CyPx: c.camera.minMtf50CyPx },
  )
  doc.x = x0
  doc.y = chartEnd + 6
  if (c.measurements.every((m) => m.mtfCurve.length < 2)) {
    doc.fontSize(9).fillColor(MUTED).text('No MTF curves were recorded with this check.', x0)
    doc.fillColor(INK)
  }

  if (c.measurements.length) {
    sectionHeading(doc, 'Edges')
    table(
      doc,
      [
        { header: '#', width: 0.04 },
        { header: 'Edge', width: 0.11 },
        { header: 'Angle (°)', width: 0.09, align: 'right' },
        { header: 'MTF50', width: 0.09, align: 'right' },
        { header: 'MTF50P', width: 0.09, align: 'right' },
        { header: 'MTF10', width: 0.09, align: 'right' },
        { header: 'MTF at Nyquist', width: 0.11, align: 'right' },
        { header: 'Rise 10-90 % (px)', width: 0.13, align: 'right' },
        { header: 'Blur kernel', width: 0.25 },
      ],
      c.measurements.map((m, i) => [
        String(i + 1),
        m.orientation,
        m.angleDeg.toFixed(1),
        m.mtf50CyPx.toFixed(3),
        fixed(m.mtf50pCyPx, 3),
        fixed(m.mtf10CyPx, 3),
        fixed(m.mtfNyquist, 3),
        fixed(m.rise1090Px, 2),
        m.psf
          ? m.psf.model === 'gaussian'
            ? `Gaussian sigma ${fixed(m.psf.sigmaPx, 2)} px`
            : `Disk R ${fixed(m.psf.radiusPx, 2)} px`
          : '—',
      ]),
    )
    doc
      .moveDown(0.3)
      .fontSize(8)
      .fillColor(MUTED)
      .text(
        'MTF50, MTF50P and MTF10 in cycles/pixel along the edge normal; MTF at Nyquist at 0.5 cycles/pixel.',
        x0,
      )
    doc.fillColor(INK)
  }

  if (c.notes) {
    sectionHeading(doc, 'Notes')
    doc.fontSize(10).text(c.notes, x0, doc.y, { width: w })
  }

  signatureBlock(doc, ['inspector', 'accepted for the owner'])
  footers(
    doc,
    `Sharpfield acceptance record · check ${c.id} · generated ${generatedAt.toISOString().slice(0, 16).replace('T', ' ')} UTC`,
  )
  return toBuffer(doc)
}
