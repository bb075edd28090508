import type { EdgeMeasurement } from '../types'

export interface MotionBlurHint {
  /** True when one orientation is much softer than the other. */
  suspected: boolean
  /** Direction of the suspected motion: along x blurs vertical edges, along y horizontal ones. */
  direction: 'horizontal' | 'vertical' | null
  /** Softer / sharper median MTF50 (1 = isotropic); null without both orientations. */
  ratio: number | null
  verticalMtf50: number | null
  horizontalMtf50: number | null
}

/**
 * Compares the median MTF50 of the vertical and horizontal edges of one frame. Defocus is
 * isotropic, motion blur is directional (DOMAIN.md): a ratio below `threshold` (default 0.75,
 * our starting value) hints at motion or vibration rather than focus.
 */
export function motionBlurHint(
  edges: Pick<EdgeMeasurement, 'orientation' | 'mtf50'>[],
  threshold = 0.75,
): MotionBlurHint {
  const med = (o: 'vertical' | 'horizontal') => {
    const v = edges
      .filter((e) => e.orientation === o && e.mtf50 !== null)
      .map((e) => e.mtf50 as number)
      .sort((a, b) => a - b)
    if (v.length === 0) return null
    const mid = v.length >> 1
    return v.length % 2 ? v[mid] : (v[mid - 1] + v[mid]) / 2
  }
  const verticalMtf50 = med('vertical')
  const horizontalMtf50 = med('horizontal')
  if (verticalMtf50 === null || horizontalMtf50 === null) {
    return { suspected: false, direction: null, ratio: null, verticalMtf50, horizontalMtf50 }
  }
  const ratio = Math.min(verticalMtf50, horizontalMtf50) / Math.max(verticalMtf50, horizontalMtf50)
  const suspected = ratio < threshold
  // Vertical edges are softer → blur along x → horizontal motion.
  const direction = suspected ? (verticalMtf50 < horizontalMtf50 ? 'horizontal' : 'vertical') : null
  return { suspected, direction, ratio, verticalMtf50, horizontalMtf50 }
}
