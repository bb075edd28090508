/**
 * `npm run bench`: speed of the measurement engine on synthetic target frames of 2, 8 and
 * 12 MP — decoding (image-js, PNG and JPEG), luminance, edge finding, e-SFR per edge, focus
 * measures and the whole analysis — with OpenCV (Debian's python3-opencv, one thread) timed on
 * the same frames in the same run (bench/opencv_focus.py). Results: bench/results/ (gitignored).
 * Target (issue 3): a whole 12 MP analysis, without decoding, within 300 ms on one core;
 * focus measures within 2× of single-threaded OpenCV.
 *
 * Each stage reports the median wall time and the median CPU time of this process (user +
 * system): on a machine shared with other jobs the wall time includes time spent waiting for a
 * core, the CPU time does not. BENCH_REPEAT sets the number of runs (default 7).
 */
import { execFileSync } from 'node:child_process'
import { existsSync, mkdirSync, writeFileSync } from 'node:fs'
import { join } from 'node:path'
import { decode, encodeJpeg, Image } from 'image-js'
import { findEdges } from '../shared/analysis/edge'
import { brenner, laplacianVariance, tenengrad } from '../shared/analysis/focus'
import { analyzeFrame } from '../shared/analysis/frame'
import { toGreyImage } from '../shared/analysis/image'
import { measureEdge } from '../shared/analysis/mtf'
import { encodePngGrey, renderTargetFrame } from '../tests/fixtures/edges/render'

const SIZES = [
  { label: '2 MP', width: 1920, height: 1080 },
  { label: '8 MP', width: 3840, height: 2160 },
  { label: '12 MP', width: 4000, height: 3000 },
]
const REPEAT = Number(process.env.BENCH_REPEAT ?? 7)
const OUT = join(process.cwd(), 'bench', 'results')
const PYTHON = existsSync('/usr/bin/python3') ? '/usr/bin/python3' : 'python3'

interface Timing {
  wallMs: number
  cpuMs: number
}

const median = (v: number[]) => [...v].sort((a, b) => a - b)[v.length >> 1]

const timing = (t: Timing): Timing => ({ wallMs: t.wallMs, cpuMs: t.cpuMs })

/** Medians of `repeat` runs after one warm-up. */
function time<T>(fn: () => T, repeat = REPEAT): Timing & { result: T } {
  let result = fn()
  const wall: number[] = []
  const cpu: number[] = []
  for (let i = 0; i < repeat; i++) {
    const c0 = process.cpuUsage()
    const t0 = performance.now()
    result = fn()
    wall.push(performance.now() - t0)
    const c = process.cpuUsage(c0)
    cpu.push((c.user + c.system) / 1000)
  }
  return { wallMs: median(wall), cpuMs: median(cpu), result }
}

const STAGES = [
  ['decodePng', 'decode PNG'],
  ['decodeJpeg', 'decode JPEG'],
  ['luminanceNew', 'luminance, new array'],
  ['luminance', 'luminance, reused buffer'],
  ['findEdges', 'edge finding'],
  ['esfrPerEdge', 'e-SFR + kernel fit, per edge'],
  ['laplacianVariance', 'variance of Laplacian'],
  ['tenengrad', 'Tenengrad'],
  ['brenner', 'Brenner'],
  ['analyze', 'whole analysis (analyzeFrame)'],
] as const
type Stage = (typeof STAGES)[number][0]

interface Row {
  label: string
  width: number
  height: number
  edges: number
  t: Record<Stage, Timing>
  opencv?: { readMs: number; laplacianVarianceMs: number; tenengradMs: number }
}

mkdirSync(join(OUT, 'frames'), { recursive: true })
const rows: Row[] = []
const pngPaths: string[] = []
for (const size of SIZES) {
  process.stdout.write(`${size.label}: rendering… `)
  const frame = renderTargetFrame({
    width: size.width,
    height: size.height,
    sigmaPx: 1.5,
    snr: 100,
    seed: 1,
  })
  const png = encodePngGrey(frame.width, frame.height, frame.codes)
  const rgba = new Uint8Array(frame.width * frame.height * 4)
  for (let i = 0, j = 0; i < frame.codes.length; i++, j += 4) {
    rgba[j] = rgba[j + 1] = rgba[j + 2] = frame.codes[i]
    rgba[j + 3] = 255
  }
  const jpeg = encodeJpeg(
    new Image(frame.width, frame.height, { colorModel: 'RGBA', data: rgba }),
    {
      quality: 90,
    },
  )
  const pngPath = join(OUT, 'frames', `target-${size.width}x${size.height}.png`)
  writeFileSync(pngPath, png)
  writeFileSync(pngPath.replace(/\.png$/, '.jpg'), jpeg)
  pngPaths.push(pngPath)
  process.stdout.write('timing…\n')

  const decodePng = time(() => decode(png), 3)
  const decodeJpeg = time(() => decode(jpeg), 3)
  const raw = decodeJpeg.result.getRawImage()
  const rawFrame = {
    width: raw.width,
    height: raw.height,
    data: raw.data as Uint8Array,
    channels: raw.channels,
    bitDepth: 8 as const,
  }
  const luminanceNew = time(() => toGreyImage(rawFrame), 3)
  // Steady state: the worker reuses its luminance buffer between frames of one size.
  const buffer = new Float32Array(raw.width * raw.height)
  const luminance = time(() => toGreyImage(rawFrame, { out: buffer }))
  const grey = luminance.result
  const found = time(() => findEdges(grey))
  const rois = found.result
  const esfr = time(() => rois.map((e) => measureEdge(grey, e.roi, { orientation: e.orientation })))
  const perEdge = (v: number) => (rois.length ? v / rois.length : NaN)
  rows.push({
    label: size.label,
    width: size.width,
    height: size.height,
    edges: rois.length,
    // Timings only: the results (decoded frames included) are let go here.
    t: {
      decodePng: timing(decodePng),
      decodeJpeg: timing(decodeJpeg),
      luminanceNew: timing(luminanceNew),
      luminance: timing(luminance),
      findEdges: timing(found),
      esfrPerEdge: { wallMs: perEdge(esfr.wallMs), cpuMs: perEdge(esfr.cpuMs) },
      laplacianVariance: timing(time(() => laplacianVariance(grey))),
      tenengrad: timing(time(() => tenengrad(grey))),
      brenner: timing(time(() => brenner(grey))),
      analyze: timing(time(() => analyzeFrame(grey))),
    },
  })
}

