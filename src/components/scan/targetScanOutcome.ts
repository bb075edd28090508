// What a code scanned in the check's Frame step means: only a Sharpfield target code is taken
// there; a camera label or any other code gets a message that says what to scan instead.
import { CAMERA_LABEL_PREFIX, classifyScannedCode } from '@shared/target/cameraLabel'
import type { TargetPayload } from '@shared/target/payload'

export type TargetScanOutcome =
  | { kind: 'target'; target: TargetPayload }
  | { kind: 'problem'; problem: 'camera' | 'damaged' | 'foreign'; message: string }

/** The way on without the camera, for messages (also given to the scanner's camera errors). */
export const TYPE_TARGET = 'type the target id and sheet width'

const SCAN_INSTEAD = `Scan the QR code printed on the target sheet, or ${TYPE_TARGET}.`

export function targetScanOutcome(text: string): TargetScanOutcome {
  const code = classifyScannedCode(text)
  switch (code.kind) {
    case 'target':
      return { kind: 'target', target: code.target }
    case 'camera':
      return {
        kind: 'problem',
        problem: 'camera',
        message: `This is the label of camera ${code.label.assetTag}, not a target code. ${SCAN_INSTEAD}`,
      }
    case 'damaged':
      // A camera label of another version or with a bad tag is still no target code.
      if (text.trim().startsWith(CAMERA_LABEL_PREFIX.split(':')[0] + ':')) {
        return {
          kind: 'problem',
          problem: 'camera',
          message: `This is a camera label, not a target code. ${SCAN_INSTEAD}`,
        }
      }
      return {
        kind: 'problem',
        problem: 'damaged',
        message: `${code.message} Try the target's code again, or ${TYPE_TARGET}.`,
      }
    case 'foreign':
      return {
        kind: 'problem',
        problem: 'foreign',
        message: `This code is not a Sharpfield target code. ${SCAN_INSTEAD}`,
      }
  }
}
