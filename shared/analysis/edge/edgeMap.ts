import type { GreyImage } from '../types'

/** Edge pixels of a (downsampled) frame after non-maximum suppression. */
export interface EdgeMap {
  width: number
  height: number
  /** 0 none, 1 near-vertical edge (gradient along x), 2 near-horizontal edge. */
  kind: Uint8Array
}

/** Caller-owned buffers of at least width × height samples. */
export interface EdgeMapBuffers {
  mag: Float32Array
  kind: Uint8Array
}

/** tan 25°: gradients more than 25° off an axis are not candidates. */
const AXIS_TAN = 0.4663

/**
 * Sobel gradients, then thin edges: a pixel is kept when its gradient is a local maximum across
 * the edge, its relative gradient |∇I| / (I + 0.005) is at least `minRelativeGradient`
 * (contrast-based, so dim and bright targets are found alike) and its gradient is at least four
 * times the frame's median gradient (most pixels are flat, so this tracks the noise).
 * Two passes: |Gx| + |Gy| (Sobel / 8) into `mag`, then suppression and classification, which
 * recomputes the two components of the surviving candidates only.
 */
export function edgeMap(
  image: GreyImage,
  minRelativeGradient: number,
  buffers?: EdgeMapBuffers,
): EdgeMap {
  const { width: w, height: h, data } = image
  const n = w * h
  const mag = buffers && buffers.mag.length >= n ? buffers.mag.subarray(0, n) : new Float32Array(n)
  const kind = buffers && buffers.kind.length >= n ? buffers.kind.subarray(0, n) : new Uint8Array(n)
  mag.fill(0)
  kind.fill(0)
  for (let y = 1; y < h - 1; y++) {
    let i = y * w + 1
    for (let x = 1; x < w - 1; x++, i++) {
      const a = data[i - w - 1]
      const c = data[i - w + 1]
      const g = data[i + w - 1]
      const l = data[i + w + 1]
      const sx = c + 2 * data[i + 1] + l - a - 2 * data[i - 1] - g
      const sy = g + 2 * data[i + w] + l - a - 2 * data[i - w] - c
      mag[i] = (Math.abs(sx) + Math.abs(sy)) * 0.125
    }
  }
  const floor = 4 * medianMagnitude(mag, w, h)
  for (let y = 2; y < h - 2; y++) {
    let i = y * w + 2
    for (let x = 2; x < w - 2; x++, i++) {
      const m = mag[i]
      if (m < floor || m < minRelativeGradient * (data[i] + 0.005)) continue
      const a = data[i - w - 1]
      const c = data[i - w + 1]
      const g = data[i + w - 1]
      const l = data[i + w + 1]
      const ax = Math.abs(c + 2 * data[i + 1] + l - a - 2 * data[i - 1] - g)
      const ay = Math.abs(g + 2 * data[i + w] + l - a - 2 * data[i - w] - c)
      if (ay <= AXIS_TAN * ax) {
        if (m >= mag[i - 1] && m > mag[i + 1]) kind[i] = 1
      } else if (ax <= AXIS_TAN * ay) {
        if (m >= mag[i - w] && m > mag[i + w]) kind[i] = 2
      }
    }
  }
  return { width: w, height: h, kind }
}

/** Median of |gx| + |gy| over the interior, from a 1024-bin histogram up to the maximum. */
function medianMagnitude(mag: Float32Array, w: number, h: number): number {
  let max = 0
  for (let i = 0; i < mag.length; i++) if (mag[i] > max) max = mag[i]
  if (max <= 0) return 0
  const bins = 1024
  const hist = new Uint32Array(bins)
  const scale = (bins - 1) / max
  for (let y = 1; y < h - 1; y++) {
    for (let i = y * w + 1; i < (y + 1) * w - 1; i++) hist[Math.floor(mag[i] * scale)]++
  }
  const half = ((w - 2) * (h - 2)) / 2
  let seen = 0
  for (let b = 0; b < bins; b++) {
    seen += hist[b]
    if (seen >= half) return (b + 0.5) / scale
  }
  return max
}