let opencvVersion: string | null = null
try {
  const out = execFileSync(
    PYTHON,
    ['bench/opencv_focus.py', '--repeat', String(REPEAT), ...pngPaths],
    {
      encoding: 'utf8',
      maxBuffer: 1 << 20,
    },
  )
  const cv = JSON.parse(out) as {
    opencv: string
    frames: { readMs: number; laplacianVarianceMs: number; tenengradMs: number }[]
  }
  opencvVersion = cv.opencv
  cv.frames.forEach((f, i) => (rows[i].opencv = f))
} catch (error) {
  const reason = (error as Error).message.split('\n')[0]
  console.log(
    `OpenCV not timed (${PYTHON} with cv2 needed: apt-get install python3-opencv): ${reason}`,
  )
}

const cell = (v: number) => (Number.isFinite(v) ? v.toFixed(1) : '—').padStart(9)
const lines = [
  `Sharpfield measurement bench — Node ${process.version}, one thread; medians of ${REPEAT} runs (decode and new-array luminance: 3); ms as wall / CPU`,
  '',
  `${'stage'.padEnd(32)}${rows.map((r) => `${r.label.padStart(9)} wall${'CPU'.padStart(9)}`).join('')}`,
  ...STAGES.map(
    ([key, name]) =>
      `${name.padEnd(32)}${rows.map((r) => `${cell(r.t[key].wallMs)}     ${cell(r.t[key].cpuMs)}`).join('')}`,
  ),
  `${'edges found'.padEnd(32)}${rows.map((r) => `${String(r.edges).padStart(9)}     ${''.padStart(9)}`).join('')}`,
  '',
  `OpenCV ${opencvVersion ?? '(not available)'}, cv2.setNumThreads(1), same frames (PNG, grey), wall ms; ratio = ours (wall) / OpenCV:`,
  `${'frame'.padEnd(8)}${'cv imread'.padStart(10)}${'cv LapVar'.padStart(11)}${'ratio'.padStart(8)}${'cv Tenengrad'.padStart(14)}${'ratio'.padStart(8)}`,
  ...rows.map((r) => {
    const cv = r.opencv
    const ratio = (ours: number, theirs?: number) =>
      (theirs ? `${(ours / theirs).toFixed(2)}×` : '—').padStart(8)
    return `${r.label.padEnd(8)}${cell(cv?.readMs ?? NaN).padStart(10)}${cell(cv?.laplacianVarianceMs ?? NaN).padStart(11)}${ratio(r.t.laplacianVariance.wallMs, cv?.laplacianVarianceMs)}${cell(cv?.tenengradMs ?? NaN).padStart(14)}${ratio(r.t.tenengrad.wallMs, cv?.tenengradMs)}`
  }),
  '',
]
const twelve = rows.find((r) => r.label === '12 MP')
if (twelve) {
  const { wallMs, cpuMs } = twelve.t.analyze
  const verdict = (v: number) => (v <= 300 ? 'met' : 'NOT met')
  lines.push(
    `Target: whole 12 MP analysis without decoding ≤ 300 ms on one core: wall ${wallMs.toFixed(0)} ms (${verdict(wallMs)}), CPU ${cpuMs.toFixed(0)} ms (${verdict(cpuMs)}); with luminance (reused buffer) ${(wallMs + twelve.t.luminance.wallMs).toFixed(0)} ms wall.`,
  )
}
console.log(lines.join('\n'))
const stamp = new Date().toISOString().replace(/[:.]/g, '-')
const json = JSON.stringify(
  {
    date: new Date().toISOString(),
    node: process.version,
    repeat: REPEAT,
    opencv: opencvVersion,
    rows,
  },
  null,
  2,
)
writeFileSync(join(OUT, `bench-${stamp}.json`), json)
writeFileSync(join(OUT, 'latest.json'), json)
writeFileSync(join(OUT, 'latest.txt'), lines.join('\n'))
console.log(`written: bench/results/bench-${stamp}.json and latest.txt`)
