import { borderIndexTable } from '../convolve/border'
import type { GreyLike } from '../convolve/types'
import { nextPowerOfTwo } from '../fft/plan'

/** A working copy for FFT deconvolution; the original sits at (left, top). */
export interface WorkingImage {
  width: number
  height: number
  data: Float64Array
  left: number
  top: number
}

/**
 * Pad for deconvolution without wrap-around ghosts: at least `marginPx` on every side (the grid
 * grows to powers of two), filled with a mirror image (symmetric rule, continuous at the edge)
 * that is blended to the image mean with a raised cosine, reaching the mean at the grid's outer
 * edge. Opposite edges then meet at the same value, so the circular FFT sees no jump.
 */
export function padWithTaper(image: GreyLike, marginPx: number): WorkingImage {
  const { width, height, data } = image
  const pw = nextPowerOfTwo(width + 2 * marginPx)
  const ph = nextPowerOfTwo(height + 2 * marginPx)
  const left = (pw - width) >> 1
  const top = (ph - height) >> 1
  const cols = borderIndexTable(width, left, pw - width - left, 'symmetric')
  const rows = borderIndexTable(height, top, ph - height - top, 'symmetric')
  const wx = taper(pw, left, width)
  const wy = taper(ph, top, height)
  let mean = 0
  for (let i = 0; i < data.length; i++) mean += data[i]
  mean /= data.length
  const out = new Float64Array(pw * ph)
  for (let y = 0; y < ph; y++) {
    const src = rows[y] * width
    const ry = wy[y]
    for (let x = 0; x < pw; x++) {
      out[y * pw + x] = mean + ry * wx[x] * (data[src + cols[x]] - mean)
    }
  }
  return { width: pw, height: ph, data: out, left, top }
}

/** Weight 1 over the image, falling as a raised cosine to 0 at the outermost pad sample. */
function taper(total: number, before: number, size: number): Float64Array {
  const w = new Float64Array(total).fill(1)
  const after = total - before - size
  for (let d = 1; d <= before; d++) w[before - d] = 0.5 * (1 + Math.cos((Math.PI * d) / before))
  for (let d = 1; d <= after; d++)
    w[before + size - 1 + d] = 0.5 * (1 + Math.cos((Math.PI * d) / after))
  return w
}

/** The image-sized part of a working grid, as Float32. */
export function cropWorking(
  work: WorkingImage,
  values: Float64Array,
  width: number,
  height: number,
): Float32Array {
  const out = new Float32Array(width * height)
  for (let y = 0; y < height; y++) {
    const src = (y + work.top) * work.width + work.left
    for (let x = 0; x < width; x++) out[y * width + x] = values[src + x]
  }
  return out
}

/**
 * The image as it is (`padding: 'none'`): the FFT treats it as periodic, i.e. circular
 * convolution. Any size works (non-powers of two use Bluestein's exact DFT).
 */
export function unpadded(image: GreyLike): WorkingImage {
  return {
    width: image.width,
    height: image.height,
    data: Float64Array.from(image.data),
    left: 0,
    top: 0,
  }
}
