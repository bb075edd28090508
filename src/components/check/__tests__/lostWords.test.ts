import { describe, expect, it } from 'vitest'
import { lostFrequencyWords } from '../logic/lostWords'

// Periods follow from the frequency: 1 / f px, and at d px/m, 1000 / (f · d) mm [calc].

const band = (from: number, to: number) => ({
  fromCyPx: from,
  toCyPx: to,
  deepestCyPx: to,
  minMagnitude: 0,
})

describe('the lost frequencies in words', () => {
  it('names the band up to Nyquist as stripe periods in pixels and millimetres at the target', () => {
    const words = lostFrequencyWords(
      { thresholdMagnitude: 0.1, maxCyPx: 0.5, bands: [band(0.25, 0.5)], zerosCyPx: [] },
      500,
      'gaussian',
    )
    expect(words).toEqual([
      'Detail finer than stripes 4.0 px ≈ 8 mm at the target apart (above 0.25 c/p, up to Nyquist) is below the noise floor: no restoration brings it back.',
    ])
  })

  it('names the first zero of a defocus disk only, not the rounding of a sampled Gaussian', () => {
    const lost = {
      thresholdMagnitude: 0.1,
      maxCyPx: 0.5,
      bands: [band(0.15, 0.5)],
      zerosCyPx: [0.2033, 0.3722],
    }
    const disk = lostFrequencyWords(lost, null, 'disk')
    expect(disk).toHaveLength(2)
    expect(disk[1]).toMatch(/^At 0\.203 c\/p \(stripes 4\.9 px apart\) the kernel passes nothing/)
    expect(lostFrequencyWords(lost, null, 'gaussian')).toHaveLength(1)
  })

  it('says so when nothing below Nyquist is lost', () => {
    const words = lostFrequencyWords(
      { thresholdMagnitude: 0.1, maxCyPx: 0.5, bands: [], zerosCyPx: [] },
      null,
      'gaussian',
    )
    expect(words[0]).toMatch(/weakened, not lost/)
  })
})
