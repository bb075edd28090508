import { fmt, fmtDistance } from './format'
import type { LensInputs, LensReport } from './lensReport'

export interface LensHint {
  id: string
  tone: 'ok' | 'warn' | 'info'
  text: string
}

/** Refocus advice in plain words for the numbers on screen. */
export function lensHints(input: LensInputs, r: LensReport): LensHint[] {
  const hints: LensHint[] = []
  const zone = `${fmtDistance(r.nearM)} to ${fmtDistance(r.farM)}`
  const accept = `${fmt(r.acceptableBlurPx)} px (${fmt(r.acceptableBlurUm)} µm)`
  if (r.objectSharp) {
    hints.push({
      id: 'object-sharp',
      tone: 'ok',
      text: `The object at ${fmtDistance(input.objectDistanceM)} lies inside the sharp zone (${zone}) at f/${fmt(input.fNumber)}.`,
    })
  } else {
    hints.push({
      id: 'object-soft',
      tone: 'warn',
      text: `The object at ${fmtDistance(input.objectDistanceM)} is outside the sharp zone (${zone}): its blur of ${fmt(r.blurPx)} px is more than the ${accept} you accept. Refocus at the object distance.`,
    })
  }
  if (r.farM === Infinity) {
    hints.push({
      id: 'hyperfocal',
      tone: 'info',
      text: `Focused at or beyond the hyperfocal distance (${fmtDistance(r.hyperfocalM)}): everything from ${fmtDistance(r.nearM)} to infinity is acceptably sharp.`,
    })
  }
  if (r.blurPx < 1) {
    hints.push({
      id: 'sub-pixel',
      tone: 'info',
      text: 'The blur circle is smaller than a pixel here: defocus is not what limits sharpness at this distance.',
    })
  }
  hints.push(
    {
      id: 'iris-open',
      tone: 'info',
      text: 'Focus with the iris fully open, as it is at night: depth of field is then at its shallowest, so focus that is right wide open stays right when the iris closes in daylight. At night the sharp zone collapses to what it is at the lowest f-number.',
    },
    {
      id: 'varifocal',
      tone: 'info',
      text: 'Varifocal lenses are not parfocal: refocus after every change of zoom.',
    },
    {
      id: 'back-focus',
      tone: 'info',
      text: `Back focus at f/${fmt(input.fNumber)}: the sensor may sit at most ±${fmt(r.backFocusToleranceUm)} µm from the image plane for ${fmt(r.acceptableBlurUm)} µm of blur. Turn the back-focus ring in small steps and measure after each.`,
    },
    {
      id: 'infrared',
      tone: 'info',
      text: 'Infrared night mode can shift focus (the IR-cut filter moves out and many lenses are not corrected for infrared): check the camera by night as well as by day.',
    },
  )
  return hints
}
