// Why the phone camera did not start, in words that say what to do next.

export type CameraProblem = 'unsupported' | 'denied' | 'no-camera' | 'busy' | 'other'

/** What the camera list offers when the camera cannot scan (other scanners pass their own). */
export const TYPE_ASSET_TAG = 'type the asset tag in the search'

const capitalised = (s: string) => s.charAt(0).toUpperCase() + s.slice(1)

/** The message for a camera problem; `fallback` is the other way to go on ("type …"). */
export function cameraProblemMessage(kind: CameraProblem, fallback = TYPE_ASSET_TAG): string {
  const instead = `${capitalised(fallback)} instead.`
  switch (kind) {
    case 'unsupported':
      return `This browser cannot open the camera here (it needs a secure https connection and camera support). ${instead}`
    case 'denied':
      return `Camera access was refused. Allow the camera for Sharpfield in the browser or phone settings and try again, or ${fallback}.`
    case 'no-camera':
      return `No camera was found on this device. ${instead}`
    case 'busy':
      return 'The camera could not start: another app may be using it. Close that app and try again.'
    case 'other':
      return `The camera could not be started. ${instead}`
  }
}

export const CAMERA_PROBLEM_MESSAGE: Record<CameraProblem, string> = {
  unsupported: cameraProblemMessage('unsupported'),
  denied: cameraProblemMessage('denied'),
  'no-camera': cameraProblemMessage('no-camera'),
  busy: cameraProblemMessage('busy'),
  other: cameraProblemMessage('other'),
}

/** Sorts a getUserMedia failure by its DOMException name (older browsers used other names). */
export function cameraProblemOf(error: unknown): CameraProblem {
  const name = error instanceof Error || error instanceof DOMException ? error.name : ''
  switch (name) {
    case 'NotAllowedError':
    case 'PermissionDeniedError':
    case 'SecurityError':
      return 'denied'
    case 'NotFoundError':
    case 'DevicesNotFoundError':
    case 'OverconstrainedError':
      return 'no-camera'
    case 'NotReadableError':
    case 'TrackStartError':
    case 'AbortError':
      return 'busy'
    default:
      return 'other'
  }
}
