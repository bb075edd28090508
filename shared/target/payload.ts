// The text inside a target's QR code: `sharpfield-target:v1;id=<id>;w=<mm>;h=<mm>`.
// The printed width and height let a frame of the target be scaled without a ruler: the layout
// is a pure function of the sheet size, so the square side follows from w and h.
import { splitPayload } from './payloadFields'

export const TARGET_PAYLOAD_PREFIX = 'sharpfield-target:v1'
const ID_PATTERN = /^[A-Za-z0-9][A-Za-z0-9_-]{2,31}$/
const MAX_SIZE_MM = 10_000

export interface TargetPayload {
  id: string
  widthMm: number
  heightMm: number
}

export function assertTargetId(id: string): void {
  if (typeof id !== 'string') throw new TypeError('The target id must be text.')
  if (!ID_PATTERN.test(id)) {
    throw new RangeError(
      'The target id must be 3–32 letters, digits, "-" or "_", starting with a letter or digit.',
    )
  }
}

function assertSize(label: string, mm: number): void {
  if (!Number.isFinite(mm) || mm <= 0 || mm > MAX_SIZE_MM) {
    throw new RangeError(
      `The printed ${label} must be a positive number of millimetres up to ${MAX_SIZE_MM}.`,
    )
  }
}

/** Millimetres with at most one decimal, no trailing zeros (215.9, 210). */
function formatMm(mm: number): string {
  return String(Math.round(mm * 10) / 10)
}

export function encodeTargetPayload(payload: TargetPayload): string {
  assertTargetId(payload.id)
  assertSize('width', payload.widthMm)
  assertSize('height', payload.heightMm)
  return `${TARGET_PAYLOAD_PREFIX};id=${payload.id};w=${formatMm(payload.widthMm)};h=${formatMm(payload.heightMm)}`
}

/** Parses a scanned code. Unknown keys are ignored (later versions may add some). */
export function decodeTargetPayload(text: string): TargetPayload {
  if (typeof text !== 'string') throw new TypeError('A target code must be text.')
  if (text.trim().split(';')[0] !== TARGET_PAYLOAD_PREFIX) {
    throw new RangeError('This code is not a Sharpfield target (version 1) code.')
  }
  const values = splitPayload(text, 'target code').fields
  const id = values.get('id')
  const w = values.get('w')
  const h = values.get('h')
  if (id === undefined || w === undefined || h === undefined) {
    throw new RangeError('The target code lacks its id, width or height.')
  }
  const number = /^\d+(\.\d+)?$/
  if (!number.test(w) || !number.test(h)) {
    throw new RangeError(
      'The target code has a width or height that is not a plain number of millimetres.',
    )
  }
  const payload = { id, widthMm: Number(w), heightMm: Number(h) }
  assertTargetId(payload.id)
  assertSize('width', payload.widthMm)
  assertSize('height', payload.heightMm)
  return payload
}

const ID_ALPHABET = '23456789ABCDEFGHJKMNPQRSTUVWXYZ' // no 0/O, 1/I/L: easy to read aloud and type

/** A readable id such as `SFT-7K2M9Q` from random bytes (the caller supplies them, e.g. crypto). */
export function makeTargetId(randomBytes: Uint8Array, length = 6): string {
  if (randomBytes.length < length)
    throw new RangeError(`A target id of ${length} characters needs ${length} random bytes.`)
  let out = 'SFT-'
  for (let i = 0; i < length; i++) out += ID_ALPHABET[randomBytes[i] % ID_ALPHABET.length]
  return out
}
