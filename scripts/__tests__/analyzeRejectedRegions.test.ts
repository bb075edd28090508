import { mkdtempSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { beforeAll, beforeEach, describe, expect, it, vi } from 'vitest'
import { encodePngGrey, renderEdgeCodes } from '../../tests/fixtures/edges/render'
import type * as FindEdgesModule from '../../shared/analysis/edge/findEdges'
import { analyzeFrame } from '../../shared/analysis/frame/analyzeFrame'
import type { Roi } from '../../shared/analysis/types'
import { runAnalyzeCli } from '../analyze/cli'
import { loadFrame } from '../analyze/loadFrame'

// The edge search runs for real; a test may add candidates to what it returns, standing in for
// a proposal the measurement turns down (the search's own checks rarely let one through).
const extra = vi.hoisted(() => ({ candidates: [] as { roi: Roi; orientation: 'vertical' }[] }))
vi.mock('../../shared/analysis/edge/findEdges', async (importOriginal) => {
  const real = await importOriginal<typeof FindEdgesModule>()
  return {
    ...real,
    findEdges: (...args: Parameters<typeof real.findEdges>) => [
      ...real.findEdges(...args),
      ...extra.candidates.map((c) => ({ ...c, angleDeg: 0, contrast: 0, score: 0 })),
    ],
  }
})

const dir = mkdtempSync(join(tmpdir(), 'sharpfield-analyze-rejected-'))
const edgeAndFlat = join(dir, 'edge-and-flat.png')
const flatOnly = join(dir, 'flat.png')
const flatRoi: Roi = { x: 200, y: 20, w: 80, h: 120 }
const FLAT_CODE = 128

beforeAll(() => {
  // 320 × 160: left half a Gaussian σ = 1.2 px edge 5° off vertical, right half flat grey.
  const e = renderEdgeCodes({
    kernel: { type: 'gaussian', sigmaPx: 1.2 },
    angleDeg: 5,
    widthPx: 160,
    heightPx: 160,
  })
  const codes = new Uint8Array(320 * 160).fill(FLAT_CODE)
  for (let y = 0; y < 160; y++) codes.set(e.codes.subarray(y * 160, (y + 1) * 160), y * 320)
  writeFileSync(edgeAndFlat, encodePngGrey(320, 160, codes))
  writeFileSync(flatOnly, encodePngGrey(320, 160, new Uint8Array(320 * 160).fill(FLAT_CODE)))
})

beforeEach(() => {
  extra.candidates = []
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

/** What the engine itself says about the file (same decoding as the command). */
async function engine(file: string) {
  const { image, encodingInfo } = await loadFrame(file, { kind: 'srgb' })
  return analyzeFrame(image, { encodingInfo })
}

const MEASURED_ROW = /^ {2}\d+ +\d+,\d+,\d+,\d+ +(vertical|horizontal) /

describe('npm run analyze: found regions that were not measured', () => {
  it('lists each turned-down region with its reason after the measured rows of the table', async () => {
    extra.candidates = [{ roi: flatRoi, orientation: 'vertical' }]
    const expected = await engine(edgeAndFlat)
    expect(expected.rejected).toHaveLength(1)
    expect(expected.edges.length).toBeGreaterThanOrEqual(1)

    const { code, out, err } = await run([edgeAndFlat])
    expect(err).toBe('')
    expect(code).toBe(0)
    const lines = out.trimEnd().split('\n')
    expect(lines[0]).toMatch(/edge-and-flat\.png: 320 × 160 px, \d+ edges?, 1 turned down$/)
    const measured = lines.flatMap((l, i) => (MEASURED_ROW.test(l) ? [i] : []))
    expect(measured).toHaveLength(expected.edges.length)
    const heading = lines.indexOf('  not measured: 1 found region turned down')
    expect(heading).toBeGreaterThan(Math.max(...measured))
    expect(lines[heading + 1]).toBe(`    200,20,80,120  ${expected.rejected[0].reason}`)
    expect(expected.rejected[0].reason).toMatch(/^No usable edge/)
  })

  it('lists them also when no edge could be measured at all', async () => {
    extra.candidates = [
      { roi: flatRoi, orientation: 'vertical' },
      { roi: { x: 10, y: 10, w: 60, h: 60 }, orientation: 'vertical' },
    ]
    const expected = await engine(flatOnly)
    expect(expected.edges).toEqual([])
    const { code, out } = await run([flatOnly])
    expect(code).toBe(0)
    const lines = out.trimEnd().split('\n')
    expect(lines[0]).toMatch(/flat\.png: 320 × 160 px, 0 edges, 2 turned down$/)
    expect(lines.slice(-3)).toEqual([
      '  not measured: 2 found regions turned down',
      `    200,20,80,120  ${expected.rejected[0].reason}`,
      `    10,10,60,60    ${expected.rejected[1].reason}`,
    ])
  })

  it('keeps the JSON line to the runtime contract: no extra field, measured edges only', async () => {
    extra.candidates = [{ roi: flatRoi, orientation: 'vertical' }]
    const { code, out } = await run([edgeAndFlat, '--json'])
    expect(code).toBe(0)
    const rec = JSON.parse(out)
    // DESIGN.md runtime contract.
    expect(Object.keys(rec)).toEqual(['file', 'width', 'height', 'edges', 'focus'])
    expect(rec.edges.length).toBeGreaterThanOrEqual(1)
    expect(rec.edges.map((e: { roi: Roi }) => e.roi)).not.toContainEqual(flatRoi)
  })

  it('says nothing about turned-down regions when there are none', async () => {
    const { out } = await run([edgeAndFlat])
    expect(out).not.toMatch(/turned down/)
    expect(out).toMatch(/edge-and-flat\.png: 320 × 160 px, \d+ edges?\n/)
  })
})
