import { describe, expect, it } from 'vitest'
import { decodeTargetPayload, encodeTargetPayload, makeTargetId } from '../payload'

describe('target QR payload', () => {
  it('encodes id and printed size in the documented form', () => {
    expect(encodeTargetPayload({ id: 'SFT-7K2M9Q', widthMm: 210, heightMm: 297 })).toBe(
      'sharpfield-target:v1;id=SFT-7K2M9Q;w=210;h=297',
    )
    expect(encodeTargetPayload({ id: 'SFT-7K2M9Q', widthMm: 215.9, heightMm: 279.4 })).toBe(
      'sharpfield-target:v1;id=SFT-7K2M9Q;w=215.9;h=279.4',
    )
  })

  it('decodes what it encodes', () => {
    for (const p of [
      { id: 'SFT-7K2M9Q', widthMm: 841, heightMm: 1189 },
      { id: 'site_12-north', widthMm: 1500, heightMm: 2121.3 },
    ]) {
      expect(decodeTargetPayload(encodeTargetPayload(p))).toEqual(p)
    }
  })

  it('ignores fields it does not know and surrounding white space', () => {
    expect(decodeTargetPayload(' sharpfield-target:v1;h=297;x=1;id=ABC;w=210\n')).toEqual({
      id: 'ABC',
      widthMm: 210,
      heightMm: 297,
    })
  })

  it('refuses other codes and damaged ones with a clear message', () => {
    expect(() => decodeTargetPayload('https://example.test/')).toThrow(/not a Sharpfield target/)
    expect(() => decodeTargetPayload('sharpfield-target:v2;id=ABC;w=210;h=297')).toThrow(RangeError)
    expect(() => decodeTargetPayload('sharpfield-target:v1;id=ABC;w=210')).toThrow(/lacks/)
    expect(() => decodeTargetPayload('sharpfield-target:v1;id=ABC;w=210;w=211;h=297')).toThrow(
      /repeats/,
    )
    expect(() => decodeTargetPayload('sharpfield-target:v1;id=ABC;w=-210;h=297')).toThrow(
      /plain number/,
    )
    expect(() => decodeTargetPayload('sharpfield-target:v1;id=ABC;w=1e3;h=297')).toThrow(
      /plain number/,
    )
    expect(() => decodeTargetPayload('sharpfield-target:v1;id=A;w=210;h=297')).toThrow(/target id/)
    expect(() => decodeTargetPayload('sharpfield-target:v1;id=ABC;w=0;h=297')).toThrow(/positive/)
    expect(() => decodeTargetPayload('sharpfield-target:v1;idABC;w=210;h=297')).toThrow(/malformed/)
    expect(() => decodeTargetPayload(42 as unknown as string)).toThrow(TypeError)
  })

  it('refuses ids that would break the payload', () => {
    for (const id of ['a;b', 'a=b', 'ab', '-abc', 'x'.repeat(33), 'with space']) {
      expect(() => encodeTargetPayload({ id, widthMm: 210, heightMm: 297 })).toThrow(RangeError)
    }
  })
})

describe('target ids', () => {
  it('are SFT- plus readable characters drawn from the random bytes', () => {
    const id = makeTargetId(new Uint8Array([0, 1, 2, 30, 31, 255]))
    // Alphabet 23456789ABCDEFGHJKMNPQRSTUVWXYZ (31 symbols): 0→2, 1→3, 2→4, 30→Z, 31→2, 255 % 31 = 7 → 9.
    expect(id).toBe('SFT-234Z29')
    expect(id).not.toMatch(/[01OIL]/)
    expect(() => makeTargetId(new Uint8Array(3))).toThrow(RangeError)
  })
})
