import { describe, expect, it } from 'vitest'
import { CAMERA_PROBLEM_MESSAGE, cameraProblemMessage, cameraProblemOf } from '../cameraErrors'

const domError = (name: string) => new DOMException('from the browser', name)

describe('a camera that does not start', () => {
  it('is told apart by the getUserMedia error name (current and older names)', () => {
    expect(cameraProblemOf(domError('NotAllowedError'))).toBe('denied')
    expect(cameraProblemOf(domError('PermissionDeniedError'))).toBe('denied')
    expect(cameraProblemOf(domError('SecurityError'))).toBe('denied')
    expect(cameraProblemOf(domError('NotFoundError'))).toBe('no-camera')
    expect(cameraProblemOf(domError('DevicesNotFoundError'))).toBe('no-camera')
    expect(cameraProblemOf(domError('OverconstrainedError'))).toBe('no-camera')
    expect(cameraProblemOf(domError('NotReadableError'))).toBe('busy')
    expect(cameraProblemOf(domError('TrackStartError'))).toBe('busy')
    expect(cameraProblemOf(new Error('something else'))).toBe('other')
    expect(cameraProblemOf('not even an error')).toBe('other')
  })

  it('gets a message that says what to do, with typing the asset tag as the way out', () => {
    expect(CAMERA_PROBLEM_MESSAGE.denied).toMatch(/refused.*Allow the camera/)
    expect(CAMERA_PROBLEM_MESSAGE['no-camera']).toMatch(/No camera was found/)
    for (const kind of ['unsupported', 'denied', 'no-camera', 'other'] as const) {
      expect(CAMERA_PROBLEM_MESSAGE[kind]).toMatch(/type the asset tag in the search/i)
    }
  })

  it('offers the way on that fits where the scanner is used', () => {
    const fallback = 'type the target id and sheet width'
    expect(cameraProblemMessage('denied', fallback)).toMatch(
      /try again, or type the target id and sheet width\.$/,
    )
    for (const kind of ['unsupported', 'no-camera', 'other'] as const) {
      expect(cameraProblemMessage(kind, fallback)).toMatch(
        /Type the target id and sheet width instead\.$/,
      )
      expect(cameraProblemMessage(kind, fallback)).not.toMatch(/asset tag/)
    }
  })
})
