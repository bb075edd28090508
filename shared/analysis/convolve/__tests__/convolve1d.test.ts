import { describe, expect, it } from 'vitest'
import { loadReference } from '../../../../tests/fixtures/reference/load'
import { BORDER_RULES, type BorderRule } from '../border'
import { convolve1d, correlate1d } from '../convolve1d'

interface Case1D {
  label: string
  signal: number[]
  kernel: number[]
  convolve: Record<BorderRule, number[]>
}
const ref = loadReference<{ convolve1d: Case1D[] }>('convolve.json')

describe('convolve1d', () => {
  // DOMAIN.md "Boundary rules" oracle [calc]: x = [5,0,0,0,0,0,0,9], k = [0.2,0.6,0.2].
  const x = [5, 0, 0, 0, 0, 0, 0, 9]
  const k = [0.2, 0.6, 0.2]
  const firstLast: Record<BorderRule, [number, number]> = {
    wrap: [4.8, 6.4], // 0.6·5 + 0.2·9 = 4.8; 0.6·9 + 0.2·5 = 6.4
    zero: [3, 5.4], // 0.6·5; 0.6·9
    replicate: [4, 7.2], // 0.8·5; 0.8·9
    reflect101: [3, 5.4], // neighbour mirrored is x[1] = 0
    symmetric: [4, 7.2], // neighbour mirrored is x[0] itself
  }
  for (const border of BORDER_RULES) {
    it(`gives DOMAIN.md's first and last samples with the ${border} border`, () => {
      const y = convolve1d(x, k, { border })
      expect(y[0]).toBeCloseTo(firstLast[border][0], 12)
      expect(y[7]).toBeCloseTo(firstLast[border][1], 12)
      // Interior samples do not depend on the border rule: y[1] = 0.2·5.
      expect(y[1]).toBeCloseTo(1, 12)
    })
  }

  for (const c of ref.convolve1d) {
    it(`matches scipy.ndimage.convolve1d in every mode: ${c.label}`, () => {
      for (const border of BORDER_RULES) {
        const y = convolve1d(c.signal, c.kernel, { border })
        // Source: tests/fixtures/reference/convolve.json (scipy.ndimage.convolve1d).
        const expected = c.convolve[border]
        for (let i = 0; i < y.length; i++) expect(y[i]).toBeCloseTo(expected[i], 10)
      }
    })
  }

  it('correlates without flipping the kernel', () => {
    // By definition: correlation with k equals convolution with k reversed.
    const kernel = [1, 2, 4]
    const a = correlate1d([0, 0, 1, 0, 0], kernel, { border: 'zero' })
    expect(Array.from(a)).toEqual([0, 4, 2, 1, 0])
    const b = convolve1d([0, 0, 1, 0, 0], kernel, { border: 'zero' })
    expect(Array.from(b)).toEqual([0, 1, 2, 4, 0])
  })

  it('writes into a caller-owned output buffer', () => {
    const out = new Float64Array(8)
    const y = convolve1d(x, k, { border: 'wrap', output: out })
    expect(y).toBe(out)
  })

  it('rejects even kernels, empty signals, unknown borders and non-finite values', () => {
    expect(() => convolve1d(x, [0.5, 0.5])).toThrow(
      new RangeError('The kernel must have an odd length so that it has a centre sample (got 2).'),
    )
    expect(() => convolve1d([], k)).toThrow(new RangeError('The signal must not be empty.'))
    expect(() => convolve1d(x, k, { border: 'mirror' as BorderRule })).toThrow(
      new TypeError(
        'Unknown border rule "mirror": use one of zero, replicate, reflect101, symmetric, wrap.',
      ),
    )
    expect(() => convolve1d([1, Number.NaN], k)).toThrow(
      new RangeError('The signal holds a value that is not a finite number at index 1.'),
    )
    expect(() => convolve1d(x, k, { output: new Float64Array(3) })).toThrow(
      new RangeError("The output must have the signal's length 8 (got 3)."),
    )
  })
})
