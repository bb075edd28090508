import type { PsfEstimate, PsfFit, PsfModel } from '../types'
import { apertureQuadrature, modelEsf, type ApertureQuadrature } from './models'

/** A measured ESF sampled along the edge normal. */
export interface EsfProfile {
  /** Bin values (linear luminance) and the pixels behind each (0 = empty, skipped). */
  values: Float64Array
  counts: Uint32Array
  /** Bin at the fitted edge position. */
  centreIndex: number
  /** Bin spacing along the normal, px (¼ × cos θ for 4× binning of horizontal distance). */
  binNormalPx: number
  /** Edge angle off the axis, radians. */
  angleRad: number
}

export interface PsfFitOptions {
  /** Fit the bins within this normal distance of the edge, px. @default 12 */
  fitHalfWidthPx?: number
  /** At most this many bins enter the fit (evenly strided). @default 64 */
  maxPoints?: number
}

/**
 * Fits a Gaussian σ and a defocus disk R, each convolved with the projected pixel aperture and
 * the bin, to the ESF (not the noisy LSF), with the dark and bright levels solved by linear
 * least squares for each trial size. The size is found by a log-spaced scan and a
 * golden-section refinement. The model with the smaller RMS residual is chosen.
 */
export function fitPsf(profile: EsfProfile, options: PsfFitOptions = {}): PsfEstimate {
  const { fitHalfWidthPx = 12, maxPoints = 64 } = options
  const { values, counts, centreIndex, binNormalPx, angleRad } = profile
  const reach = Math.floor(fitHalfWidthPx / binNormalPx)
  const lo = Math.max(0, centreIndex - reach)
  const hi = Math.min(values.length - 1, centreIndex + reach)
  const stride = Math.max(1, Math.ceil((hi - lo + 1) / maxPoints))
  const us: number[] = []
  const ys: number[] = []
  for (let k = lo; k <= hi; k += stride) {
    if (counts[k] === 0) continue
    us.push((k - centreIndex) * binNormalPx)
    ys.push(values[k])
  }
  if (us.length < 8) throw new RangeError('Too few ESF samples to fit a blur kernel.')
  const data = { u: Float64Array.from(us), y: Float64Array.from(ys) }
  const q = apertureQuadrature(angleRad, binNormalPx)
  const maxSize = Math.max(2, fitHalfWidthPx)
  const gaussian = fitModel('gaussian', data, q, 0.05, maxSize)
  const disk = fitModel('disk', data, q, 0.1, 2 * maxSize)
  const best = disk.rmsResidual < gaussian.rmsResidual ? disk : gaussian
  return {
    model: best.model,
    ...(best.model === 'gaussian' ? { sigmaPx: best.sizePx } : { radiusPx: best.sizePx }),
    rmsResidual: best.rmsResidual,
    gaussian,
    disk,
  }
}

interface FitData {
  u: Float64Array
  y: Float64Array
}

function fitModel(
  model: PsfModel,
  data: FitData,
  q: ApertureQuadrature,
  minSize: number,
  maxSize: number,
): PsfFit {
  const m = new Float64Array(data.u.length)
  const cost = (logSize: number) => residual(model, Math.exp(logSize), data, q, m)
  const a = Math.log(minSize)
  const b = Math.log(maxSize)
  const steps = 10
  let bestI = 0
  let bestC = Infinity
  for (let i = 0; i <= steps; i++) {
    const c = cost(a + ((b - a) * i) / steps).sse
    if (c < bestC) {
      bestC = c
      bestI = i
    }
  }
  let x0 = a + ((b - a) * Math.max(0, bestI - 1)) / steps
  let x3 = a + ((b - a) * Math.min(steps, bestI + 1)) / steps
  const gr = (Math.sqrt(5) - 1) / 2
  let x1 = x3 - gr * (x3 - x0)
  let x2 = x0 + gr * (x3 - x0)
  let c1 = cost(x1).sse
  let c2 = cost(x2).sse
  for (let i = 0; i < 18; i++) {
    if (c1 < c2) {
      x3 = x2
      x2 = x1
      c2 = c1
      x1 = x3 - gr * (x3 - x0)
      c1 = cost(x1).sse
    } else {
      x0 = x1
      x1 = x2
      c1 = c2
      x2 = x0 + gr * (x3 - x0)
      c2 = cost(x2).sse
    }
  }
  const size = Math.exp((x1 + x2) / 2)
  const final = cost(Math.log(size))
  return { model, sizePx: size, rmsResidual: final.rms }
}

/** Least-squares y ≈ A + B·M(u) for one trial size: SSE and RMS relative to the step |B|. */
function residual(
  model: PsfModel,
  size: number,
  data: FitData,
  q: ApertureQuadrature,
  m: Float64Array,
): { sse: number; rms: number } {
  const { u, y } = data
  const n = u.length
  let sm = 0
  let sy = 0
  let smm = 0
  let smy = 0
  for (let i = 0; i < n; i++) {
    const v = modelEsf(model, size, u[i], q)
    m[i] = v
    sm += v
    sy += y[i]
    smm += v * v
    smy += v * y[i]
  }
  const det = n * smm - sm * sm
  const B = det !== 0 ? (n * smy - sm * sy) / det : 0
  const A = (sy - B * sm) / n
  let sse = 0
  for (let i = 0; i < n; i++) {
    const d = y[i] - A - B * m[i]
    sse += d * d
  }
  return { sse, rms: Math.sqrt(sse / n) / Math.max(Math.abs(B), 1e-12) }
}
