/** A printable sheet, portrait, in millimetres. */
export interface Sheet {
  /** 'A4', 'Letter', … or 'Custom'. */
  name: string
  widthMm: number
  heightMm: number
  custom: boolean
}

export type PaperFamily = 'iso' | 'us'

// ISO 216 A series and the ANSI/US sizes (Letter 8.5 × 11 in, Tabloid 11 × 17 in), smallest first.
export const ISO_SHEETS: readonly Sheet[] = [
  { name: 'A4', widthMm: 210, heightMm: 297, custom: false },
  { name: 'A3', widthMm: 297, heightMm: 420, custom: false },
  { name: 'A2', widthMm: 420, heightMm: 594, custom: false },
  { name: 'A1', widthMm: 594, heightMm: 841, custom: false },
  { name: 'A0', widthMm: 841, heightMm: 1189, custom: false },
]
export const US_SHEETS: readonly Sheet[] = [
  { name: 'Letter', widthMm: 215.9, heightMm: 279.4, custom: false },
  { name: 'Tabloid', widthMm: 279.4, heightMm: 431.8, custom: false },
]

export function sheetsOf(family: PaperFamily): readonly Sheet[] {
  return family === 'us' ? US_SHEETS : ISO_SHEETS
}

export function standardSheet(name: string): Sheet {
  const sheet = [...ISO_SHEETS, ...US_SHEETS].find(
    (s) => s.name.toLowerCase() === name.toLowerCase(),
  )
  if (!sheet)
    throw new RangeError(
      `"${name}" is not a sheet size Sharpfield prints (A4–A0, Letter, Tabloid).`,
    )
  return sheet
}

export const CUSTOM_WIDTH_MIN_MM = 100
export const CUSTOM_WIDTH_MAX_MM = 5000

/** A custom print of the given width with the ISO √2 aspect (height rounded to 0.1 mm). */
export function customSheet(widthMm: number): Sheet {
  if (!Number.isFinite(widthMm))
    throw new TypeError('The custom sheet width must be a number of millimetres.')
  if (widthMm < CUSTOM_WIDTH_MIN_MM || widthMm > CUSTOM_WIDTH_MAX_MM) {
    throw new RangeError(
      `The custom sheet width must be between ${CUSTOM_WIDTH_MIN_MM} and ${CUSTOM_WIDTH_MAX_MM} mm.`,
    )
  }
  const w = Math.round(widthMm * 10) / 10
  return {
    name: 'Custom',
    widthMm: w,
    heightMm: Math.round(w * Math.SQRT2 * 10) / 10,
    custom: true,
  }
}
