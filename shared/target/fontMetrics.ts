// Advance widths of the two standard PDF fonts the target uses, in 1/1000 em, from Adobe's
// core-font metrics (Helvetica.afm and Helvetica-Bold.afm, AFM 4.1, freely distributable), mapped
// to WinAnsiEncoding. Only the characters our own texts need are covered; anything else is refused
// so a new sentence cannot silently print as garbage.

export type FontWeight = 'regular' | 'bold'

// Codes 32..126. Code 39 is quotesingle and 96 is grave in WinAnsi (not the AFM's curly quotes).
// prettier-ignore
const ASCII_REGULAR = [
  278, 278, 355, 556, 556, 889, 667, 191, 333, 333, 389, 584, 278, 333, 278, 278, 556, 556, 556,
  556, 556, 556, 556, 556, 556, 556, 278, 278, 584, 584, 584, 556, 1015, 667, 667, 722, 722, 667,
  611, 778, 722, 278, 500, 667, 556, 833, 722, 778, 667, 778, 722, 667, 611, 722, 667, 944, 667,
  667, 611, 278, 278, 278, 469, 556, 333, 556, 556, 500, 556, 556, 278, 556, 556, 222, 222, 500,
  222, 833, 556, 556, 556, 556, 333, 500, 278, 556, 500, 722, 500, 500, 500, 334, 260, 334, 584,
]
// prettier-ignore
const ASCII_BOLD = [
  278, 333, 474, 556, 556, 889, 722, 238, 333, 333, 389, 584, 278, 333, 278, 278, 556, 556, 556,
  556, 556, 556, 556, 556, 556, 556, 333, 333, 584, 584, 584, 611, 975, 722, 722, 722, 722, 667,
  611, 778, 722, 278, 556, 722, 611, 833, 722, 778, 667, 778, 722, 667, 611, 722, 667, 944, 667,
  667, 611, 333, 278, 333, 584, 556, 333, 556, 611, 556, 611, 556, 333, 611, 611, 278, 278, 556,
  278, 889, 611, 611, 611, 611, 389, 556, 333, 611, 556, 778, 556, 556, 500, 389, 280, 389, 584,
]

/** Non-ASCII characters: WinAnsi code, regular width, bold width. */
const EXTRA: Record<string, readonly [number, number, number]> = {
  '°': [0xb0, 400, 400],
  µ: [0xb5, 556, 611],
  '±': [0xb1, 584, 584],
  '×': [0xd7, 584, 584],
  '–': [0x96, 556, 556],
  '—': [0x97, 1000, 1000],
  '•': [0x95, 350, 350],
  '’': [0x92, 222, 278],
  '“': [0x93, 333, 500],
  '”': [0x94, 333, 500],
  '·': [0xb7, 278, 278],
  '…': [0x85, 1000, 1000],
}

/** WinAnsi byte for one character; throws RangeError for characters the fonts here do not cover. */
export function winAnsiCode(ch: string): number {
  const code = ch.codePointAt(0) ?? 0
  if (ch.length === 1 && code >= 32 && code <= 126) return code
  const extra = EXTRA[ch]
  if (extra) return extra[0]
  throw new RangeError(
    `The character "${ch}" (U+${code.toString(16).toUpperCase()}) cannot be printed with the standard fonts.`,
  )
}

function charWidth(ch: string, weight: FontWeight): number {
  const code = winAnsiCode(ch)
  if (code <= 126) return (weight === 'bold' ? ASCII_BOLD : ASCII_REGULAR)[code - 32]
  const extra = EXTRA[ch]
  return weight === 'bold' ? extra[2] : extra[1]
}

/** Width of a text run in the same unit as the font size (size × Σ widths / 1000). */
export function textWidth(text: string, sizeUnits: number, weight: FontWeight = 'regular'): number {
  let sum = 0
  for (const ch of text) sum += charWidth(ch, weight)
  return (sum * sizeUnits) / 1000
}

/** Greedy word wrap to a maximum line width (same unit as the size). */
export function wrapText(
  text: string,
  sizeUnits: number,
  maxWidth: number,
  weight: FontWeight = 'regular',
): string[] {
  const lines: string[] = []
  let line = ''
  for (const word of text.split(/\s+/).filter(Boolean)) {
    const candidate = line ? `${line} ${word}` : word
    if (line && textWidth(candidate, sizeUnits, weight) > maxWidth) {
      lines.push(line)
      line = word
    } else {
      line = candidate
    }
  }
  if (line) lines.push(line)
  return lines
}
