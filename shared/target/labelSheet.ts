// Camera labels on office paper (A4 or US Letter): a grid of 64 × 86 mm labels, each with the QR
// code of the camera's label text, its asset tag in large type, the site, the location and a
// line saying what the code is for. Printed at 100 % and cut along the grey lines, or printed on
// full-sheet adhesive paper. Every length is in millimetres from the page's top-left corner.
import { encodeCameraLabel } from './cameraLabel'
import { TARGET_INK } from './colours'
import { wrapText } from './fontMetrics'
import type { RectMm, Srgb8, TargetText } from './geometry'
import { CAP_HEIGHT_EM, fitAssetTag, fitLine, printableText, tagLineStepMm } from './labelText'
import { QR_QUIET_ZONE_MODULES } from './qrModules'
import { qrSymbolModules, qrVersionForBytesM, utf8Length } from './qrCapacity'
import { standardSheet, type Sheet } from './sheets'

export type LabelPaper = 'A4' | 'Letter'
export const LABEL_PAPERS: readonly LabelPaper[] = ['A4', 'Letter']

export const LABEL_WIDTH_MM = 64
export const LABEL_HEIGHT_MM = 86
/**
 * Paper edge kept clear. Common practice: desktop printers leave roughly the outer 3–6.35 mm
 * (¼ in) unprinted, so nothing is placed closer than this.
 */
export const MIN_PAGE_MARGIN_MM = 8
/** One PDF holds at most this many labels (56 pages): enough for a site, quick to make on a phone. */
export const MAX_LABELS_PER_PDF = 500
/** QR code box, quiet zone included (4 modules of white each side). */
export const LABEL_QR_BOX_MM = 58

/**
 * Reading distance. Common practice (rules of thumb, not a standard): a phone decoder wants about
 * 2 or more camera pixels per module, and a phone's main camera sees about 70° across. The app
 * reads the frame at up to 960 px across (its QR fallback scales the video down to that), so at
 * 0.5 m it gets 960 / (2 · 500 mm · tan 35°) ≈ 1.37 px per mm; a 1.5 mm module is then ≈ 2 px.
 * Typical asset tags (up to 17 characters) make a version 3 symbol (29 modules, 37 with the
 * quiet zone), so the 58 mm box gives 1.57 mm modules: readable from about half a metre. The
 * longest tags (64 characters, version 6) still get 1.18 mm modules, readable from about 0.4 m,
 * well above the 0.5 mm module often quoted as the least for printed codes read up close.
 */
export const TYPICAL_TAG_MAX_CHARS = 17

/** Camera pixels across one module of a code `distanceM` away (pinhole camera, code facing it). */
export function pxPerModuleAt(
  moduleMm: number,
  distanceM: number,
  { hfovDeg = 70, framePx = 960 }: { hfovDeg?: number; framePx?: number } = {},
): number {
  if (!(moduleMm > 0 && distanceM > 0 && hfovDeg > 0 && hfovDeg < 180 && framePx > 0)) {
    throw new RangeError('Module size, distance, field of view and frame width must be positive.')
  }
  const fieldWidthMm = 2 * distanceM * 1000 * Math.tan((hfovDeg * Math.PI) / 360)
  return (moduleMm * framePx) / fieldWidthMm
}

/** Smallest module the label can get for this text (an encoder mixing modes only does better). */
export function labelModuleMm(payload: string): number {
  const modules = qrSymbolModules(qrVersionForBytesM(utf8Length(payload)))
  return LABEL_QR_BOX_MM / (modules + 2 * QR_QUIET_ZONE_MODULES)
}

const PAD_MM = 3
const TEXT_WIDTH_MM = LABEL_WIDTH_MM - 2 * PAD_MM
const QR_TOP_MM = 1.5
const TAG_TOP_MM = QR_TOP_MM + LABEL_QR_BOX_MM + 1
const TAG_BAND_MM = 7
const TAG_MAX_MM = 7 // ≈ 20 pt
const SITE_MM = 3.2 // ≈ 9 pt
const LOCATION_MM = 3
const NOTE_MM = 2.3 // ≈ 6.5 pt
const NOTE_LINES = 2
const HEADER_MM = 2.6
/** The header's baseline sits this far above the first row of labels. */
const HEADER_GAP_MM = 3.5
/** The first row starts at least this far down, so the header clears the printer's margin. */
const MIN_GRID_TOP_MM = 12.5

/** What the label tells whoever finds it (our own words; two lines at most). */
export const LABEL_NOTE =
  'Focus checks: in Sharpfield, tap Scan label and aim at this code. Please leave in place.'
export const LABEL_CUT_LINE: Srgb8 = { r: 170, g: 170, b: 170 }

export interface LabelCamera {
  assetTag: string
  siteName: string
  locationText: string
}

export interface PlacedLabel {
  assetTag: string
  /** Text of the QR code. */
  payload: string
  /** The label, edge to edge (the cut line). */
  cell: RectMm
  /** The QR code's box, quiet zone included. */
  qrBox: RectMm
  texts: TargetText[]
}

export interface LabelGrid {
  paper: Sheet
  columns: number
  rows: number
  perPage: number
  /** The label cells of one page, row by row. */
  cells: RectMm[]
}

