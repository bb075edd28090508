import { parseTransfer } from '../../shared/analysis/image/transfer'
import type { Roi, Transfer } from '../../shared/analysis/types'

export const USAGE = `Usage: npm run analyze -- FILE... [--roi x,y,w,h]... [--encoding srgb|linear|gamma:G] [--json]

Measures the sharpness of camera frames (PNG 8/16-bit or JPEG) with the slanted-edge method
(ISO 12233 e-SFR): MTF curve, MTF50, MTF50P, MTF10, MTF at Nyquist, 10-90 % rise, overshoot,
blur-kernel estimate, warnings, and the frame's focus measures.

  FILE...            one or more image files; a bad file is reported and the others still run
  --roi x,y,w,h      measure this region (pixels; repeat for several); default: find the edges
  --encoding E       how code values map to light: srgb (default), linear or gamma:G (e.g. gamma:2.2)
  --json             one JSON object per file and line, instead of a table
  -h, --help         show this help

Frequencies are in cycles/pixel along the edge normal (Nyquist = 0.5). Focus measures are sums
over the frame's linear luminance (0-1): compare them only with the same camera and scene.
Exit code: 0 all files analysed, 1 some file failed, 2 bad command line.`

export interface CliArgs {
  files: string[]
  rois: Roi[]
  transfer: Transfer
  json: boolean
  help: boolean
}

/** Parses the command line; throws a RangeError with a clear message on bad input. */
export function parseArgs(argv: string[]): CliArgs {
  const out: CliArgs = { files: [], rois: [], transfer: { kind: 'srgb' }, json: false, help: false }
  for (let i = 0; i < argv.length; i++) {
    const arg = argv[i]
    const [name, inline] =
      arg.startsWith('--') && arg.includes('=') ? arg.split(/=(.*)/s, 2) : [arg, undefined]
    const value = () => {
      if (inline !== undefined) return inline
      const next = argv[++i]
      if (next === undefined) throw new RangeError(`${name} needs a value.`)
      return next
    }
    if (name === '-h' || name === '--help') out.help = true
    else if (name === '--json') out.json = true
    else if (name === '--roi') out.rois.push(parseRoi(value()))
    else if (name === '--encoding') out.transfer = parseTransfer(value())
    else if (name === '--') continue
    else if (name.startsWith('-') && name !== '-') throw new RangeError(`Unknown option ${name}.`)
    else out.files.push(arg)
  }
  if (!out.help && out.files.length === 0) throw new RangeError('No image files given.')
  return out
}

/** `x,y,w,h` in whole pixels, w and h positive. */
export function parseRoi(text: string): Roi {
  const parts = text.split(',').map((p) => p.trim())
  const nums = parts.map(Number)
  if (
    parts.length !== 4 ||
    !nums.every((n) => Number.isInteger(n)) ||
    nums[2] < 1 ||
    nums[3] < 1 ||
    nums[0] < 0 ||
    nums[1] < 0
  ) {
    throw new RangeError(
      `--roi must be x,y,w,h in whole pixels with w and h positive (got "${text}").`,
    )
  }
  const [x, y, w, h] = nums
  return { x, y, w, h }
}
