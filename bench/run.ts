/**
 * `npm run bench`: speed of the measurement engine on synthetic target frames of 2, 8 and
 * 12 MP — decoding (image-js, PNG and JPEG), luminance, edge finding, e-SFR per edge, focus
 * measures and the whole analysis — with OpenCV (Debian's python3-opencv, one thread) timed on
 * the same frames in the same run (bench/opencv_focus.py). Results: bench/results/ (gitignored).
 * Target (issue 3): a whole 12 MP analysis, without decoding, within 300 ms on one core;
 * focus measures within 2× of single-threaded OpenCV.
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
import type { GreyImage } from '../shared/analysis/types'
import { encodePngGrey, renderTargetFrame } from '../tests/fixtures/edges/render'

const SIZES = [
  { label: '2 MP', width: 1920, height: 1080 },
  { label: '8 MP', width: 3840, height: 2160 },
  { label: '12 MP', width: 4000, height: 3000 },
]
const REPEAT = Number(process.env.BENCH_REPEAT ?? 7)
const OUT = join(process.cwd(), 'bench', 'results')
const PYTHON = existsSync('/usr/bin/python3') ? '/usr/bin/python3' : 'python3'

/** Median wall time of `repeat` runs (after one warm-up), ms. */
function time<T>(fn: () => T, repeat = REPEAT): { ms: number; result: T } {
  let result = fn()
  const times: number[] = []
  for (let i = 0; i < repeat; i++) {
    const t0 = performance.now()
    result = fn()
    times.push(performance.now() - t0)
  }
  times.sort((a, b) => a - b)
  return { ms: times[times.length >> 1], result }
}

interface Row {
  label: string
  width: number
  height: number
  decodePngMs: number
  decodeJpegMs: number
  luminanceMs: number
  findEdgesMs: number
  edges: number
  esfrPerEdgeMs: number
  laplacianVarianceMs: number
  tenengradMs: number
  brennerMs: number
  focusMs: number
  analyzeMs: number
  opencv?: { readMs: number; laplacianVarianceMs: number; tenengradMs: number }
}

mkdirSync(join(OUT, 'frames'), { recursive: true })
const rows: Row[] = []
const pngPaths: string[] = []
for (const size of SIZES) {
  process.stdout.write(`rendering ${size.label} frame… `)
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
    { quality: 90 },
  )
  const pngPath = join(OUT, 'frames', `target-${size.width}x${size.height}.png`)
  writeFileSync(pngPath, png)
  writeFileSync(pngPath.replace(/\.png$/, '.jpg'), jpeg)
  pngPaths.push(pngPath)
  process.stdout.write('timing…\n')

  const decodePng = time(() => decode(png), 3)
  const decodeJpeg = time(() => decode(jpeg), 3)
  const raw = decodeJpeg.result.getRawImage()
  const luminance = time(() =>
    toGreyImage({
      width: raw.width,
      height: raw.height,
      data: raw.data as Uint8Array,
      channels: raw.channels,
      bitDepth: 8,
    }),
  )
  const grey: GreyImage = luminance.result
  const found = time(() => findEdges(grey))
  const rois = found.result
  const esfr = time(() => rois.map((e) => measureEdge(grey, e.roi, { orientation: e.orientation })))
  const lv = time(() => laplacianVariance(grey))
  const tg = time(() => tenengrad(grey))
  const br = time(() => brenner(grey))
  const whole = time(() => analyzeFrame(grey))
  rows.push({
    label: size.label,
    width: size.width,
    height: size.height,
    decodePngMs: decodePng.ms,
    decodeJpegMs: decodeJpeg.ms,
    luminanceMs: luminance.ms,
    findEdgesMs: found.ms,
    edges: rois.length,
    esfrPerEdgeMs: rois.length ? esfr.ms / rois.length : NaN,
    laplacianVarianceMs: lv.ms,
    tenengradMs: tg.ms,
    brennerMs: br.ms,
    focusMs: lv.ms + tg.ms + br.ms,
    analyzeMs: whole.ms,
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
  console.log(
    `OpenCV not timed (${PYTHON} with cv2 needed: apt-get install python3-opencv): ${(error as Error).message.split('\n')[0]}`,
  )
}

const f = (v: number) => (Number.isFinite(v) ? v.toFixed(1) : '—').padStart(8)
const ratio = (a: number, b?: number) => (b ? `${(a / b).toFixed(2)}×` : '—').padStart(8)
const lines = [
  `Sharpfield measurement bench — Node ${process.version}, one thread; medians of ${REPEAT} runs (decode: 3), ms`,
  '',
  'frame      decPNG  decJPEG  luminance  findEdges edges  eSFR/edge  LapVar  Tenengr  Brenner   focus  analyze  lum+analyze',
  ...rows.map(
    (r) =>
      `${r.label.padEnd(7)}${f(r.decodePngMs)} ${f(r.decodeJpegMs)}  ${f(r.luminanceMs)}  ${f(r.findEdgesMs)} ${String(r.edges).padStart(5)}  ${f(r.esfrPerEdgeMs)}  ${f(r.laplacianVarianceMs)} ${f(r.tenengradMs)} ${f(r.brennerMs)} ${f(r.focusMs)} ${f(r.analyzeMs)} ${f(r.luminanceMs + r.analyzeMs)}`,
  ),
  '',
  `OpenCV ${opencvVersion ?? '(not available)'}, cv2.setNumThreads(1), same PNG frames:`,
  'frame      cv read  cv LapVar  ours/cv  cv Tenengr  ours/cv',
  ...rows.map(
    (r) =>
      `${r.label.padEnd(7)}${f(r.opencv?.readMs ?? NaN)}  ${f(r.opencv?.laplacianVarianceMs ?? NaN)} ${ratio(r.laplacianVarianceMs, r.opencv?.laplacianVarianceMs)}  ${f(r.opencv?.tenengradMs ?? NaN)}   ${ratio(r.tenengradMs, r.opencv?.tenengradMs)}`,
  ),
  '',
]
const twelve = rows.find((r) => r.label === '12 MP')
if (twelve) {
  const ok = twelve.analyzeMs <= 300
  lines.push(
    `Target: whole 12 MP analysis without decoding ≤ 300 ms: ${twelve.analyzeMs.toFixed(0)} ms — ${ok ? 'met' : 'NOT met'}`,
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
console.log(`written: bench/results/bench-${stamp}.json`)
