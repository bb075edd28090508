import { describe, expect, it } from 'vitest'
import {
  isValidRegion,
  regionProblems,
  representativeRegion,
  verdictEdges,
} from '../logic/regionRules'
import { measurement, region } from './samples'

describe('which regions count', () => {
  it('counts a measured region unless a warning makes its MTF untrustworthy', () => {
    expect(isValidRegion(region(measurement(0.2)))).toBe(true)
    expect(
      isValidRegion(region(measurement(0.2, { warnings: ['low-contrast', 'sharpening'] }))),
    ).toBe(true)
    for (const w of ['roi-too-narrow', 'few-phase-cycles', 'critical-angle', 'clipping'] as const) {
      expect(isValidRegion(region(measurement(0.2, { warnings: [w] })))).toBe(false)
    }
    expect(isValidRegion(region(measurement(null)))).toBe(false)
    expect(isValidRegion(region(null))).toBe(false)
    expect(isValidRegion(region(measurement(0.2), { status: 'measuring' }))).toBe(false)
  })

  it('explains each problem in plain words, rejecting ones first', () => {
    const problems = regionProblems(
      region(measurement(0.2, { warnings: ['sharpening', 'clipping'] })),
    )
    expect(problems.map((p) => [p.short, p.rejects])).toEqual([
      ['clipped', true],
      ['sharpened', false],
    ])
    expect(problems[0].text).toBe(
      'More than 0.5 % of the region is clipped to black or white; reduce exposure.',
    )
    const failed = regionProblems(region(null))
    expect(failed).toEqual([
      {
        text: 'No usable edge in the region: both sides are equally bright.',
        short: 'no usable edge in the region',
        rejects: true,
      },
    ])
  })

  it('hands the verdict the enabled regions only', () => {
    const edges = verdictEdges([
      region(measurement(0.2)),
      region(measurement(0.1), { enabled: false }),
      region(measurement(0.3, { warnings: ['few-phase-cycles'] })),
      region(measurement(0.3), { status: 'measuring' }),
    ])
    expect(edges.map((e) => [e.valid, e.mtf50CyPx, e.warnings])).toEqual([
      [true, 0.2, []],
      [false, 0.3, ['too few phase cycles']],
    ])
  })

  it('picks the valid region nearest the median MTF50 to stand for the frame', () => {
    const regions = [0.1, 0.2, 0.26, 0.3].map((m) => region(measurement(m)))
    // Median of 0.1, 0.2, 0.26, 0.3 is 0.23; 0.2 and 0.26 are 0.03 away: the first wins.
    expect(representativeRegion(regions)?.measurement?.mtf50).toBe(0.2)
    expect(representativeRegion([region(measurement(0.2), { enabled: false })])).toBeNull()
  })
})
