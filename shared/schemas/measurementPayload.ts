// One measured edge as the server stores it (an item of `check.create`'s `measurements`).
import type { EdgeMeasurement } from '../analysis/types'
import type { CheckCreatePayload } from './checks'

export type MeasurementPayload = CheckCreatePayload['measurements'][number]

/** The payload of an engine measurement with an MTF50 (the caller leaves out those without). */
export function measurementPayload(id: string, m: EdgeMeasurement): MeasurementPayload {
  return {
    id,
    roi: m.roi,
    orientation: m.orientation,
    angleDeg: m.angleDeg,
    mtf50CyPx: m.mtf50!,
    mtf50pCyPx: m.mtf50p,
    mtf10CyPx: m.mtf10,
    mtfNyquist: m.mtfNyquist,
    rise1090Px: m.rise1090Px,
    overshoot: m.overshoot,
    noise: m.noise,
    psf: {
      model: m.psf.model,
      sigmaPx: m.psf.sigmaPx ?? null,
      radiusPx: m.psf.radiusPx ?? null,
      rmsResidual: m.psf.rmsResidual,
    },
    mtfCurve: m.mtf,
    warnings: m.warnings,
  }
}