export interface LabelPage {
  labels: PlacedLabel[]
  header: TargetText
}

export interface LabelSheetLayout {
  grid: LabelGrid
  pages: LabelPage[]
  colours: { ink: Srgb8; cutLine: Srgb8 }
}

export function labelGrid(paperName: LabelPaper): LabelGrid {
  const paper = standardSheet(paperName)
  const columns = Math.floor((paper.widthMm - 2 * MIN_PAGE_MARGIN_MM) / LABEL_WIDTH_MM)
  const rows = Math.floor((paper.heightMm - 2 * MIN_PAGE_MARGIN_MM) / LABEL_HEIGHT_MM)
  const x0 = (paper.widthMm - columns * LABEL_WIDTH_MM) / 2
  const y0 = Math.max((paper.heightMm - rows * LABEL_HEIGHT_MM) / 2, MIN_GRID_TOP_MM)
  const cells: RectMm[] = []
  for (let r = 0; r < rows; r++) {
    for (let c = 0; c < columns; c++) {
      cells.push({
        x: x0 + c * LABEL_WIDTH_MM,
        y: y0 + r * LABEL_HEIGHT_MM,
        w: LABEL_WIDTH_MM,
        h: LABEL_HEIGHT_MM,
      })
    }
  }
  return { paper, columns, rows, perPage: columns * rows, cells }
}

const text = (t: string, x: number, y: number, sizeMm: number, bold = false): TargetText => ({
  text: t,
  x,
  y,
  sizeMm,
  weight: bold ? 'bold' : 'regular',
  align: 'start',
})

/** One camera's label in `cell`. Throws RangeError for an asset tag a label cannot carry. */
export function cameraLabelLayout(camera: LabelCamera, cell: RectMm): PlacedLabel {
  const payload = encodeCameraLabel({ assetTag: camera.assetTag })
  const qrBox = {
    x: cell.x + (LABEL_WIDTH_MM - LABEL_QR_BOX_MM) / 2,
    y: cell.y + QR_TOP_MM,
    w: LABEL_QR_BOX_MM,
    h: LABEL_QR_BOX_MM,
  }
  const left = cell.x + PAD_MM
  const tag = fitAssetTag(camera.assetTag, {
    maxWidthMm: TEXT_WIDTH_MM,
    bandHeightMm: TAG_BAND_MM,
    maxSizeMm: TAG_MAX_MM,
  })
  const step = tagLineStepMm(tag.sizeMm)
  const blockMm = CAP_HEIGHT_EM * tag.sizeMm + (tag.lines.length - 1) * step
  const firstBaseline =
    cell.y + TAG_TOP_MM + (TAG_BAND_MM - blockMm) / 2 + CAP_HEIGHT_EM * tag.sizeMm
  const texts = tag.lines.map((line, i) =>
    text(line, left, firstBaseline + i * step, tag.sizeMm, true),
  )
  let y = cell.y + TAG_TOP_MM + TAG_BAND_MM + 1.6 + CAP_HEIGHT_EM * SITE_MM
  const site = fitLine(printableText(camera.siteName), SITE_MM, TEXT_WIDTH_MM, 'bold')
  if (site) texts.push(text(site, left, y, SITE_MM, true))
  y += LOCATION_MM * 1.25
  const location = fitLine(printableText(camera.locationText), LOCATION_MM, TEXT_WIDTH_MM)
  if (location) texts.push(text(location, left, y, LOCATION_MM))
  y += 1 + NOTE_MM * 1.25
  const note = wrapText(LABEL_NOTE, NOTE_MM, TEXT_WIDTH_MM).slice(0, NOTE_LINES)
  note.forEach((line, i) => texts.push(text(line, left, y + i * NOTE_MM * 1.25, NOTE_MM)))
  return { assetTag: camera.assetTag, payload, cell, qrBox, texts }
}

/** Labels for `cameras`, in order, page after page. */
export function labelSheetLayout(
  cameras: readonly LabelCamera[],
  paperName: LabelPaper,
): LabelSheetLayout {
  if (cameras.length === 0) throw new RangeError('Choose at least one camera to print labels for.')
  if (cameras.length > MAX_LABELS_PER_PDF) {
    throw new RangeError(
      `One PDF holds at most ${MAX_LABELS_PER_PDF} labels; ${cameras.length} were asked for. Narrow the list first.`,
    )
  }
  const grid = labelGrid(paperName)
  const pageCount = Math.ceil(cameras.length / grid.perPage)
  const pages: LabelPage[] = []
  for (let p = 0; p < pageCount; p++) {
    const chunk = cameras.slice(p * grid.perPage, (p + 1) * grid.perPage)
    const first = grid.cells[0]
    pages.push({
      labels: chunk.map((camera, i) => cameraLabelLayout(camera, grid.cells[i])),
      header: text(
        `Sharpfield camera labels · page ${p + 1} of ${pageCount} · print at 100 % (actual size), then cut along the grey lines`,
        first.x,
        first.y - HEADER_GAP_MM,
        HEADER_MM,
      ),
    })
  }
  return { grid, pages, colours: { ink: TARGET_INK, cutLine: LABEL_CUT_LINE } }
}
