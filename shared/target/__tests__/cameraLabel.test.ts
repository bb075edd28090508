import { describe, expect, it } from 'vitest'
import { classifyScannedCode, decodeCameraLabel, encodeCameraLabel } from '../cameraLabel'

describe('camera label QR payload', () => {
  it('encodes the asset tag in the documented form', () => {
    expect(encodeCameraLabel({ assetTag: 'MTD-001' })).toBe('sharpfield-camera:v1;tag=MTD-001')
    expect(encodeCameraLabel({ assetTag: 'north/gate.2_b' })).toBe(
      'sharpfield-camera:v1;tag=north/gate.2_b',
    )
  })

  it('decodes what it encodes', () => {
    for (const assetTag of ['MTD-001', 'FFY-014', 'a', 'site7/pole.3_east-b', 'X'.repeat(64)]) {
      expect(decodeCameraLabel(encodeCameraLabel({ assetTag }))).toEqual({ assetTag })
    }
  })

  it('ignores fields it does not know and surrounding white space', () => {
    expect(decodeCameraLabel('  sharpfield-camera:v1;site=depot;tag=MTD-004\r\n')).toEqual({
      assetTag: 'MTD-004',
    })
  })

  it('refuses other codes and damaged labels with a clear message', () => {
    expect(() => decodeCameraLabel('https://example.test/cam/1')).toThrow(
      /not a Sharpfield camera label/,
    )
    expect(() => decodeCameraLabel('sharpfield-target:v1;id=ABC;w=210;h=297')).toThrow(
      /not a Sharpfield camera label/,
    )
    expect(() => decodeCameraLabel('sharpfield-camera:v2;tag=MTD-001')).toThrow(/newer version/)
    expect(() => decodeCameraLabel('sharpfield-camera:v1')).toThrow(/lacks its asset tag/)
    expect(() => decodeCameraLabel('sharpfield-camera:v1;tag=')).toThrow(/asset tag must be/)
    expect(() => decodeCameraLabel('sharpfield-camera:v1;tag=A;tag=B')).toThrow(/repeats/)
    expect(() => decodeCameraLabel('sharpfield-camera:v1;tagMTD')).toThrow(/malformed/)
    expect(() => decodeCameraLabel('sharpfield-camera:v1;tag=-MTD')).toThrow(RangeError)
    expect(() => decodeCameraLabel(`sharpfield-camera:v1;tag=${'X'.repeat(65)}`)).toThrow(
      RangeError,
    )
    expect(() => decodeCameraLabel(7 as unknown as string)).toThrow(TypeError)
  })

  it('refuses asset tags that would break the payload or the label', () => {
    for (const assetTag of ['', 'a;b', 'a=b', 'with space', '.hidden', 'X'.repeat(65)]) {
      expect(() => encodeCameraLabel({ assetTag })).toThrow(RangeError)
    }
  })
})

describe('a scanned code', () => {
  it('is a camera label, a target code, a damaged Sharpfield code or someone else’s', () => {
    expect(classifyScannedCode('sharpfield-camera:v1;tag=MTD-002')).toEqual({
      kind: 'camera',
      label: { assetTag: 'MTD-002' },
    })
    expect(classifyScannedCode('sharpfield-target:v1;id=SFT-7K2M9Q;w=210;h=297')).toEqual({
      kind: 'target',
      target: { id: 'SFT-7K2M9Q', widthMm: 210, heightMm: 297 },
    })
    expect(classifyScannedCode('sharpfield-camera:v1;tag=a b')).toEqual({
      kind: 'damaged',
      message: expect.stringMatching(/asset tag must be/),
    })
    expect(classifyScannedCode('sharpfield-camera:v9;tag=MTD-002')).toEqual({
      kind: 'damaged',
      message: expect.stringMatching(/newer version/),
    })
    expect(classifyScannedCode('sharpfield-target:v2;id=ABC')).toEqual({
      kind: 'damaged',
      message: expect.stringMatching(/newer version/),
    })
    expect(classifyScannedCode('sharpfield-target:v1;id=ABC;w=210')).toEqual({
      kind: 'damaged',
      message: expect.stringMatching(/lacks/),
    })
    for (const text of ['https://example.test/', 'WIFI:S:depot;T:WPA;P:x;;', '', 'MTD-001']) {
      expect(classifyScannedCode(text)).toEqual({ kind: 'foreign' })
    }
  })
})
