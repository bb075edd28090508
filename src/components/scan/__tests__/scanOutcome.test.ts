import { describe, expect, it } from 'vitest'
import { encodeCameraLabel, encodeTargetPayload } from '@shared/target'
import { sampleCamera } from '@/db/__tests__/sampleCatalog'
import { cameraByAssetTag, scanOutcome } from '../scanOutcome'

const catalog = [
  sampleCamera(1, { assetTag: 'MTD-001' }),
  sampleCamera(2, { assetTag: 'MTD-002' }),
  sampleCamera(3, { assetTag: 'north/gate.3' }),
]

describe('a scanned label', () => {
  it('selects the camera of this device whose asset tag it carries', () => {
    expect(scanOutcome(encodeCameraLabel({ assetTag: 'MTD-002' }), catalog)).toEqual({
      kind: 'camera',
      camera: catalog[1],
    })
    expect(scanOutcome('sharpfield-camera:v1;tag=north/gate.3', catalog)).toMatchObject({
      kind: 'camera',
      camera: { id: 3 },
    })
  })

  it('matches asset tags regardless of letter case, preferring an exact match', () => {
    expect(cameraByAssetTag(catalog, 'mtd-001')?.id).toBe(1)
    const both = [sampleCamera(7, { assetTag: 'ab-1' }), sampleCamera(8, { assetTag: 'AB-1' })]
    expect(cameraByAssetTag(both, 'AB-1')?.id).toBe(8)
    expect(cameraByAssetTag(catalog, 'MTD-0011')).toBeNull()
  })

  it('names a camera that is not in this device’s catalog and says what to do', () => {
    const outcome = scanOutcome(encodeCameraLabel({ assetTag: 'FFY-099' }), catalog)
    expect(outcome).toMatchObject({ kind: 'problem', problem: 'not-on-device' })
    if (outcome.kind !== 'problem') throw new Error('expected a problem')
    expect(outcome.message).toMatch(/FFY-099 is not among the 3 cameras saved on this device/)
    expect(outcome.message).toMatch(/refresh the camera list/)
  })

  it('says the camera list is missing when the device has none yet', () => {
    const outcome = scanOutcome(encodeCameraLabel({ assetTag: 'MTD-001' }), [])
    expect(outcome).toMatchObject({ kind: 'problem', problem: 'not-on-device' })
    if (outcome.kind !== 'problem') throw new Error('expected a problem')
    expect(outcome.message).toMatch(/No cameras are saved on this device yet/)
  })

  it('tells a target code and other codes apart from camera labels', () => {
    const target = scanOutcome(
      encodeTargetPayload({ id: 'SFT-7K2M9Q', widthMm: 210, heightMm: 297 }),
      catalog,
    )
    expect(target).toMatchObject({ kind: 'problem', problem: 'target' })
    if (target.kind !== 'problem') throw new Error('expected a problem')
    expect(target.message).toMatch(/focus target SFT-7K2M9Q, not a camera label/)

    const foreign = scanOutcome('https://example.test/menu', catalog)
    expect(foreign).toMatchObject({ kind: 'problem', problem: 'foreign' })
    if (foreign.kind !== 'problem') throw new Error('expected a problem')
    expect(foreign.message).toMatch(/not a Sharpfield camera label/)

    const damaged = scanOutcome('sharpfield-camera:v1;tag=MTD 001', catalog)
    expect(damaged).toMatchObject({ kind: 'problem', problem: 'damaged' })
    if (damaged.kind !== 'problem') throw new Error('expected a problem')
    expect(damaged.message).toMatch(/asset tag must be/)
  })
})
