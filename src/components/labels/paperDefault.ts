// The paper a person most likely has: US Letter where it is the office standard, A4 elsewhere.
import type { LabelPaper } from '@shared/target/labelSheet'

/**
 * Regions whose offices use US Letter (common practice, from memory: the United States, Canada,
 * Mexico, the Philippines, Chile, Colombia and Venezuela).
 */
const LETTER_REGIONS = new Set(['US', 'CA', 'MX', 'PH', 'CL', 'CO', 'VE'])

/** `locale` is a BCP 47 tag such as the browser's `navigator.language` ("en-US", "de-DE"). */
export function defaultLabelPaper(locale: string | undefined): LabelPaper {
  if (!locale) return 'A4'
  let region: string | undefined
  try {
    region = new Intl.Locale(locale).maximize().region
  } catch {
    return 'A4'
  }
  return region && LETTER_REGIONS.has(region) ? 'Letter' : 'A4'
}
