import { describe, expect, it } from 'vitest'
import { linearisationTable, linearToSrgb, parseTransfer, srgbToLinear } from '../transfer'

describe('linearisation of code values', () => {
  it('decodes sRGB with the IEC 61966-2-1 piecewise curve', () => {
    // IEC 61966-2-1: V ≤ 0.04045 → V/12.92, else ((V + 0.055)/1.055)^2.4 (values computed here).
    expect(srgbToLinear(0)).toBe(0)
    expect(srgbToLinear(1)).toBeCloseTo(1, 12)
    expect(srgbToLinear(0.04045)).toBeCloseTo(0.04045 / 12.92, 12) // 0.0031308, the breakpoint
    expect(srgbToLinear(0.5)).toBeCloseTo(Math.pow(0.555 / 1.055, 2.4), 12) // 0.214041
    expect(srgbToLinear(0.5)).toBeCloseTo(0.214041, 6)
  })

  it('inverts its own encoding to 1e-9 across the range', () => {
    for (let v = 0; v <= 1; v += 0.01) expect(linearToSrgb(srgbToLinear(v))).toBeCloseTo(v, 9)
  })

  it('builds 256- and 65 536-entry tables that match the formula at every code', () => {
    const t8 = linearisationTable({ kind: 'srgb' }, 8)
    const t16 = linearisationTable({ kind: 'srgb' }, 16)
    expect(t8).toHaveLength(256)
    expect(t16).toHaveLength(65536)
    for (let c = 0; c < 256; c++) expect(t8[c]).toBeCloseTo(srgbToLinear(c / 255), 6)
    for (const c of [0, 1, 2650, 32768, 65535])
      expect(t16[c]).toBeCloseTo(srgbToLinear(c / 65535), 6)
  })

  it('applies a stated gamma and passes linear data through', () => {
    const g = linearisationTable({ kind: 'gamma', gamma: 2.2 }, 8)
    expect(g[128]).toBeCloseTo(Math.pow(128 / 255, 2.2), 6)
    const lin = linearisationTable({ kind: 'linear' }, 16)
    expect(lin[12345]).toBeCloseTo(12345 / 65535, 7)
  })

  it('parses srgb, linear and gamma:G and rejects anything else with the accepted forms', () => {
    expect(parseTransfer('srgb')).toEqual({ kind: 'srgb' })
    expect(parseTransfer('LINEAR')).toEqual({ kind: 'linear' })
    expect(parseTransfer('gamma:2.2')).toEqual({ kind: 'gamma', gamma: 2.2 })
    for (const bad of ['rec709', 'gamma:', 'gamma:-1', 'gamma:0', 'gamma:abc', '']) {
      expect(() => parseTransfer(bad)).toThrow(/use srgb, linear or gamma:G/)
    }
  })
})
