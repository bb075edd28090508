import { readFileSync } from 'node:fs'
import { createRequire } from 'node:module'
import { dirname, join } from 'node:path'
import { describe, expect, it } from 'vitest'
import { textWidth, winAnsiCode, wrapText } from '../fontMetrics'

// Outside source: Adobe's core-font metrics as shipped in pdfkit's data folder (Helvetica.afm,
// Helvetica-Bold.afm). Widths are looked up by glyph name, which is how WinAnsi maps codes.
const pdfkitJsDir = dirname(createRequire(import.meta.url).resolve('pdfkit')) // …/pdfkit/js
function afmWidths(file: string): Map<string, number> {
  const widths = new Map<string, number>()
  for (const line of readFileSync(join(pdfkitJsDir, 'data', file), 'latin1').split('\n')) {
    const m = /^C -?\d+ ; WX (\d+) ; N (\S+)/.exec(line)
    if (m) widths.set(m[2], Number(m[1]))
  }
  return widths
}
// WinAnsiEncoding glyph names for codes 32..126 (PDF 1.7, Annex D).
const ASCII_NAMES = (
  'space exclam quotedbl numbersign dollar percent ampersand quotesingle parenleft parenright ' +
  'asterisk plus comma hyphen period slash zero one two three four five six seven eight nine colon ' +
  'semicolon less equal greater question at A B C D E F G H I J K L M N O P Q R S T U V W X Y Z ' +
  'bracketleft backslash bracketright asciicircum underscore grave a b c d e f g h i j k l m n o p ' +
  'q r s t u v w x y z braceleft bar braceright asciitilde'
).split(' ')
const EXTRA_NAMES: Record<string, string> = {
  '°': 'degree',
  µ: 'mu',
  '±': 'plusminus',
  '×': 'multiply',
  '–': 'endash',
  '—': 'emdash',
  '•': 'bullet',
  '’': 'quoteright',
  '“': 'quotedblleft',
  '”': 'quotedblright',
  '·': 'periodcentered',
  '…': 'ellipsis',
}

describe('Helvetica metrics', () => {
  for (const [weight, file] of [
    ['regular', 'Helvetica.afm'],
    ['bold', 'Helvetica-Bold.afm'],
  ] as const) {
    it(`match ${file} for every character the target prints`, () => {
      const afm = afmWidths(file)
      expect(ASCII_NAMES).toHaveLength(95)
      ASCII_NAMES.forEach((name, i) => {
        expect(textWidth(String.fromCharCode(32 + i), 1000, weight), name).toBe(afm.get(name))
      })
      for (const [ch, name] of Object.entries(EXTRA_NAMES))
        expect(textWidth(ch, 1000, weight), name).toBe(afm.get(name))
    })
  }

  it('scale with the font size and add up along a run', () => {
    // "Hi" = H 722 + i 222 = 944 units at 1000 [Helvetica.afm]; at 10 units that is 9.44.
    expect(textWidth('Hi', 10)).toBeCloseTo(9.44, 12)
  })

  it('use the WinAnsi codes for the few non-ASCII characters and refuse the rest', () => {
    expect(winAnsiCode('°')).toBe(0xb0)
    expect(winAnsiCode('×')).toBe(0xd7)
    expect(winAnsiCode('—')).toBe(0x97)
    expect(() => winAnsiCode('≥')).toThrow(/cannot be printed/)
    expect(() => textWidth('π', 10)).toThrow(RangeError)
  })
})

describe('word wrap', () => {
  it('breaks between words so that no line is wider than allowed', () => {
    const text =
      'Mount the sheet flat on a stiff board, without curl or creases, facing the camera.'
    const lines = wrapText(text, 3.5, 60)
    expect(lines.length).toBeGreaterThan(1)
    for (const line of lines) expect(textWidth(line, 3.5)).toBeLessThanOrEqual(60)
    expect(lines.join(' ')).toBe(text)
  })

  it('keeps a word longer than the line on a line of its own', () => {
    expect(wrapText('a ' + 'x'.repeat(50) + ' b', 3.5, 20)).toEqual(['a', 'x'.repeat(50), 'b'])
  })
})
