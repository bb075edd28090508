import type { EdgeOrientation, GreyImage, Roi } from '../types'

/**
 * The samples of one region laid out so that the edge runs down the rows (near-vertical):
 * `data[row * cols + col]`. A horizontal edge is transposed (rows become x, columns y).
 */
export interface EdgeSamples {
  rows: number
  cols: number
  data: Float64Array
  orientation: EdgeOrientation
}

/**
 * Guesses the orientation of the edge in `roi` from the summed absolute central differences:
 * more change along x than along y means a near-vertical edge.
 */
export function detectOrientation(image: GreyImage, roi: Roi): EdgeOrientation {
  const { data, width } = image
  let sumX = 0
  let sumY = 0
  for (let r = roi.y + 1; r < roi.y + roi.h - 1; r++) {
    const row = r * width
    for (let i = row + roi.x + 1; i < row + roi.x + roi.w - 1; i++) {
      sumX += Math.abs(data[i + 1] - data[i - 1])
      sumY += Math.abs(data[i + width] - data[i - width])
    }
  }
  return sumX >= sumY ? 'vertical' : 'horizontal'
}

/** Copies `roi` into edge-down-the-rows layout (transposing horizontal edges). */
export function extractEdgeSamples(
  image: GreyImage,
  roi: Roi,
  orientation: EdgeOrientation,
): EdgeSamples {
  const { data, width } = image
  if (orientation === 'vertical') {
    const out = new Float64Array(roi.w * roi.h)
    for (let r = 0; r < roi.h; r++) {
      const src = (roi.y + r) * width + roi.x
      for (let c = 0; c < roi.w; c++) out[r * roi.w + c] = data[src + c]
    }
    return { rows: roi.h, cols: roi.w, data: out, orientation }
  }
  const out = new Float64Array(roi.w * roi.h)
  for (let y = 0; y < roi.h; y++) {
    const src = (roi.y + y) * width + roi.x
    for (let x = 0; x < roi.w; x++) out[x * roi.h + y] = data[src + x]
  }
  return { rows: roi.w, cols: roi.h, data: out, orientation }
}

/**
 * +1 when the region is darker on the low-column side (rising edge), −1 otherwise,
 * from the means of the outer quarters of the columns.
 */
export function edgeSign(samples: EdgeSamples): 1 | -1 {
  const { rows, cols, data } = samples
  const band = Math.max(1, Math.floor(cols / 4))
  let left = 0
  let right = 0
  for (let r = 0; r < rows; r++) {
    const row = r * cols
    for (let c = 0; c < band; c++) {
      left += data[row + c]
      right += data[row + cols - 1 - c]
    }
  }
  return right >= left ? 1 : -1
}
