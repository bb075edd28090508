// The text inside a camera's QR label (stuck on the housing or the pole):
// `sharpfield-camera:v1;tag=<asset tag>`. The asset tag is unique in the fleet and printed beside
// the code, so a label still helps when the code cannot be read. Scanning a code tells camera
// labels from target codes and from codes that are not Sharpfield's.
import { ASSET_TAG_PATTERN } from '../schemas/setup'
import { decodeTargetPayload, TARGET_PAYLOAD_PREFIX, type TargetPayload } from './payload'
import { splitPayload } from './payloadFields'

export const CAMERA_LABEL_PREFIX = 'sharpfield-camera:v1'
/** Any version of a camera label starts with this. */
const CAMERA_LABEL_FAMILY = 'sharpfield-camera:'
const TARGET_FAMILY = 'sharpfield-target:'
const MAX_TAG_LENGTH = 64

export interface CameraLabel {
  assetTag: string
}

function assertAssetTag(tag: string): void {
  if (typeof tag !== 'string') throw new TypeError('The asset tag must be text.')
  if (tag.length > MAX_TAG_LENGTH || !ASSET_TAG_PATTERN.test(tag)) {
    throw new RangeError(
      `The asset tag must be 1–${MAX_TAG_LENGTH} letters, digits, ".", "_", "/" or "-", starting with a letter or digit.`,
    )
  }
}

export function encodeCameraLabel(label: CameraLabel): string {
  assertAssetTag(label.assetTag)
  return `${CAMERA_LABEL_PREFIX};tag=${label.assetTag}`
}

/** Parses a scanned camera label. Unknown keys are ignored (later versions may add some). */
export function decodeCameraLabel(text: string): CameraLabel {
  if (typeof text !== 'string') throw new TypeError('A camera label must be text.')
  const { prefix, fields } = splitPayload(text, 'camera label')
  if (prefix !== CAMERA_LABEL_PREFIX) {
    throw new RangeError(
      prefix.startsWith(CAMERA_LABEL_FAMILY)
        ? 'This camera label was made by a newer version of Sharpfield: update the app to read it.'
        : 'This code is not a Sharpfield camera label (version 1).',
    )
  }
  const assetTag = fields.get('tag')
  if (assetTag === undefined) throw new RangeError('The camera label lacks its asset tag.')
  assertAssetTag(assetTag)
  return { assetTag }
}

/** What a scanned code turned out to be. `damaged`: ours, but it cannot be read as it stands. */
export type ScannedCode =
  | { kind: 'camera'; label: CameraLabel }
  | { kind: 'target'; target: TargetPayload }
  | { kind: 'damaged'; message: string }
  | { kind: 'foreign' }

export function classifyScannedCode(text: string): ScannedCode {
  if (typeof text !== 'string') throw new TypeError('A scanned code must be text.')
  const trimmed = text.trim()
  const attempt = (read: () => ScannedCode): ScannedCode => {
    try {
      return read()
    } catch (e) {
      return { kind: 'damaged', message: (e as Error).message }
    }
  }
  if (trimmed.startsWith(CAMERA_LABEL_FAMILY)) {
    return attempt(() => ({ kind: 'camera', label: decodeCameraLabel(trimmed) }))
  }
  if (trimmed.startsWith(TARGET_FAMILY)) {
    if (trimmed.split(';')[0] !== TARGET_PAYLOAD_PREFIX) {
      return {
        kind: 'damaged',
        message: 'This target code was made by a newer version of Sharpfield.',
      }
    }
    return attempt(() => ({ kind: 'target', target: decodeTargetPayload(trimmed) }))
  }
  return { kind: 'foreign' }
}
