// Draws Sharpfield's app icons from one geometry: a deep-teal rounded tile holding a light
// "target sheet" with a dark square tilted a few degrees (the slanted edge) and a short amber
// scale bar. Writes the PNG icons (image-js encodePng, 5×5 supersampled) and the SVG favicon.
//   npx tsx scripts/make-icons.ts
import { mkdirSync, writeFileSync } from 'node:fs'
import { dirname, join } from 'node:path'
import { fileURLToPath } from 'node:url'
import { Image, encodePng } from 'image-js'

type Rgb = readonly [number, number, number]

const TEAL: Rgb = [0x0f, 0x3d, 0x3e]
const PAPER: Rgb = [0xf4, 0xf7, 0xf6]
const AMBER: Rgb = [0xe8, 0xa3, 0x3d]

/** Geometry in unit coordinates (0..1 across the icon). */
const TILE_RADIUS = 0.22
const PAPER_HALF = 0.3
const PAPER_RADIUS = 0.05
const SQUARE = { cx: 0.5, cy: 0.47, half: 0.16, angleDeg: 8 }
const BAR = { x0: 0.3, x1: 0.5, y0: 0.695, y1: 0.73 }
const SUPERSAMPLE = 5

interface IconSpec {
  file: string
  sizePx: number
  /** Maskable icons fill the square and keep the mark inside the central safe circle. */
  maskable: boolean
}

const ICONS: IconSpec[] = [
  { file: 'icons/icon-192.png', sizePx: 192, maskable: false },
  { file: 'icons/icon-512.png', sizePx: 512, maskable: false },
  { file: 'icons/icon-maskable-512.png', sizePx: 512, maskable: true },
  { file: 'icons/apple-touch-icon-180.png', sizePx: 180, maskable: true },
]

function insideRoundedRect(x: number, y: number, c: number, half: number, radius: number): boolean {
  const qx = Math.abs(x - c) - (half - radius)
  const qy = Math.abs(y - c) - (half - radius)
  const outside = Math.hypot(Math.max(qx, 0), Math.max(qy, 0))
  return outside + Math.min(Math.max(qx, qy), 0) - radius <= 0
}

const cosA = Math.cos((SQUARE.angleDeg * Math.PI) / 180)
const sinA = Math.sin((SQUARE.angleDeg * Math.PI) / 180)

function insideTiltedSquare(x: number, y: number): boolean {
  const dx = x - SQUARE.cx
  const dy = y - SQUARE.cy
  const u = dx * cosA + dy * sinA
  const v = -dx * sinA + dy * cosA
  return Math.abs(u) <= SQUARE.half && Math.abs(v) <= SQUARE.half
}

/** Colour of the mark at (x, y) in unit coordinates, or null where the icon is transparent. */
function colourAt(x: number, y: number, spec: IconSpec): Rgb | null {
  if (!spec.maskable && !insideRoundedRect(x, y, 0.5, 0.5, TILE_RADIUS)) return null
  // The maskable variant shrinks the mark so the sheet's corners stay within the 40 % safe radius.
  const scale = spec.maskable ? 0.9 : 1
  const mx = 0.5 + (x - 0.5) / scale
  const my = 0.5 + (y - 0.5) / scale
  if (!insideRoundedRect(mx, my, 0.5, PAPER_HALF, PAPER_RADIUS)) return TEAL
  if (insideTiltedSquare(mx, my)) return TEAL
  if (mx >= BAR.x0 && mx <= BAR.x1 && my >= BAR.y0 && my <= BAR.y1) return AMBER
  return PAPER
}

function renderIcon(spec: IconSpec): Uint8Array {
  const n = spec.sizePx
  const data = new Uint8Array(n * n * 4)
  const samples = SUPERSAMPLE * SUPERSAMPLE
  for (let row = 0; row < n; row++) {
    for (let col = 0; col < n; col++) {
      let r = 0
      let g = 0
      let b = 0
      let covered = 0
      for (let sy = 0; sy < SUPERSAMPLE; sy++) {
        for (let sx = 0; sx < SUPERSAMPLE; sx++) {
          const x = (col + (sx + 0.5) / SUPERSAMPLE) / n
          const y = (row + (sy + 0.5) / SUPERSAMPLE) / n
          const c = colourAt(x, y, spec)
          if (c === null) continue
          r += c[0]
          g += c[1]
          b += c[2]
          covered++
        }
      }
      const i = (row * n + col) * 4
      if (covered > 0) {
        data[i] = Math.round(r / covered)
        data[i + 1] = Math.round(g / covered)
        data[i + 2] = Math.round(b / covered)
      }
      data[i + 3] = Math.round((255 * covered) / samples)
    }
  }
  return encodePng(new Image(n, n, { colorModel: 'RGBA', data }))
}

function hex(c: Rgb): string {
  return '#' + c.map((v) => v.toString(16).padStart(2, '0')).join('')
}

/** The same mark as a 64-unit SVG, for the browser tab. */
function renderFavicon(): string {
  const u = (v: number) => +(v * 64).toFixed(2)
  const paperXY = u(0.5 - PAPER_HALF)
  const sq = u(SQUARE.half * 2)
  return [
    '<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 64 64">',
    `<rect width="64" height="64" rx="${u(TILE_RADIUS)}" fill="${hex(TEAL)}"/>`,
    `<rect x="${paperXY}" y="${paperXY}" width="${u(PAPER_HALF * 2)}" height="${u(PAPER_HALF * 2)}" rx="${u(PAPER_RADIUS)}" fill="${hex(PAPER)}"/>`,
    `<rect x="${u(SQUARE.cx - SQUARE.half)}" y="${u(SQUARE.cy - SQUARE.half)}" width="${sq}" height="${sq}" fill="${hex(TEAL)}" transform="rotate(${SQUARE.angleDeg} ${u(SQUARE.cx)} ${u(SQUARE.cy)})"/>`,
    `<rect x="${u(BAR.x0)}" y="${u(BAR.y0)}" width="${u(BAR.x1 - BAR.x0)}" height="${u(BAR.y1 - BAR.y0)}" fill="${hex(AMBER)}"/>`,
    '</svg>',
    '',
  ].join('\n')
}

const publicDir = join(dirname(fileURLToPath(import.meta.url)), '..', 'public')
for (const spec of ICONS) {
  const path = join(publicDir, spec.file)
  mkdirSync(dirname(path), { recursive: true })
  writeFileSync(path, renderIcon(spec))
  console.log(`wrote public/${spec.file} (${spec.sizePx}×${spec.sizePx})`)
}
writeFileSync(join(publicDir, 'favicon.svg'), renderFavicon())
console.log('wrote public/favicon.svg')
