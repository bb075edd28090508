// Invented measurements and regions for the result-screen tests. MTF curves are Gaussian
// (exp(−2π²σ²f²) with σ = 0.187391 / MTF50, DOMAIN.md [calc]); nothing here is an oracle
// for the engine itself.
import type { EdgeMeasurement, EdgeWarning, PsfModel } from '@shared/analysis'
import type { CameraModel } from '@shared/schemas/catalog'
import type { CheckContext } from '../logic/report'
import type { RegionState } from '../logic/regionRules'
import { sampleCamera, sampleTask } from '@/db/__tests__/sampleCatalog'

let n = 0

export function measurement(
  mtf50: number | null,
  options: {
    warnings?: EdgeWarning[]
    orientation?: 'vertical' | 'horizontal'
    psf?: { model: PsfModel; sizePx: number }
  } = {},
): EdgeMeasurement {
  const sigma = mtf50 ? 0.187391 / mtf50 : 3
  const curve: [number, number][] = []
  for (let k = 0; k <= 100; k++) {
    const f = k / 100
    curve.push([f, Math.exp(-2 * Math.PI ** 2 * sigma ** 2 * f * f)])
  }
  const psf = options.psf ?? { model: 'gaussian' as const, sizePx: sigma }
  return {
    roi: { x: 10 * ++n, y: 20, w: 120, h: 100 },
    orientation: options.orientation ?? 'vertical',
    polarity: 'rising',
    angleDeg: 5,
    mtf50,
    mtf50p: mtf50,
    mtf10: mtf50 ? mtf50 * 1.82 : null,
    mtfNyquist: curve[50][1],
    mtf: curve,
    rise1090Px: 2.563103 * sigma,
    overshoot: 0,
    undershoot: 0,
    noise: 0.002,
    snr: 300,
    contrast: 0.6,
    rowsUsed: 92,
    psf: {
      model: psf.model,
      ...(psf.model === 'gaussian' ? { sigmaPx: psf.sizePx } : { radiusPx: psf.sizePx }),
      rmsResidual: 0.002,
      gaussian: { model: 'gaussian', sizePx: sigma, rmsResidual: 0.002 },
      disk: { model: 'disk', sizePx: 2 * sigma, rmsResidual: 0.004 },
    },
    warnings: options.warnings ?? [],
  }
}

export function region(
  m: EdgeMeasurement | null,
  overrides: Partial<RegionState> = {},
): RegionState {
  return {
    id: crypto.randomUUID(),
    roi: m?.roi ?? { x: 0, y: 0, w: 64, h: 64 },
    source: 'found',
    enabled: true,
    status: m ? 'measured' : 'failed',
    measurement: m,
    profile: m ? { xPx: [-1, 0, 1], esf: [0, 0.5, 1], lsf: [0.5, 1, 0.5] } : null,
    error: m ? null : 'No usable edge in the region: both sides are equally bright.',
    ...overrides,
  }
}

export function model(overrides: Partial<CameraModel> = {}): CameraModel {
  return {
    id: 1,
    name: 'Test Bullet 4MP',
    sensorWidthPx: 2688,
    sensorHeightPx: 1520,
    pixelPitchUm: 2.9,
    focalLengthMinMm: 2.8,
    focalLengthMaxMm: 12,
    fNumber: 1.4,
    updatedAt: '2025-03-01T08:00:00.000Z',
    ...overrides,
  }
}

/** Camera: observe task, minimum MTF50 0.20 c/p, 62.5 px/m, 4 mm lens, target at 10 m. */
export function context(overrides: Partial<CheckContext> = {}): CheckContext {
  return {
    camera: sampleCamera(1),
    task: sampleTask(),
    model: model(),
    baselineMtf50CyPx: null,
    otherModeMtf50CyPx: null,
    ...overrides,
  }
}
