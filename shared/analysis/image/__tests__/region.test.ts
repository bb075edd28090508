import { describe, expect, it } from 'vitest'
import { clippedFraction, clipThresholds } from '../clipping'
import { cropGrey, transposeGrey } from '../crop'

const ramp = (w: number, h: number) => ({
  width: w,
  height: h,
  data: Float32Array.from({ length: w * h }, (_, i) => i),
})

describe('regions of a grey image', () => {
  it('crops a region row by row', () => {
    const c = cropGrey(ramp(5, 4), { x: 1, y: 2, w: 3, h: 2 })
    expect(c.width).toBe(3)
    expect(Array.from(c.data)).toEqual([11, 12, 13, 16, 17, 18])
  })

  it('transposes so that a horizontal edge becomes vertical', () => {
    const t = transposeGrey(ramp(3, 2))
    expect([t.width, t.height]).toEqual([2, 3])
    expect(Array.from(t.data)).toEqual([0, 3, 1, 4, 2, 5])
  })

  it('refuses a region that leaves the image, with the sizes in the message', () => {
    expect(() => cropGrey(ramp(5, 4), { x: 3, y: 0, w: 3, h: 2 })).toThrow(
      /3,0,3,2 does not lie inside the 5 × 4 image/,
    )
    expect(() => cropGrey(ramp(5, 4), { x: 0.5, y: 0, w: 3, h: 2 })).toThrow(RangeError)
  })

  it('counts pixels at the code-value extremes as clipped', () => {
    const data = new Float32Array(200).fill(0.5)
    data[0] = 0 // code 0
    data[1] = 1 // code 255
    data[2] = 0.0002 // above code 0.5 (0.000152 linear in sRGB): not clipped
    const img = { width: 20, height: 10, data }
    expect(clippedFraction(img)).toBeCloseTo(2 / 200, 12)
    expect(clippedFraction(img, { x: 5, y: 5, w: 5, h: 5 })).toBe(0)
  })

  it('puts the thresholds half a code value inside the extremes of the encoding', () => {
    const t8 = clipThresholds()
    // sRGB code 254.5/255 → ((0.99804 + 0.055)/1.055)^2.4 = 0.99548 (IEC 61966-2-1, computed here)
    expect(t8.high).toBeCloseTo(Math.pow((254.5 / 255 + 0.055) / 1.055, 2.4), 9)
    const t16 = clipThresholds({ transfer: { kind: 'linear' }, bitDepth: 16 })
    expect(t16.low).toBeCloseTo(0.5 / 65535, 12)
    expect(t16.high).toBeCloseTo(65534.5 / 65535, 12)
  })
})
