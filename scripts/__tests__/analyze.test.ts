import { execFile } from 'node:child_process'
import { mkdirSync, mkdtempSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { promisify } from 'node:util'
import { beforeAll, describe, expect, it } from 'vitest'
import { expectedMtf50 } from '../../tests/fixtures/edges/analytic'
import {
  encodeJpegGrey,
  encodePngGrey,
  renderEdgeCodes,
  renderEdgeLinear,
} from '../../tests/fixtures/edges/render'
import { runAnalyzeCli } from '../analyze/cli'

const dir = mkdtempSync(join(tmpdir(), 'sharpfield-analyze-'))
const file = (name: string) => join(dir, name)
const kernel = { type: 'gaussian' as const, sigmaPx: 1.2 }

beforeAll(() => {
  const e = renderEdgeCodes({
    kernel,
    angleDeg: 5,
    widthPx: 160,
    heightPx: 160,
    darkLinear: 0.2016,
    brightLinear: 0.7991,
  })
  writeFileSync(file('edge.png'), encodePngGrey(e.width, e.height, e.codes))
  writeFileSync(file('edge.jpg'), encodeJpegGrey(e.width, e.height, e.codes, 90))
  // 16-bit PNG: sRGB-encoded to 16 bits (IEC 61966-2-1).
  const lin = renderEdgeLinear({ kernel, angleDeg: 5, widthPx: 160, heightPx: 160 })
  const codes16 = Uint16Array.from(lin.data, (l) =>
    Math.round(65535 * (1.055 * Math.pow(l, 1 / 2.4) - 0.055)),
  )
  writeFileSync(file('edge16.png'), encodePngGrey(160, 160, codes16))
  writeFileSync(file('notes.txt'), 'not an image')
  const broken = encodePngGrey(e.width, e.height, e.codes).slice(0, 200)
  writeFileSync(file('broken.png'), broken)
  const huge = new Uint8Array(33)
  huge.set([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13, 0x49, 0x48, 0x44, 0x52])
  new DataView(huge.buffer).setUint32(16, 12000)
  new DataView(huge.buffer).setUint32(20, 9000)
  writeFileSync(file('huge.png'), huge)
  mkdirSync(file('folder.png'))
})

async function run(args: string[]) {
  let out = ''
  let err = ''
  const code = await runAnalyzeCli(args, {
    stdout: { write: (s: string) => (out += s) },
    stderr: { write: (s: string) => (err += s) },
  })
  return { code, out, err }
}

const expected = expectedMtf50(kernel, 5) // Goodman Gaussian OTF × projected pixel sinc (analytic.ts)

describe('npm run analyze', () => {
  it('prints one JSON object per file with exactly the fields of the runtime contract', async () => {
    const { code, out, err } = await run([file('edge.png'), file('edge.jpg'), '--json'])
    expect(err).toBe('')
    expect(code).toBe(0)
    const lines = out
      .trim()
      .split('\n')
      .map((l) => JSON.parse(l))
    expect(lines.map((l) => l.file)).toEqual([file('edge.png'), file('edge.jpg')])
    const rec = lines[0]
    // DESIGN.md runtime contract.
    expect(Object.keys(rec)).toEqual(['file', 'width', 'height', 'edges', 'focus'])
    expect(Object.keys(rec.focus)).toEqual(['laplacianVariance', 'tenengrad', 'brenner'])
    expect(rec.edges).toHaveLength(1)
    const edge = rec.edges[0]
    expect(Object.keys(edge)).toEqual([
      'roi',
      'orientation',
      'angleDeg',
      'mtf50',
      'mtf50p',
      'mtf10',
      'mtfNyquist',
      'mtf',
      'rise1090Px',
      'overshoot',
      'psf',
      'warnings',
    ])
    expect(Object.keys(edge.roi)).toEqual(['x', 'y', 'w', 'h'])
    expect(Object.keys(edge.psf)).toEqual(['model', 'sigmaPx', 'rmsResidual'])
    expect(edge.orientation).toBe('vertical')
    expect(edge.angleDeg).toBeCloseTo(5, 1)
    expect(Math.abs(edge.mtf50 - expected) / expected).toBeLessThan(0.01)
    expect(edge.mtf[0]).toEqual([0, 1])
    expect(edge.warnings).toEqual([])
    for (const l of lines)
      expect(Math.abs(l.edges[0].mtf50 - expected) / expected).toBeLessThan(0.02)
  })

  it('reads 16-bit PNG through a 65 536-entry sRGB table', async () => {
    const { code, out } = await run([file('edge16.png'), '--json'])
    expect(code).toBe(0)
    const edge = JSON.parse(out).edges[0]
    expect(Math.abs(edge.mtf50 - expected) / expected).toBeLessThan(0.005)
  })

  it('reports each bad file on stderr, still analyses the others, and exits 1', async () => {
    const bad = ['missing.png', 'notes.txt', 'broken.png', 'huge.png', 'folder.png']
    const { code, out, err } = await run([...bad.map(file), file('edge.png'), '--json'])
    expect(code).toBe(1)
    expect(out.trim().split('\n')).toHaveLength(1)
    expect(JSON.parse(out).file).toBe(file('edge.png'))
    const lines = err.trim().split('\n')
    expect(lines).toHaveLength(5)
    expect(lines[0]).toBe(`analyze: ${file('missing.png')}: no such file.`)
    expect(lines[1]).toMatch(/notes\.txt: The file is neither a PNG nor a JPEG image\.$/)
    expect(lines[2]).toMatch(/broken\.png: The PNG data cannot be decoded/)
    expect(lines[3]).toMatch(
      /huge\.png: The image is 12000 × 9000 \(108\.0 MP\), larger than the 100 MP limit\.$/,
    )
    expect(lines[4]).toBe(`analyze: ${file('folder.png')}: is a directory, not an image file.`)
  })

  it('measures the given regions with --roi and names a region that does not fit', async () => {
    const ok = await run([
      file('edge.png'),
      '--roi',
      '20,20,120,120',
      '--roi=30,40,100,80',
      '--json',
    ])
    expect(JSON.parse(ok.out).edges.map((e: { roi: object }) => e.roi)).toEqual([
      { x: 20, y: 20, w: 120, h: 120 },
      { x: 30, y: 40, w: 100, h: 80 },
    ])
    const outside = await run([file('edge.png'), '--roi', '100,100,100,100', '--json'])
    expect(outside.code).toBe(1)
    expect(outside.err).toMatch(/100,100,100,100 does not lie inside the 160 × 160 image/)
  })

  it('honours --encoding: sRGB data read as linear miss the analytic MTF50, gamma:1 is linear', async () => {
    const mtf50 = async (...args: string[]) =>
      JSON.parse((await run([file('edge.png'), ...args, '--json'])).out).edges[0].mtf50
    const srgb = await mtf50()
    const linear = await mtf50('--encoding', 'linear')
    expect(Math.abs(srgb - expected) / expected).toBeLessThan(0.01)
    expect(Math.abs(linear - expected) / expected).toBeGreaterThan(0.01)
    expect(await mtf50('--encoding', 'gamma:1')).toBe(linear)
  })

  it('rejects a bad command line with exit code 2 and the usage', async () => {
    for (const args of [
      [],
      ['--encoding', 'log', file('edge.png')],
      ['--roi', '1,2,3', file('edge.png')],
      ['--frobnicate', file('edge.png')],
    ]) {
      const r = await run(args)
      expect(r.code).toBe(2)
      expect(r.err).toMatch(/^analyze: .+\n\nUsage: npm run analyze/)
      expect(r.out).toBe('')
    }
  })

  it('prints the help with --help and a readable table without --json', async () => {
    const help = await run(['--help'])
    expect(help.code).toBe(0)
    expect(help.out).toMatch(/--roi x,y,w,h/)
    const table = await run([file('edge.png')])
    expect(table.out).toMatch(/edge\.png: 160 × 160 px, 1 edge/)
    expect(table.out).toMatch(/MTF50\s+MTF50P/)
    expect(table.out).toMatch(/Gaussian σ 1\.2/)
  })

  it('runs as a command (one spawned process)', async () => {
    const exec = promisify(execFile)
    const bin = join(process.cwd(), 'node_modules', '.bin', 'tsx')
    const { stdout } = await exec(bin, ['scripts/analyze.ts', file('edge.png'), '--json'], {
      cwd: process.cwd(),
      timeout: 60_000,
    })
    const rec = JSON.parse(stdout)
    expect(rec.width).toBe(160)
    expect(Math.abs(rec.edges[0].mtf50 - expected) / expected).toBeLessThan(0.01)
    await expect(
      exec(bin, ['scripts/analyze.ts', file('notes.txt')], { cwd: process.cwd(), timeout: 60_000 }),
    ).rejects.toMatchObject({ code: 1 })
  }, 60_000)
})
