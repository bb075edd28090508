import QRCode from 'qrcode'
import { describe, expect, it } from 'vitest'
import { encodeCameraLabel } from '../cameraLabel'
import { qrSymbolModules, qrVersionForBytesM, utf8Length } from '../qrCapacity'

// Outside source: the `qrcode` package (an independent encoder) at level M.
const versionOf = (text: string) => QRCode.create(text, { errorCorrectionLevel: 'M' }).version

describe('the QR size a label needs', () => {
  it('matches the encoder for byte-mode payloads of every label length', () => {
    // Lower-case tags keep the whole payload in byte mode, so the encoder has no smaller choice.
    for (let n = 1; n <= 64; n++) {
      const payload = encodeCameraLabel({ assetTag: 'a'.repeat(n) })
      expect(qrVersionForBytesM(utf8Length(payload)), `tag of ${n}`).toBe(versionOf(payload))
    }
  })

  it('is an upper bound when the encoder can switch to digit or capital modes', () => {
    for (const tag of ['MTD-004', '0000000000000000000000', 'NORTHGATE-POLE-12-CAM-3']) {
      const payload = encodeCameraLabel({ assetTag: tag })
      expect(versionOf(payload)).toBeLessThanOrEqual(qrVersionForBytesM(utf8Length(payload)))
    }
  })

  it('gives 17 + 4 × version modules a side (21 for version 1, 41 for version 6)', () => {
    // ISO/IEC 18004: version 1 is 21 × 21 modules, each version adds 4.
    expect(qrSymbolModules(1)).toBe(21)
    expect(qrSymbolModules(6)).toBe(41)
    expect(QRCode.create('x'.repeat(100), { errorCorrectionLevel: 'M' }).modules.size).toBe(
      qrSymbolModules(6),
    )
  })

  it('counts UTF-8 bytes and refuses payloads no label code holds', () => {
    expect(utf8Length('MTD-004')).toBe(7)
    expect(utf8Length('é°€😀')).toBe(2 + 2 + 3 + 4)
    expect(() => qrVersionForBytesM(214)).toThrow(/too long/)
    expect(() => qrVersionForBytesM(-1)).toThrow(RangeError)
    expect(() => qrSymbolModules(0)).toThrow(RangeError)
  })
})
