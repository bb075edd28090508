import { describe, expect, it } from 'vitest'
import { srgbHex, TARGET_DARK, TARGET_LIGHT, targetContrastRatio } from '../colours'

// Oracle written out from the standard, independent of the engine's implementation:
// IEC 61966-2-1 inverse sRGB, V ≤ 0.04045 → V/12.92, else ((V + 0.055)/1.055)^2.4 [std].
function iecInverseSrgb(code8: number): number {
  const v = code8 / 255
  return v <= 0.04045 ? v / 12.92 : ((v + 0.055) / 1.055) ** 2.4
}

describe('target greys', () => {
  it('are neutral greys', () => {
    for (const c of [TARGET_DARK, TARGET_LIGHT]) expect(c.r === c.g && c.g === c.b).toBe(true)
  })

  it('print the dark squares at reflectance ≈ 0.2 and the panel at ≈ 0.8 in linear light', () => {
    // Nominal reflectances 0.2 and 0.8 [ours]; 124 → 0.2016, 232 → 0.8070 [calc, IEC 61966-2-1].
    expect(iecInverseSrgb(TARGET_DARK.g)).toBeCloseTo(0.2016, 4)
    expect(iecInverseSrgb(TARGET_LIGHT.g)).toBeCloseTo(0.807, 3)
  })

  it('give a 4:1 contrast in linear light, not in code values', () => {
    const ratio = iecInverseSrgb(TARGET_LIGHT.g) / iecInverseSrgb(TARGET_DARK.g)
    expect(ratio).toBeCloseTo(4.0, 1) // 4.0036 [calc]
    expect(Math.abs(ratio - 4)).toBeLessThan(0.01)
    expect(TARGET_LIGHT.g / TARGET_DARK.g).toBeLessThan(2) // code-value ratio is only 1.87
    expect(targetContrastRatio()).toBeCloseTo(ratio, 6)
  })

  it('are written as hex for SVG', () => {
    expect(srgbHex(TARGET_DARK)).toBe('#7c7c7c')
    expect(srgbHex(TARGET_LIGHT)).toBe('#e8e8e8')
  })
})
