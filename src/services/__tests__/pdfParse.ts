// A small reader for the PDFs our writer makes (uncompressed, one xref section), used by tests to
// check the file the way a PDF reader walks it: trailer → xref offsets → objects → pages.

export interface ParsedPage {
  mediaBox: number[]
  content: string
}

export function latin1(bytes: Uint8Array): string {
  let s = ''
  for (const b of bytes) s += String.fromCharCode(b)
  return s
}

export function parsePdf(bytes: Uint8Array): { objects: Map<number, string>; pages: ParsedPage[] } {
  const text = latin1(bytes)
  const startxref = Number(/startxref\n(\d+)\n%%EOF\n$/.exec(text)?.[1])
  if (!Number.isInteger(startxref)) throw new Error('no startxref')
  const xref = text.slice(startxref)
  const head = /^xref\n0 (\d+)\n/.exec(xref)
  if (!head) throw new Error('startxref does not point at an xref table')
  const count = Number(head[1])
  const objects = new Map<number, string>()
  for (let id = 1; id < count; id++) {
    const entry = xref.slice(head[0].length + 20 * id, head[0].length + 20 * (id + 1))
    if (!/^\d{10} 00000 n \n$/.test(entry))
      throw new Error(`bad xref entry ${id}: ${JSON.stringify(entry)}`)
    const offset = Number(entry.slice(0, 10))
    const start = `${id} 0 obj\n`
    if (text.slice(offset, offset + start.length) !== start)
      throw new Error(`xref offset of object ${id} is wrong`)
    const end = text.indexOf('\nendobj\n', offset)
    objects.set(id, text.slice(offset + start.length, end))
  }
  const trailer = /trailer\n<< \/Size (\d+) \/Root (\d+) 0 R/.exec(xref)
  if (!trailer || Number(trailer[1]) !== count) throw new Error('bad trailer')
  const pagesId = Number(/\/Pages (\d+) 0 R/.exec(objects.get(Number(trailer[2])) ?? '')?.[1])
  const kids = /\/Kids \[([^\]]*)\] \/Count (\d+)/.exec(objects.get(pagesId) ?? '')
  if (!kids) throw new Error('no page tree')
  const pageIds = kids[1]
    .split(' 0 R')
    .map((s) => s.trim())
    .filter(Boolean)
    .map(Number)
  if (pageIds.length !== Number(kids[2])) throw new Error('/Count does not match /Kids')
  const pages = pageIds.map((id) => {
    const page = objects.get(id) ?? ''
    const mediaBox = (/\/MediaBox \[([^\]]*)\]/.exec(page)?.[1] ?? '').split(' ').map(Number)
    const contentId = Number(/\/Contents (\d+) 0 R/.exec(page)?.[1])
    const stream = objects.get(contentId) ?? ''
    const m = /^<< \/Length (\d+) >>\nstream\n/.exec(stream)
    if (!m) throw new Error('no content stream')
    const content = stream.slice(m[0].length, m[0].length + Number(m[1]))
    if (stream.slice(m[0].length + Number(m[1])) !== 'endstream')
      throw new Error('/Length is wrong')
    return { mediaBox, content }
  })
  return { objects, pages }
}
