import { describe, expect, it } from 'vitest'
import { encodeCameraLabel, encodeTargetPayload } from '@shared/target'
import { targetScanOutcome } from '../targetScanOutcome'

const problemOf = (text: string) => {
  const outcome = targetScanOutcome(text)
  if (outcome.kind !== 'problem') throw new Error(`expected a problem for ${text}`)
  return outcome
}

describe('a code scanned for the target in the frame', () => {
  it('is taken when it is a Sharpfield target code, with its id and printed size', () => {
    const text = encodeTargetPayload({ id: 'SFT-7K2M9Q', widthMm: 215.9, heightMm: 279.4 })
    expect(targetScanOutcome(text)).toEqual({
      kind: 'target',
      target: { id: 'SFT-7K2M9Q', widthMm: 215.9, heightMm: 279.4 },
    })
    expect(targetScanOutcome(`  ${text};note=later\n`)).toMatchObject({ kind: 'target' })
  })

  it('is refused when it is a camera label, naming the camera', () => {
    const outcome = problemOf(encodeCameraLabel({ assetTag: 'HBR-004' }))
    expect(outcome.problem).toBe('camera')
    expect(outcome.message).toMatch(/label of camera HBR-004, not a target code/)
    expect(outcome.message).toMatch(/type the target id and sheet width/)
    // A camera label this version cannot read is still a camera label here.
    expect(problemOf('sharpfield-camera:v2;tag=HBR-004')).toMatchObject({
      problem: 'camera',
      message: expect.stringMatching(/^This is a camera label, not a target code/),
    })
  })

  it('is refused when it is someone else’s code', () => {
    const outcome = problemOf('https://example.test/parking/level-2')
    expect(outcome.problem).toBe('foreign')
    expect(outcome.message).toMatch(/not a Sharpfield target code/)
    expect(problemOf('')).toMatchObject({ problem: 'foreign' })
  })

  it('is refused with the reason when it is a damaged or newer target code', () => {
    const damaged = problemOf('sharpfield-target:v1;id=SFT-7K2M9Q;w=wide;h=297')
    expect(damaged.problem).toBe('damaged')
    expect(damaged.message).toMatch(
      /not a plain number of millimetres.*Try the target's code again/,
    )
    expect(problemOf('sharpfield-target:v2;id=SFT-7K2M9Q')).toMatchObject({
      problem: 'damaged',
      message: expect.stringMatching(/newer version of Sharpfield/),
    })
  })
})
