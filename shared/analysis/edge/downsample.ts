import type { GreyImage } from '../types'

/**
 * Box-average downsampling by an integer `factor` (the last partial block is dropped):
 * one fused pass over the frame, a row accumulator, no per-pixel calls. Writes into `out` when
 * it is large enough (a caller-owned buffer), else into a new array.
 */
export function downsampleBox(image: GreyImage, factor: number, out?: Float32Array): GreyImage {
  if (!Number.isInteger(factor) || factor < 1) {
    throw new RangeError(`The downsampling factor must be a positive integer (got ${factor}).`)
  }
  const { width, height, data } = image
  const w = Math.floor(width / factor)
  const h = Math.floor(height / factor)
  if (w < 1 || h < 1) throw new RangeError(`The image is too small to downsample by ${factor}.`)
  const dst = out && out.length >= w * h ? out.subarray(0, w * h) : new Float32Array(w * h)
  if (factor === 1) {
    dst.set(data.subarray(0, w * h))
    return { width, height, data: dst }
  }
  const acc = new Float64Array(w)
  const scale = 1 / (factor * factor)
  for (let oy = 0; oy < h; oy++) {
    acc.fill(0)
    for (let dy = 0; dy < factor; dy++) {
      let i = (oy * factor + dy) * width
      for (let ox = 0; ox < w; ox++) {
        let s = 0
        for (let dx = 0; dx < factor; dx++) s += data[i++]
        acc[ox] += s
      }
    }
    const row = oy * w
    for (let ox = 0; ox < w; ox++) dst[row + ox] = acc[ox] * scale
  }
  return { width: w, height: h, data: dst }
}
