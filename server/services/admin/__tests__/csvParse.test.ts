import { describe, expect, it } from 'vitest'
import { CAMERA_CSV_COLUMNS } from '../../../../shared/schemas/csv'
import { cameraCsvTemplate, parseCameraCsv } from '../csvParse'

const bytes = (s: string) => new TextEncoder().encode(s)

describe('reading a camera CSV', () => {
  it('number rows by the line they start on, skipping blank lines and following quoted line breaks', () => {
    const csv =
      'asset_tag,site,camera_model,task\n\nA-1,S,M,detect\n"A-2",S,"two\nlines",detect\r\nA-3,S,M,detect\n'
    const p = parseCameraCsv(bytes(csv))
    expect(p.rows.map((r) => [r.line, r.cells[0]])).toEqual([
      [3, 'A-1'],
      [4, 'A-2'],
      [6, 'A-3'],
    ])
  })

  it('read headers without regard to case, spaces or a byte-order mark', () => {
    const p = parseCameraCsv(bytes('\uFEFF Asset_Tag , SITE,camera_model,Task\nA,S,M,detect'))
    expect(p.columns).toEqual(['asset_tag', 'site', 'camera_model', 'task'])
  })

  it('refuse wrong headers naming what is missing, unknown and repeated', () => {
    expect(() => parseCameraCsv(bytes('asset_tag,site,site,colour\nA,S,S,red'))).toThrow(
      /missing columns: camera_model, task; unknown column: colour; repeated column: site/,
    )
  })

  it('refuse empty, binary and non-UTF-8 files', () => {
    expect(() => parseCameraCsv(bytes(''))).toThrow('The file is empty.')
    expect(() => parseCameraCsv(new Uint8Array([1, 0, 2]))).toThrow(/binary/)
    expect(() => parseCameraCsv(new Uint8Array([0x61, 0xe9, 0x0a]))).toThrow(/not UTF-8/)
  })

  it('make a template that it reads back with every column', () => {
    const p = parseCameraCsv(bytes(cameraCsvTemplate()))
    expect(p.columns).toEqual([...CAMERA_CSV_COLUMNS])
    expect(p.rows.length).toBe(2)
  })
})
