import { computed, reactive, ref } from 'vue'
import { assertTargetId, makeTargetId } from '@shared/target/payload'
import {
  customSheet,
  CUSTOM_WIDTH_MAX_MM,
  CUSTOM_WIDTH_MIN_MM,
  sheetsOf,
  type PaperFamily,
  type Sheet,
} from '@shared/target/sheets'
import { sizeTarget, type SheetOption, type TargetSizing } from '@shared/target/sizing'
import { targetDrawing, type TargetDrawing } from '@/services/targetDrawing'
import { parseNumberInput, type NumberRule } from './numberInput'

export type TargetMode = 'sheet' | 'camera'
export type DensityRoute = 'lens' | 'fov'

export interface CameraForm {
  distanceM: string
  sensorWidthPx: string
  route: DensityRoute
  focalLengthMm: string
  pixelPitchUm: string
  horizontalFovDeg: string
}

const RULES = {
  distanceM: { label: 'Distance', unit: 'm', min: 0.1, max: 500 },
  sensorWidthPx: { label: 'Frame width', unit: 'px', min: 64, max: 20000, integer: true },
  focalLengthMm: { label: 'Focal length', unit: 'mm', min: 0.5, max: 2000 },
  pixelPitchUm: { label: 'Pixel pitch', unit: 'µm', min: 0.5, max: 30 },
  horizontalFovDeg: { label: 'Field of view', unit: '°', min: 0.5, max: 179 },
  customWidthMm: {
    label: 'Custom width',
    unit: 'mm',
    min: CUSTOM_WIDTH_MIN_MM,
    max: CUSTOM_WIDTH_MAX_MM,
  },
} satisfies Record<string, NumberRule>

export function newTargetId(): string {
  return makeTargetId(crypto.getRandomValues(new Uint8Array(6)))
}

/** State of the Targets screen: which sheet, sized by hand or for a camera, and the drawing. */
export function useTargetSheet(initialId: string = newTargetId()) {
  const mode = ref<TargetMode>('sheet')
  const family = ref<PaperFamily>('iso')
  /** Standard sheet name, or 'custom'. */
  const sheetName = ref('A4')
  const customWidthMm = ref('1000')
  const camera = reactive<CameraForm>({
    distanceM: '3',
    sensorWidthPx: '1920',
    route: 'lens',
    focalLengthMm: '8',
    pixelPitchUm: '2.9',
    horizontalFovDeg: '90',
  })
  /** Sheet picked from the sizing list; null follows the recommendation. */
  const pickedOption = ref<string | null>(null)
  const targetId = ref(initialId)

  const idError = computed(() => {
    try {
      assertTargetId(targetId.value.trim())
      return null
    } catch (err) {
      return (err as Error).message
    }
  })

  const cameraErrors = computed(() => {
    const keys: (keyof typeof RULES & keyof CameraForm)[] = ['distanceM', 'sensorWidthPx']
    keys.push(
      ...(camera.route === 'lens'
        ? (['focalLengthMm', 'pixelPitchUm'] as const)
        : (['horizontalFovDeg'] as const)),
    )
    const errors: Partial<Record<keyof CameraForm, string>> = {}
    const values: Partial<Record<keyof CameraForm, number>> = {}
    for (const key of keys) {
      const p = parseNumberInput(camera[key], RULES[key])
      if (p.ok) values[key] = p.value
      else errors[key] = p.message
    }
    return { errors, values }
  })

  const sizing = computed<TargetSizing | null>(() => {
    const { errors, values } = cameraErrors.value
    if (Object.keys(errors).length > 0) return null
    return sizeTarget({
      distanceM: values.distanceM!,
      sensorWidthPx: values.sensorWidthPx!,
      ...(camera.route === 'lens'
        ? { focalLengthMm: values.focalLengthMm!, pixelPitchUm: values.pixelPitchUm! }
        : { horizontalFovDeg: values.horizontalFovDeg! }),
      family: family.value,
    })
  })

  /** The sizing list: every standard sheet, plus the custom print when none is big enough. */
  const sizingOptions = computed<SheetOption[]>(() => {
    const s = sizing.value
    if (!s) return []
    return s.customOption ? [...s.options, s.customOption] : s.options
  })

  const chosenOption = computed<SheetOption | null>(() => {
    const s = sizing.value
    if (!s) return null
    const picked = sizingOptions.value.find((o) => o.sheet.name === pickedOption.value)
    return picked ?? s.recommended ?? s.customOption
  })

  const customWidthError = computed(() => {
    if (sheetName.value !== 'custom') return null
    const p = parseNumberInput(customWidthMm.value, RULES.customWidthMm)
    return p.ok ? null : p.message
  })

  const sheet = computed<Sheet | null>(() => {
    if (mode.value === 'camera') return chosenOption.value?.sheet ?? null
    if (sheetName.value === 'custom') {
      const p = parseNumberInput(customWidthMm.value, RULES.customWidthMm)
      return p.ok ? customSheet(p.value) : null
    }
    return (
      sheetsOf(family.value).find((s) => s.name === sheetName.value) ?? sheetsOf(family.value)[0]
    )
  })

  const drawing = computed<TargetDrawing | null>(() => {
    if (!sheet.value || idError.value) return null
    return targetDrawing(sheet.value, targetId.value.trim())
  })

  function setFamily(next: PaperFamily): void {
    family.value = next
    pickedOption.value = null
    if (sheetName.value !== 'custom') sheetName.value = sheetsOf(next)[0].name
  }

  function regenerateId(): void {
    targetId.value = newTargetId()
  }

  return {
    mode,
    family,
    sheetName,
    customWidthMm,
    customWidthError,
    camera,
    cameraErrors: computed(() => cameraErrors.value.errors),
    sizing,
    sizingOptions,
    pickedOption,
    chosenOption,
    targetId,
    idError,
    sheet,
    drawing,
    setFamily,
    regenerateId,
  }
}
