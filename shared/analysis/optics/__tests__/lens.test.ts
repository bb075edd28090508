import { describe, expect, it } from 'vitest'
import { backFocusToleranceUm, blurFromSensorShiftUm } from '../backFocus'
import { blurCircleDiameterUm } from '../blurCircle'
import { depthOfField, hyperfocalDistanceM } from '../depthOfField'
import { focusErrorFromDiskRadius } from '../focusError'

describe('blur circle (thin lens, DOMAIN.md [calc])', () => {
  it('is 4.5751 µm for F = 8 mm, f/1.4, focused at 10 m, object at 5 m', () => {
    // c = (8²/1.4)·5000 / (5000·9992) mm = 4.5751 µm
    expect(
      blurCircleDiameterUm({
        focalLengthMm: 8,
        fNumber: 1.4,
        focusDistanceM: 10,
        objectDistanceM: 5,
      }),
    ).toBeCloseTo(4.5751, 4)
  })

  it('is zero in the focus plane and grows with the dioptric error', () => {
    const base = { focalLengthMm: 8, fNumber: 1.4, focusDistanceM: 10 }
    expect(blurCircleDiameterUm({ ...base, objectDistanceM: 10 })).toBe(0)
    // Far object: the limit at infinity is F²/(N(s − F)) = 64/(1.4·9992) mm = 4.5751 µm as well,
    // because 1/5 − 1/10 = 1/10 − 0 (same dioptric error).
    expect(blurCircleDiameterUm({ ...base, objectDistanceM: 1e12 })).toBeCloseTo(4.5751, 4)
  })

  it('rejects a focus distance inside the focal length and non-positive values', () => {
    expect(() =>
      blurCircleDiameterUm({
        focalLengthMm: 8,
        fNumber: 1.4,
        focusDistanceM: 0.005,
        objectDistanceM: 5,
      }),
    ).toThrow(
      new RangeError('The focus distance (5 mm) must be longer than the focal length (8 mm).'),
    )
    expect(() =>
      blurCircleDiameterUm({
        focalLengthMm: 8,
        fNumber: 0,
        focusDistanceM: 10,
        objectDistanceM: 5,
      }),
    ).toThrow(new RangeError('fNumber must be a positive finite number (got 0).'))
  })
})

describe('back focus (DOMAIN.md [calc])', () => {
  it('turns a 20 µm sensor shift at f/1.4 into a 14.29 µm blur circle (δ/N)', () => {
    // δ/N = 20/1.4 = 14.2857 µm. DOMAIN.md prints 14.27 µm, 0.1 % lower: we follow the formula.
    const c = blurFromSensorShiftUm({ sensorShiftUm: 20, fNumber: 1.4 })
    expect(c).toBeCloseTo(20 / 1.4, 12)
    expect(Math.abs(c / 14.27 - 1)).toBeLessThan(0.002)
  })

  it('allows ±8.1 µm for a blur circle of at most 5.8 µm at f/1.4', () => {
    expect(backFocusToleranceUm({ maxBlurUm: 5.8, fNumber: 1.4 })).toBeCloseTo(8.12, 2) // 5.8·1.4
  })

  it('applies the exact factor (1 − F/s) when the focus distance is given', () => {
    // Image distance v = F·s/(s − F); cone width δ·(F/N)/v = (δ/N)(1 − F/s).
    const c = blurFromSensorShiftUm({
      sensorShiftUm: 20,
      fNumber: 1.4,
      focalLengthMm: 8,
      focusDistanceM: 2,
    })
    expect(c).toBeCloseTo((20 / 1.4) * (1 - 8 / 2000), 12)
    expect(
      backFocusToleranceUm({ maxBlurUm: c, fNumber: 1.4, focalLengthMm: 8, focusDistanceM: 2 }),
    ).toBeCloseTo(20, 12)
  })
})

describe('depth of field (DOMAIN.md handbook case [calc])', () => {
  const lens = { focalLengthMm: 50, fNumber: 8, circleOfConfusionUm: 30 }

  it('gives a hyperfocal distance of 10 466.7 mm for 50 mm, f/8, c = 0.03 mm', () => {
    // H = 50²/(8·0.03) + 50 = 10 416.7 + 50 mm
    expect(hyperfocalDistanceM(lens) * 1000).toBeCloseTo(10466.7, 1)
  })

  it('gives near 3389.4 mm and far 9527.4 mm when focused at 5 m', () => {
    const dof = depthOfField({ ...lens, focusDistanceM: 5 })
    expect(dof.nearM * 1000).toBeCloseTo(3389.4, 1)
    expect(dof.farM * 1000).toBeCloseTo(9527.4, 1)
    expect(dof.depthM).toBeCloseTo(dof.farM - dof.nearM, 12)
  })

  it('reaches infinity when focused at the hyperfocal distance, with the near limit near H/2', () => {
    const H = hyperfocalDistanceM(lens)
    const dof = depthOfField({ ...lens, focusDistanceM: H })
    expect(dof.farM).toBe(Infinity)
    // near = H(H − F)/(2H − 2F) = H/2 exactly.
    expect(dof.nearM).toBeCloseTo(H / 2, 12)
  })
})

describe('focus error from a disk radius', () => {
  // DOMAIN.md example run backwards: F = 8 mm, f/1.4, target at 5 m, pitch 2.9 µm;
  // a lens focused at 10 m blurs the target into c = 4.5751 µm → R = c / (2·2.9 µm).
  const c = blurCircleDiameterUm({
    focalLengthMm: 8,
    fNumber: 1.4,
    focusDistanceM: 10,
    objectDistanceM: 5,
  })
  const input = {
    radiusPx: c / 2 / 2.9,
    pixelPitchUm: 2.9,
    focalLengthMm: 8,
    fNumber: 1.4,
    targetDistanceM: 5,
  }

  it('recovers the 10 m focus distance as the farther candidate', () => {
    const e = focusErrorFromDiskRadius(input)
    expect(e.blurCircleUm).toBeCloseTo(4.5751, 4)
    expect(e.farther?.focusDistanceM).toBeCloseTo(10, 9)
    expect(e.farther?.dioptricError).toBeCloseTo(0.1, 9) // |1/5 − 1/10| per metre
  })

  it('returns a nearer candidate that gives the same blur circle (the sign is ambiguous)', () => {
    const e = focusErrorFromDiskRadius(input)
    expect(e.nearer.focusDistanceM).toBeLessThan(5)
    const back = blurCircleDiameterUm({
      focalLengthMm: 8,
      fNumber: 1.4,
      focusDistanceM: e.nearer.focusDistanceM,
      objectDistanceM: 5,
    })
    expect(back).toBeCloseTo(c, 9)
  })

  it('has no farther candidate when even infinity focus blurs less than measured', () => {
    // At infinity focus the blur at 5 m is F²/(N·d) ≈ 9.14 µm; 20 µm cannot come from focusing farther.
    const e = focusErrorFromDiskRadius({ ...input, radiusPx: 10 / 2.9 })
    expect(e.farther).toBeNull()
    expect(e.nearer.focusDistanceM).toBeLessThan(5)
  })
})
