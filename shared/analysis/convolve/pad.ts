import { borderIndexTable, type BorderRule } from './border'
import type { GreyLike } from './types'

/** A padded copy of an image: `data[(y + top) * width + (x + left)]` is the original (x, y). */
export interface PaddedImage {
  width: number
  height: number
  data: Float64Array
  left: number
  top: number
}

/**
 * Copy `image` into a larger Float64Array with `padX` columns on each side and `padY` rows above
 * and below, filled by the border rule. Caller validates the arguments.
 */
export function padImage(
  image: GreyLike,
  padX: number,
  padY: number,
  border: BorderRule,
): PaddedImage {
  const { width, height, data } = image
  const pw = width + 2 * padX
  const ph = height + 2 * padY
  const cols = borderIndexTable(width, padX, padX, border)
  const rows = borderIndexTable(height, padY, padY, border)
  const out = new Float64Array(pw * ph)
  for (let py = 0; py < ph; py++) {
    const sy = rows[py]
    if (sy < 0) continue
    const src = sy * width
    const dst = py * pw
    for (let px = 0; px < pw; px++) {
      const sx = cols[px]
      if (sx >= 0) out[dst + px] = data[src + sx]
    }
  }
  return { width: pw, height: ph, data: out, left: padX, top: padY }
}
