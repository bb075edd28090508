import type { Transfer } from '../types'

/**
 * Inverse sRGB transfer function (IEC 61966-2-1): encoded V in 0..1 to linear light.
 * V ≤ 0.04045 → V / 12.92, else ((V + 0.055) / 1.055)^2.4.
 */
export function srgbToLinear(encoded: number): number {
  return encoded <= 0.04045 ? encoded / 12.92 : Math.pow((encoded + 0.055) / 1.055, 2.4)
}

/** Forward sRGB transfer function (IEC 61966-2-1): linear light in 0..1 to encoded V. */
export function linearToSrgb(linear: number): number {
  return linear <= 0.0031308 ? linear * 12.92 : 1.055 * Math.pow(linear, 1 / 2.4) - 0.055
}

/**
 * Parses `srgb`, `linear` or `gamma:G` (G a positive number, e.g. `gamma:2.2`).
 * Throws a RangeError naming the accepted forms otherwise.
 */
export function parseTransfer(text: string): Transfer {
  const value = text.trim().toLowerCase()
  if (value === 'srgb') return { kind: 'srgb' }
  if (value === 'linear') return { kind: 'linear' }
  const match = /^gamma:(\d+(?:\.\d+)?)$/.exec(value)
  if (match) {
    const gamma = Number(match[1])
    if (gamma > 0 && gamma <= 10) return { kind: 'gamma', gamma }
  }
  throw new RangeError(
    `Unknown encoding "${text}": use srgb, linear or gamma:G with G between 0 and 10 (e.g. gamma:2.2).`,
  )
}

/** Decodes one encoded value V in 0..1 to linear light under `transfer`. */
export function decodeTransfer(encoded: number, transfer: Transfer): number {
  switch (transfer.kind) {
    case 'srgb':
      return srgbToLinear(encoded)
    case 'linear':
      return encoded
    case 'gamma':
      return Math.pow(encoded, transfer.gamma)
  }
}

const tableCache = new Map<string, Float32Array>()

/**
 * Look-up table from code value (0..2^bitDepth − 1) to linear light: 256 entries for 8-bit,
 * 65 536 for 16-bit. Tables are built once per transfer and bit depth and shared (read-only).
 */
export function linearisationTable(transfer: Transfer, bitDepth: 8 | 16): Float32Array {
  if (bitDepth !== 8 && bitDepth !== 16) {
    throw new RangeError(`Bit depth must be 8 or 16 (got ${String(bitDepth)}).`)
  }
  const key = `${transfer.kind}:${transfer.kind === 'gamma' ? transfer.gamma : ''}:${bitDepth}`
  const cached = tableCache.get(key)
  if (cached) return cached
  const size = bitDepth === 8 ? 256 : 65536
  const table = new Float32Array(size)
  const maxCode = size - 1
  for (let code = 0; code < size; code++) table[code] = decodeTransfer(code / maxCode, transfer)
  tableCache.set(key, table)
  return table
}
