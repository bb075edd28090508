import { describe, expect, it } from 'vitest'
import { loadReference } from '../../../../tests/fixtures/reference/load'
import { BORDER_RULES, type BorderRule } from '../border'
import { convolve2d, correlate2d } from '../convolve2d'
import { convolveSeparable } from '../separable'

interface Case2D {
  width: number
  height: number
  image: number[]
  kernel: { width: number; height: number; data: number[] }
  scipyConvolve: Record<BorderRule, number[]>
  opencvCorrelate: Record<BorderRule, number[]>
}
const ref = loadReference<{ convolve2d: Case2D[] }>('convolve.json')

function asImage(c: Case2D) {
  return { width: c.width, height: c.height, data: Float64Array.from(c.image) }
}

describe('convolve2d and correlate2d', () => {
  for (const c of ref.convolve2d) {
    const size = `${c.width}×${c.height} image, ${c.kernel.width}×${c.kernel.height} kernel`
    it(`match scipy.ndimage.convolve and OpenCV filter2D under every border rule (${size})`, () => {
      for (const border of BORDER_RULES) {
        const out = new Float64Array(c.width * c.height)
        convolve2d(asImage(c), c.kernel, { border, output: out })
        // Source: convolve.json, scipy.ndimage.convolve (modes constant/nearest/mirror/reflect/wrap).
        c.scipyConvolve[border].forEach((v, i) => expect(out[i]).toBeCloseTo(v, 9))
        correlate2d(asImage(c), c.kernel, { border, output: out })
        // Source: convolve.json, cv2.filter2D (BORDER_WRAP through cv2.copyMakeBorder).
        c.opencvCorrelate[border].forEach((v, i) => expect(out[i]).toBeCloseTo(v, 9))
      }
    })
  }

  it('returns Float32 output by default and reads Uint8 input', () => {
    const image = { width: 3, height: 1, data: Uint8Array.from([10, 20, 30]) }
    const out = convolve2d(image, { width: 3, height: 1, data: [0, 1, 0] })
    expect(out.data).toBeInstanceOf(Float32Array)
    expect(Array.from(out.data)).toEqual([10, 20, 30]) // identity kernel
  })

  it('rejects kernels without a centre and images whose data does not match their size', () => {
    const image = { width: 2, height: 2, data: new Float32Array(4) }
    expect(() => convolve2d(image, { width: 2, height: 3, data: new Float64Array(6) })).toThrow(
      new RangeError(
        'The kernel must have odd width and height so that it has a centre sample (got 2 × 3).',
      ),
    )
    expect(() =>
      convolve2d(
        { width: 3, height: 2, data: new Float32Array(4) },
        { width: 1, height: 1, data: [1] },
      ),
    ).toThrow(new RangeError('The image data holds 4 samples, but 3 × 2 needs 6.'))
  })
})

describe('convolveSeparable', () => {
  const c = ref.convolve2d[0]
  const kx = [0.25, -0.5, 1, 0.125, 0.3]
  const ky = [1, 2, -1]
  const outer = { width: 5, height: 3, data: ky.flatMap((a) => kx.map((b) => a * b)) }

  for (const border of BORDER_RULES) {
    it(`equals 2-D convolution with the outer-product kernel (${border})`, () => {
      // Identity: (ky ⊗ kx) * I = ky *_y (kx *_x I), also at the border, because every rule
      // pads each axis independently.
      const a = new Float64Array(c.width * c.height)
      const b = new Float64Array(c.width * c.height)
      convolveSeparable(asImage(c), kx, ky, { border, output: a })
      convolve2d(asImage(c), outer, { border, output: b })
      a.forEach((v, i) => expect(v).toBeCloseTo(b[i], 9))
    })
  }

  it('names the kernel that is wrong', () => {
    expect(() => convolveSeparable(asImage(c), [1], [1, 1])).toThrow(
      new RangeError(
        'The vertical kernel must have an odd length so that it has a centre sample (got 2).',
      ),
    )
  })
})
