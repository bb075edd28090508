// Why the phone camera did not start, in words that say what to do next.

export type CameraProblem = 'unsupported' | 'denied' | 'no-camera' | 'busy' | 'other'

const INSTEAD = 'Type the asset tag in the search instead.'

export const CAMERA_PROBLEM_MESSAGE: Record<CameraProblem, string> = {
  unsupported: `This browser cannot open the camera here (it needs a secure https connection and camera support). ${INSTEAD}`,
  denied:
    'Camera access was refused. Allow the camera for Sharpfield in the browser or phone settings and try again, or type the asset tag in the search.',
  'no-camera': `No camera was found on this device. ${INSTEAD}`,
  busy: 'The camera could not start: another app may be using it. Close that app and try again.',
  other: `The camera could not be started. ${INSTEAD}`,
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
