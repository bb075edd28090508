import type { GreyImage, Roi } from '../types'
import { assertGreyImage, assertRoiInside } from './validate'

/** Copies the region `roi` of `image` into a new grey image. */
export function cropGrey(image: GreyImage, roi: Roi): GreyImage {
  assertGreyImage(image)
  assertRoiInside(roi, image.width, image.height)
  const { x, y, w, h } = roi
  const out = new Float32Array(w * h)
  for (let r = 0; r < h; r++) {
    const start = (y + r) * image.width + x
    out.set(image.data.subarray(start, start + w), r * w)
  }
  return { width: w, height: h, data: out }
}

/** Swaps rows and columns: a horizontal edge becomes a vertical one. */
export function transposeGrey(image: GreyImage): GreyImage {
  assertGreyImage(image)
  const { width, height, data } = image
  const out = new Float32Array(width * height)
  for (let y = 0; y < height; y++) {
    const row = y * width
    for (let x = 0; x < width; x++) out[x * height + y] = data[row + x]
  }
  return { width: height, height: width, data: out }
}
