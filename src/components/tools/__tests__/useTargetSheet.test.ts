import { describe, expect, it } from 'vitest'
import { nextTick } from 'vue'
import { useTargetSheet } from '../useTargetSheet'

describe('Targets screen state', () => {
  it('starts on A4 with a fresh SFT- id and a drawing ready to preview', () => {
    const t = useTargetSheet()
    expect(t.targetId.value).toMatch(/^SFT-[2-9A-HJKMNP-Z]{6}$/)
    expect(t.sheet.value?.name).toBe('A4')
    expect(t.drawing.value?.layout.squares).toHaveLength(4)
    expect(t.drawing.value?.qrRects.length).toBeGreaterThan(50)
  })

  it('draws a custom sheet and explains a width out of range', async () => {
    const t = useTargetSheet('SFT-TEST01')
    t.sheetName.value = 'custom'
    t.customWidthMm.value = '1200'
    expect(t.sheet.value).toMatchObject({ widthMm: 1200, heightMm: 1697.1, custom: true })
    t.customWidthMm.value = '20'
    await nextTick()
    expect(t.customWidthError.value).toBe('Custom width must be at least 100 and at most 5000 mm.')
    expect(t.drawing.value).toBeNull()
  })

  it('sizes for a camera and follows the recommendation until a sheet is picked', () => {
    const t = useTargetSheet('SFT-TEST01')
    t.mode.value = 'camera'
    Object.assign(t.camera, {
      distanceM: '5',
      sensorWidthPx: '2688',
      route: 'lens',
      focalLengthMm: '12',
      pixelPitchUm: '2.9',
    })
    // 12 mm, 2.9 µm, 5 m → 827.6 px/m; A1 squares give 118 px (< 120), A0 202 mm give 167 px (shared sizing tests).
    expect(t.sizing.value?.recommended?.sheet.name).toBe('A0')
    expect(t.sheet.value?.name).toBe('A0')
    t.pickedOption.value = 'A1'
    expect(t.sheet.value?.name).toBe('A1')
  })

  it('offers a custom print when the camera is too far for every sheet', () => {
    const t = useTargetSheet('SFT-TEST01')
    t.mode.value = 'camera'
    Object.assign(t.camera, {
      distanceM: '10',
      sensorWidthPx: '1920',
      route: 'lens',
      focalLengthMm: '4',
      pixelPitchUm: '2.9',
    })
    expect(t.sizing.value?.recommended).toBeNull()
    expect(t.sheet.value?.custom).toBe(true)
    expect(t.sizingOptions.value.at(-1)?.sheet.widthMm).toBe(3630)
  })

  it('computes nothing from bad camera numbers and says which field is wrong', () => {
    const t = useTargetSheet('SFT-TEST01')
    t.mode.value = 'camera'
    t.camera.route = 'fov'
    t.camera.horizontalFovDeg = '200'
    t.camera.distanceM = 'far'
    expect(t.cameraErrors.value).toEqual({
      distanceM: 'Distance must be a plain number, such as 2.8.',
      horizontalFovDeg: 'Field of view must be at least 0.5 and at most 179°.',
    })
    expect(t.sizing.value).toBeNull()
    expect(t.drawing.value).toBeNull()
  })

  it('refuses an id that cannot go into the QR code, and makes a new one on request', () => {
    const t = useTargetSheet('SFT-TEST01')
    t.targetId.value = 'a;b'
    expect(t.idError.value).toMatch(/3–32 letters/)
    expect(t.drawing.value).toBeNull()
    t.regenerateId()
    expect(t.idError.value).toBeNull()
    expect(t.drawing.value).not.toBeNull()
  })

  it('switches paper family to its first size', () => {
    const t = useTargetSheet('SFT-TEST01')
    t.setFamily('us')
    expect(t.sheet.value?.name).toBe('Letter')
  })
})
