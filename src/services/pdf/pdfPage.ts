import type { FontWeight } from '@shared/target/fontMetrics'
import { textWidth } from '@shared/target/fontMetrics'
import type { PointMm, RectMm, Srgb8, TargetText } from '@shared/target/geometry'
import { pdfNumber as n, pdfString, PT_PER_MM } from './format'

export const FONT_RESOURCE: Record<FontWeight, string> = { regular: 'F1', bold: 'F2' }

/**
 * One page drawn in millimetres with the origin top-left and y down, like the layout and SVG.
 * The content stream starts with a transform mm → pt that flips y, so every coordinate written
 * is the layout's own millimetre value.
 */
export class PdfPage {
  readonly widthMm: number
  readonly heightMm: number
  private readonly ops: string[] = []

  constructor(widthMm: number, heightMm: number) {
    if (!(widthMm > 0 && heightMm > 0 && Number.isFinite(widthMm) && Number.isFinite(heightMm))) {
      throw new RangeError('A page needs a positive, finite width and height in millimetres.')
    }
    this.widthMm = widthMm
    this.heightMm = heightMm
  }

  get widthPt(): number {
    return this.widthMm * PT_PER_MM
  }

  get heightPt(): number {
    return this.heightMm * PT_PER_MM
  }

  fill(c: Srgb8): this {
    this.ops.push(`${n(c.r / 255)} ${n(c.g / 255)} ${n(c.b / 255)} rg`)
    return this
  }

  stroke(c: Srgb8, widthMm: number): this {
    this.ops.push(`${n(c.r / 255)} ${n(c.g / 255)} ${n(c.b / 255)} RG ${n(widthMm)} w`)
    return this
  }

  rect(r: RectMm): this {
    this.ops.push(`${n(r.x)} ${n(r.y)} ${n(r.w)} ${n(r.h)} re f`)
    return this
  }

  /** Several rectangles filled as one path (QR modules, scale-bar segments). */
  rects(rs: readonly RectMm[]): this {
    if (rs.length === 0) return this
    this.ops.push(rs.map((r) => `${n(r.x)} ${n(r.y)} ${n(r.w)} ${n(r.h)} re`).join('\n') + '\nf')
    return this
  }

  strokeRect(r: RectMm): this {
    this.ops.push(`${n(r.x)} ${n(r.y)} ${n(r.w)} ${n(r.h)} re S`)
    return this
  }

  polygon(points: readonly PointMm[]): this {
    if (points.length < 3) throw new RangeError('A polygon needs at least three points.')
    const [first, ...rest] = points
    const path = [`${n(first.x)} ${n(first.y)} m`, ...rest.map((p) => `${n(p.x)} ${n(p.y)} l`)]
    this.ops.push(`${path.join(' ')} h f`)
    return this
  }

  text(t: TargetText): this {
    const width = textWidth(t.text, t.sizeMm, t.weight)
    const x = t.align === 'end' ? t.x - width : t.align === 'middle' ? t.x - width / 2 : t.x
    // The text matrix flips y back so glyphs stand upright under the page's flipped transform.
    this.ops.push(
      `BT /${FONT_RESOURCE[t.weight]} ${n(t.sizeMm)} Tf 1 0 0 -1 ${n(x)} ${n(t.y)} Tm ${pdfString(t.text)} Tj ET`,
    )
    return this
  }

  /** The page's content stream (7-bit ASCII). */
  content(): string {
    // 8 decimals: the scale stays exact to 1 part in 10⁹, far below a printer's tolerance.
    const toPt = PT_PER_MM.toFixed(8)
    return (
      [`q ${toPt} 0 0 -${toPt} 0 ${this.heightPt.toFixed(6)} cm`, ...this.ops, 'Q'].join('\n') +
      '\n'
    )
  }
}
