import type { PsfModel } from '../types'

/** A 2-D kernel for display: odd square size, row-major, sums to 1. */
export interface PsfKernel2D {
  width: number
  height: number
  data: Float32Array
}

/**
 * Pixel-integrated image of a Gaussian (σ) or disk (R) PSF on a `sizePx` × `sizePx` grid
 * (odd, default 15), 8 × 8 samples per pixel, normalised to sum 1. For display only.
 */
export function psfKernel2d(model: PsfModel, radiusOrSigmaPx: number, sizePx = 15): PsfKernel2D {
  if (!Number.isInteger(sizePx) || sizePx < 1 || sizePx % 2 === 0 || sizePx > 255) {
    throw new RangeError(`The kernel size must be an odd integer from 1 to 255 (got ${sizePx}).`)
  }
  if (!(radiusOrSigmaPx > 0) || !Number.isFinite(radiusOrSigmaPx)) {
    throw new RangeError(
      `The kernel size parameter must be a positive number (got ${radiusOrSigmaPx}).`,
    )
  }
  const sub = 8
  const half = (sizePx - 1) / 2
  const data = new Float32Array(sizePx * sizePx)
  const inv2s2 = 1 / (2 * radiusOrSigmaPx * radiusOrSigmaPx)
  const r2 = radiusOrSigmaPx * radiusOrSigmaPx
  let total = 0
  for (let py = 0; py < sizePx; py++) {
    for (let px = 0; px < sizePx; px++) {
      let acc = 0
      for (let sy = 0; sy < sub; sy++) {
        const y = py - half - 0.5 + (sy + 0.5) / sub
        for (let sx = 0; sx < sub; sx++) {
          const x = px - half - 0.5 + (sx + 0.5) / sub
          const d2 = x * x + y * y
          acc += model === 'gaussian' ? Math.exp(-d2 * inv2s2) : d2 <= r2 ? 1 : 0
        }
      }
      data[py * sizePx + px] = acc
      total += acc
    }
  }
  if (total > 0) for (let i = 0; i < data.length; i++) data[i] /= total
  else data[(sizePx * sizePx - 1) / 2] = 1
  return { width: sizePx, height: sizePx, data }
}
