import { describe, expect, it } from 'vitest'
import { cameraModelInputSchema, userCreateSchema } from '@shared/schemas/setup'
import { numberOrNull, serverFieldErrors, validate } from '../fieldErrors'

describe('form field errors', () => {
  it('give the first message of the shared schema for each field', () => {
    const r = validate(userCreateSchema, {
      email: 'x',
      name: '',
      role: 'inspector',
      password: 'short',
    })
    expect(r.ok).toBe(false)
    if (!r.ok)
      expect(r.errors).toEqual({
        email: 'Enter an e-mail address.',
        name: 'Enter a name.',
        password: 'At least 12 characters.',
      })
  })

  it('name a field left as text that should be a number', () => {
    const r = validate(cameraModelInputSchema, {
      name: 'M',
      sensorWidthPx: numberOrNull('1920'),
      sensorHeightPx: numberOrNull('abc'),
      pixelPitchUm: 2.9,
      focalLengthMinMm: 4,
      focalLengthMaxMm: 4,
      fNumber: 1.6,
    })
    expect(r.ok).toBe(false)
    if (!r.ok) expect(Object.keys(r.errors)).toEqual(['sensorHeightPx'])
  })

  it('read the server’s field messages from an error’s details', () => {
    expect(serverFieldErrors({ details: { fields: { email: ['Taken.', 'Other.'] } } })).toEqual({
      email: 'Taken.',
    })
    expect(serverFieldErrors(new Error('x'))).toEqual({})
  })

  it('turn an empty number field into null and text into NaN', () => {
    expect(numberOrNull(' ')).toBeNull()
    expect(numberOrNull('0.25')).toBe(0.25)
    expect(numberOrNull('0,25')).toBeNaN()
  })
})
