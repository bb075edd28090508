// Reads what a pdfkit PDF shows: inflates its content streams and decodes the text operators
// (pdfkit writes built-in-font text as hex strings in TJ arrays). Also counts path operators.
import { inflateSync } from 'node:zlib'

export function pdfContent(pdf: Buffer): string {
  const text = pdf.toString('latin1')
  const out: string[] = []
  const re = /\/FlateDecode[^>]*>>\s*stream\r?\n/g
  for (let m = re.exec(text); m; m = re.exec(text)) {
    const start = m.index + m[0].length
    const end = text.indexOf('endstream', start)
    try {
      out.push(inflateSync(pdf.subarray(start, end)).toString('latin1'))
    } catch {
      // not a content stream we can read (e.g. trailing bytes); skip
    }
  }
  return out.join('\n')
}

/** The words drawn on the pages, in drawing order, joined by spaces. */
export function pdfText(pdf: Buffer): string {
  const content = pdfContent(pdf)
  const words: string[] = []
  for (const tj of content.matchAll(/\[(.*?)\]\s*TJ/g)) {
    let s = ''
    for (const hex of tj[1].matchAll(/<([0-9a-fA-F]*)>/g))
      s += Buffer.from(hex[1], 'hex').toString('latin1')
    words.push(s)
  }
  return words.join(' ')
}

/** How many straight line segments (`l` operators) the pages draw. */
export function lineSegments(pdf: Buffer): number {
  return (pdfContent(pdf).match(/ l\n/g) ?? []).length
}
