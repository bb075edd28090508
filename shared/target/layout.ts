import { TARGET_DARK, TARGET_INK, TARGET_LIGHT } from './colours'
import type { FontWeight } from './fontMetrics'
import type { PointMm, RectMm, Srgb8, TargetText } from './geometry'
import { encodeTargetPayload } from './payload'
import { scaleBarLayout, type ScaleBar } from './scaleBar'
import type { Sheet } from './sheets'
import { gridSquareSideMm, SQUARE_ROTATION_DEG, squareGrid, type TargetSquare } from './squares'

// Sharpfield's target sheet, portrait: a light square panel with a 2 × 2 grid of tilted dark
// squares on top, a footer with the title, id, printed size, a millimetre scale bar and the QR
// code, and L-shaped corner marks at the four sheet corners. Every length scales with the sheet
// width, so one design serves A4 to A0 and custom prints, and the square side follows from the
// printed width alone.

/** Outer margin, as a fraction of the sheet width (12.6 mm on A4). */
const MARGIN_RATIO = 0.06
/** Corner marks: inset, arm length and stroke, as fractions of the sheet width. */
const FIDUCIAL = { inset: 0.035, arm: 0.05, stroke: 0.006 } as const
const FOOTER_GAP_RATIO = 0.03
const QR_RATIO = 0.25
const COLUMN_GAP_RATIO = 0.04

export interface TargetLayout {
  sheet: Sheet
  targetId: string
  /** Text encoded in the QR code. */
  payload: string
  marginMm: number
  squareSideMm: number
  rotationDeg: number
  /** Light grey area behind the squares. */
  panel: RectMm
  squares: TargetSquare[]
  /** Closed polygons (L shapes), one per sheet corner. */
  fiducials: PointMm[][]
  scaleBar: ScaleBar
  /** Box for the QR code including its 4-module quiet zone. */
  qrBox: RectMm
  /** Text column of the footer (the texts and the scale bar stay inside it). */
  footerColumn: RectMm
  texts: TargetText[]
  colours: { dark: Srgb8; light: Srgb8; ink: Srgb8 }
}

function fiducials(sheet: Sheet): PointMm[][] {
  const W = sheet.widthMm
  const f = FIDUCIAL.inset * W
  const a = FIDUCIAL.arm * W
  const t = FIDUCIAL.stroke * W
  // Top-left L; the others are mirror images.
  const base: [number, number][] = [
    [0, 0],
    [a, 0],
    [a, t],
    [t, t],
    [t, a],
    [0, a],
  ]
  const corners: [number, number, number, number][] = [
    [f, f, 1, 1],
    [W - f, f, -1, 1],
    [W - f, sheet.heightMm - f, -1, -1],
    [f, sheet.heightMm - f, 1, -1],
  ]
  return corners.map(([ox, oy, sx, sy]) =>
    base.map(([x, y]) => ({ x: ox + sx * x, y: oy + sy * y })),
  )
}

function formatMm(mm: number): string {
  return String(Math.round(mm * 10) / 10)
}

export function targetLayout(sheet: Sheet, targetId: string): TargetLayout {
  const W = sheet.widthMm
  const H = sheet.heightMm
  const payload = encodeTargetPayload({ id: targetId, widthMm: W, heightMm: H })
  const u = W / 210 // type and spacing unit: 1 on A4
  const margin = MARGIN_RATIO * W
  const panel: RectMm = { x: margin, y: margin, w: W - 2 * margin, h: W - 2 * margin }
  const squares = squareGrid(panel)
  const side = squares[0].sideMm

  const footerTop = panel.y + panel.h + FOOTER_GAP_RATIO * W
  const footerBottom = H - margin
  const footerHeight = footerBottom - footerTop
  const qrSize = Math.min(footerHeight, QR_RATIO * W)
  if (footerHeight < 0.2 * W) {
    throw new RangeError(
      `A ${formatMm(W)} × ${formatMm(H)} mm sheet is too short for the target: its height must be at least 1.23 times its width.`,
    )
  }
  const qrBox: RectMm = { x: W - margin - qrSize, y: footerTop, w: qrSize, h: qrSize }
  const footerColumn: RectMm = {
    x: margin,
    y: footerTop,
    w: qrBox.x - COLUMN_GAP_RATIO * W - margin,
    h: qrSize, // the scale bar lines up with the bottom of the QR code
  }

  const sizeName = sheet.custom ? 'custom' : sheet.name
  const line = (
    text: string,
    y: number,
    sizeMm: number,
    weight: FontWeight = 'regular',
  ): TargetText => ({
    text,
    x: footerColumn.x,
    y: footerTop + y * u,
    sizeMm: sizeMm * u,
    weight,
    align: 'start',
  })
  const texts: TargetText[] = [
    line('Sharpfield focus target', 4.5, 5.5, 'bold'),
    line(`Target ${targetId}`, 11.5, 4.4, 'bold'),
    line(`Printed size ${formatMm(W)} × ${formatMm(H)} mm (${sizeName}) — print at 100 %`, 18, 3),
    line(
      `Squares ${formatMm(side)} mm, tilted ${SQUARE_ROTATION_DEG.toFixed(1)}° · contrast about 4:1`,
      23,
      3,
    ),
    line('Matte paper, mounted flat. Check the scale bar with a ruler.', 28, 3),
  ]
  const scaleBar = scaleBarLayout(footerColumn, u)
  texts.push(...scaleBar.labels)

  return {
    sheet,
    targetId,
    payload,
    marginMm: margin,
    squareSideMm: side,
    rotationDeg: SQUARE_ROTATION_DEG,
    panel,
    squares,
    fiducials: fiducials(sheet),
    scaleBar,
    qrBox,
    footerColumn,
    texts,
    colours: { dark: TARGET_DARK, light: TARGET_LIGHT, ink: TARGET_INK },
  }
}

/** Side of the printed squares for a sheet width, without building the whole layout. */
export function squareSideForWidthMm(widthMm: number): number {
  return gridSquareSideMm(widthMm * (1 - 2 * MARGIN_RATIO))
}
