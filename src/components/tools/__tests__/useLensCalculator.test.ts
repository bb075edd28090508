import { describe, expect, it } from 'vitest'
import { nextTick } from 'vue'
import { parseNumberInput } from '../numberInput'
import { defaultLensForm, useLensCalculator } from '../useLensCalculator'

describe('lens calculator form', () => {
  it('computes a report from the default example', () => {
    const { result, errors } = useLensCalculator()
    expect(errors.value).toEqual({})
    expect(result.value && 'report' in result.value).toBe(true)
  })

  it('shows a message on the field with a bad number and computes nothing', async () => {
    const calc = useLensCalculator()
    calc.form.focalLengthMm = '4mm'
    calc.form.pixelPitchUm = ''
    await nextTick()
    expect(calc.errors.value.focalLengthMm).toBe(
      'Focal length must be a plain number, such as 2.8.',
    )
    expect(calc.errors.value.pixelPitchUm).toBe('Enter the pixel pitch in µm.')
    expect(calc.result.value).toBeNull()
  })

  it('accepts a decimal comma and switches the blur unit', () => {
    const calc = useLensCalculator({
      ...defaultLensForm(),
      pixelPitchUm: '2,9',
      acceptableBlur: '5.8',
      blurUnit: 'um',
    })
    const r = calc.result.value
    expect(r && 'report' in r && r.report.acceptableBlurPx).toBeCloseTo(2, 12)
  })

  it('explains a focus distance shorter than the focal length', () => {
    const calc = useLensCalculator({
      ...defaultLensForm(),
      focalLengthMm: '50',
      focusDistanceM: '0.04',
    })
    expect(calc.result.value).toEqual({
      error: 'The focus distance must be longer than the focal length.',
    })
  })

  it('resets to the example', () => {
    const calc = useLensCalculator()
    calc.form.fNumber = '99'
    expect(calc.errors.value.fNumber).toBe('F-number must be at least 0.7 and at most 64.')
    calc.reset()
    expect(calc.form.fNumber).toBe('1.6')
  })
})

describe('number fields', () => {
  const rule = { label: 'Sensor width', unit: 'px', min: 64, max: 20000, integer: true }
  it('read plain numbers only, within range, whole when asked', () => {
    expect(parseNumberInput(' 1920 ', rule)).toEqual({ ok: true, value: 1920 })
    expect(parseNumberInput('1920.5', rule)).toEqual({
      ok: false,
      message: 'Sensor width must be a whole number.',
    })
    expect(parseNumberInput('1e3', rule)).toEqual({
      ok: false,
      message: 'Sensor width must be a plain number, such as 2.8.',
    })
    expect(parseNumberInput('-5', rule).ok).toBe(false)
    expect(parseNumberInput('30000', rule)).toEqual({
      ok: false,
      message: 'Sensor width must be at least 64 and at most 20000 px.',
    })
    expect(
      parseNumberInput('0', { label: 'Distance', unit: 'm', min: 0, max: 10, exclusiveMin: true }),
    ).toEqual({
      ok: false,
      message: 'Distance must be more than 0 and at most 10 m.',
    })
  })
})
