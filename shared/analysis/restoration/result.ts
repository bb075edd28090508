/** Shown with every restored image: it is an interpretation, not a record. */
export const RESTORATION_LABEL = 'illustrative — not evidential'

export interface RestorationResult {
  /** The restored image, same size as the input, Float32 (not clipped). */
  image: { width: number; height: number; data: Float32Array }
  method: 'wiener' | 'richardson-lucy'
  /** Everything needed to log and repeat the restoration. */
  parameters: Record<string, number | string | boolean>
  label: typeof RESTORATION_LABEL
}
