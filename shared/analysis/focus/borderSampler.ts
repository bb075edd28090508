import { borderIndex } from '../convolve/border'
import type { ResolvedRegion } from './region'

/**
 * Sample (x, y) of a region (region coordinates), with the region's border rule outside it.
 * Only for the one-pixel frame around the fast interior loops, never for every pixel.
 */
export function makeBorderSampler(r: ResolvedRegion): (x: number, y: number) => number {
  const { data, stride, x0, y0, w, h, border } = r
  return (x, y) => {
    const sx = borderIndex(x, w, border)
    const sy = borderIndex(y, h, border)
    return sx < 0 || sy < 0 ? 0 : data[(y0 + sy) * stride + x0 + sx]
  }
}

/**
 * Call `visit(x, y)` once for every pixel of the one-pixel frame of a w × h region
 * (top and bottom rows, then the left and right columns between them).
 */
export function forEachFramePixel(
  w: number,
  h: number,
  visit: (x: number, y: number) => void,
): void {
  for (let x = 0; x < w; x++) {
    visit(x, 0)
    if (h > 1) visit(x, h - 1)
  }
  for (let y = 1; y < h - 1; y++) {
    visit(0, y)
    if (w > 1) visit(w - 1, y)
  }
}
