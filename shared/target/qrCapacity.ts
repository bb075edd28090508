// How big a QR symbol a payload needs, worked out without drawing it: the label layout uses this
// to promise a smallest module size for any asset tag before the code is made.

/**
 * Data capacity in bytes (byte mode, error correction level M) of QR versions 1–10, from
 * ISO/IEC 18004 (capacity table), quoted from memory and checked in the tests against the
 * `qrcode` encoder.
 */
const BYTE_CAPACITY_M = [14, 26, 42, 62, 84, 106, 122, 152, 180, 213] as const

/** Bytes of `text` in UTF-8 (the encoding QR byte mode carries here). */
export function utf8Length(text: string): number {
  let n = 0
  for (const ch of text) {
    const code = ch.codePointAt(0) ?? 0
    n += code < 0x80 ? 1 : code < 0x800 ? 2 : code < 0x10000 ? 3 : 4
  }
  return n
}

/**
 * The smallest version that holds `byteLength` bytes in byte mode at level M. An encoder that mixes
 * modes (digits, capitals) may fit a smaller version, never a larger one: this is an upper bound.
 */
export function qrVersionForBytesM(byteLength: number): number {
  if (!Number.isInteger(byteLength) || byteLength < 0) {
    throw new RangeError('The payload length must be a whole number of bytes.')
  }
  const index = BYTE_CAPACITY_M.findIndex((capacity) => byteLength <= capacity)
  if (index < 0) {
    throw new RangeError(
      `A payload of ${byteLength} bytes is too long for a label code (at most ${BYTE_CAPACITY_M.at(-1)}).`,
    )
  }
  return index + 1
}

/** Modules across a symbol of this version, without the quiet zone (21 for version 1). */
export function qrSymbolModules(version: number): number {
  if (!Number.isInteger(version) || version < 1 || version > 40) {
    throw new RangeError('A QR version is a whole number from 1 to 40.')
  }
  return 17 + 4 * version
}
