import { computed, reactive } from 'vue'
import { lensHints, type LensHint } from './lensHints'
import { computeLensReport, type LensInputs, type LensReport } from './lensReport'
import { parseNumberInput, type NumberRule } from './numberInput'

export type BlurUnit = 'px' | 'um'

/** The form as typed: text, so a half-typed number is never lost or rewritten. */
export interface LensForm {
  focalLengthMm: string
  fNumber: string | number
  pixelPitchUm: string
  sensorWidthPx: string
  focusDistanceM: string
  objectDistanceM: string
  acceptableBlur: string
  blurUnit: BlurUnit
}

type NumericField = Exclude<keyof LensForm, 'blurUnit'>

export const LENS_RULES: Record<Exclude<NumericField, 'acceptableBlur'>, NumberRule> = {
  focalLengthMm: { label: 'Focal length', unit: 'mm', min: 0.5, max: 2000 },
  fNumber: { label: 'F-number', unit: '', min: 0.7, max: 64 },
  pixelPitchUm: { label: 'Pixel pitch', unit: 'µm', min: 0.5, max: 30 },
  sensorWidthPx: { label: 'Sensor width', unit: 'px', min: 64, max: 20000, integer: true },
  focusDistanceM: { label: 'Focus distance', unit: 'm', min: 0, max: 100000, exclusiveMin: true },
  objectDistanceM: { label: 'Object distance', unit: 'm', min: 0, max: 100000, exclusiveMin: true },
}
const BLUR_RULES: Record<BlurUnit, NumberRule> = {
  px: { label: 'Acceptable blur', unit: 'px', min: 0.1, max: 50 },
  um: { label: 'Acceptable blur', unit: 'µm', min: 0.1, max: 500 },
}

/** An invented example: a 12 mm, f/1.6 lens on a 2688 px sensor, focused at 15 m, subject at 10 m. */
export function defaultLensForm(): LensForm {
  return {
    focalLengthMm: '12',
    fNumber: '1.6',
    pixelPitchUm: '2.9',
    sensorWidthPx: '2688',
    focusDistanceM: '15',
    objectDistanceM: '10',
    acceptableBlur: '2',
    blurUnit: 'px',
  }
}

/** Form state, per-field messages, and the report once every field is valid. */
export function useLensCalculator(initial: LensForm = defaultLensForm()) {
  const form = reactive<LensForm>({ ...initial })

  const parsed = computed(() => {
    const out: Partial<Record<NumericField, number>> = {}
    const errors: Partial<Record<NumericField, string>> = {}
    for (const key of Object.keys(LENS_RULES) as (keyof typeof LENS_RULES)[]) {
      const p = parseNumberInput(form[key], LENS_RULES[key])
      if (p.ok) out[key] = p.value
      else errors[key] = p.message
    }
    const blur = parseNumberInput(form.acceptableBlur, BLUR_RULES[form.blurUnit])
    if (blur.ok) out.acceptableBlur = blur.value
    else errors.acceptableBlur = blur.message
    return { values: out, errors }
  })

  const errors = computed(() => parsed.value.errors)

  const result = computed<
    { report: LensReport; hints: LensHint[]; inputs: LensInputs } | { error: string } | null
  >(() => {
    const { values, errors: e } = parsed.value
    if (Object.keys(e).length > 0) return null
    const inputs: LensInputs = {
      focalLengthMm: values.focalLengthMm!,
      fNumber: values.fNumber!,
      pixelPitchUm: values.pixelPitchUm!,
      sensorWidthPx: values.sensorWidthPx!,
      focusDistanceM: values.focusDistanceM!,
      objectDistanceM: values.objectDistanceM!,
      acceptableBlur: { value: values.acceptableBlur!, unit: form.blurUnit },
    }
    try {
      const report = computeLensReport(inputs)
      return { report, hints: lensHints(inputs, report), inputs }
    } catch (err) {
      if (err instanceof RangeError) return { error: friendlyRangeError(err, inputs) }
      throw err
    }
  })

  function reset(): void {
    Object.assign(form, defaultLensForm())
  }

  return { form, errors, result, reset }
}

function friendlyRangeError(err: RangeError, inputs: LensInputs): string {
  if (inputs.focusDistanceM * 1000 <= inputs.focalLengthMm) {
    return 'The focus distance must be longer than the focal length.'
  }
  return err.message
}
