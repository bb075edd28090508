// Fitting the words of a camera label into its fixed box: names and locations come from the
// inventory and can be any length or alphabet, and nothing may run past the cut line.
import { textWidth, winAnsiCode, type FontWeight } from './fontMetrics'

/**
 * Helvetica's cap height and descender as fractions of the font size (CapHeight 718,
 * Descender −207 in Helvetica.afm and Helvetica-Bold.afm).
 */
export const CAP_HEIGHT_EM = 0.718
export const DESCENDER_EM = 0.207
/** Baseline-to-baseline distance of the asset tag when it needs more than one line, in em. */
const TAG_LINE_EM = 1.1
const ELLIPSIS = '…'
/** Characters after which an asset tag reads well when broken over lines. */
const TAG_BREAK_AFTER = new Set(['-', '/', '.', '_'])

function covered(ch: string): boolean {
  try {
    winAnsiCode(ch)
    return true
  } catch {
    return false
  }
}

/**
 * Text the standard fonts can print: runs of white space become one space, accents the fonts
 * lack are dropped (é → e), and any other character they cannot show becomes "?".
 */
export function printableText(text: string): string {
  let out = ''
  for (const ch of text.replace(/\s+/g, ' ').trim()) {
    if (covered(ch)) {
      out += ch
      continue
    }
    const plain = ch.normalize('NFD').replace(/[\u0300-\u036f]/g, '')
    out += plain && [...plain].every(covered) ? plain : '?'
  }
  return out
}

/** `text` on one line no wider than `maxWidthMm`, cut at the end with "…" when it is too long. */
export function fitLine(
  text: string,
  sizeMm: number,
  maxWidthMm: number,
  weight: FontWeight = 'regular',
): string {
  if (textWidth(text, sizeMm, weight) <= maxWidthMm) return text
  const chars = [...text]
  for (let keep = chars.length - 1; keep > 0; keep--) {
    const candidate = chars.slice(0, keep).join('').trimEnd() + ELLIPSIS
    if (textWidth(candidate, sizeMm, weight) <= maxWidthMm) return candidate
  }
  return textWidth(ELLIPSIS, sizeMm, weight) <= maxWidthMm ? ELLIPSIS : ''
}

/** Every way to cut `chars` into `parts` non-empty runs, as the indexes where runs start. */
function cutPoints(length: number, parts: number): number[][] {
  if (parts === 1) return [[]]
  const out: number[][] = []
  const walk = (from: number, left: number, acc: number[]) => {
    if (left === 0) {
      out.push(acc)
      return
    }
    for (let i = from; i <= length - left; i++) walk(i + 1, left - 1, [...acc, i])
  }
  walk(1, parts - 1, [])
  return out
}

export interface FittedTag {
  /** Font size in millimetres (bold). */
  sizeMm: number
  lines: string[]
}

/**
 * The split of `text` into `parts` lines that gives the biggest type, up to `capSizeMm`, where a
 * break inside a word counts as 15 % smaller type: "NORTHGATE-" over "LOADING-DOCK-07" beats
 * "NORTHGATE-LO" over "ADING-DOCK-07" unless the latter gives much bigger type.
 */
function bestSplit(text: string, parts: number, capSizeMm: number, maxWidthMm: number): FittedTag {
  const chars = [...text]
  let best: FittedTag = { sizeMm: 0, lines: [text] }
  let bestScore = -Infinity
  for (const cuts of cutPoints(chars.length, parts)) {
    const bounds = [0, ...cuts, chars.length]
    const lines = bounds.slice(1).map((end, i) => chars.slice(bounds[i], end).join(''))
    const widest = Math.max(...lines.map((line) => textWidth(line, 1, 'bold')))
    const sizeMm = Math.min(capSizeMm, maxWidthMm / widest)
    const awkward = cuts.filter((c) => !TAG_BREAK_AFTER.has(chars[c - 1])).length
    const score = sizeMm * (1 - 0.15 * awkward)
    if (score > bestScore + 1e-12) {
      bestScore = score
      best = { sizeMm, lines }
    }
  }
  return best
}

/**
 * The asset tag as large as it fits: one line where it can, otherwise two or three lines,
 * whichever gives the bigger type. Never shortened: the tag is what a person reads when the
 * code cannot be scanned. `bandHeightMm` runs from the cap line of the first line to the
 * baseline of the last.
 */
export function fitAssetTag(
  tag: string,
  box: { maxWidthMm: number; bandHeightMm: number; maxSizeMm: number },
): FittedTag {
  let best: FittedTag = { sizeMm: 0, lines: [tag] }
  const length = [...tag].length
  for (let parts = 1; parts <= Math.min(3, length); parts++) {
    const capSizeMm = Math.min(
      box.maxSizeMm,
      box.bandHeightMm / (CAP_HEIGHT_EM + (parts - 1) * TAG_LINE_EM),
    )
    const fitted = bestSplit(tag, parts, capSizeMm, box.maxWidthMm)
    if (fitted.sizeMm > best.sizeMm + 1e-9) best = fitted
  }
  return best
}

/** Baseline step between lines of a multi-line asset tag, in millimetres. */
export function tagLineStepMm(sizeMm: number): number {
  return sizeMm * TAG_LINE_EM
}
