// What a scanned code means on this device: one of its cameras, or a problem in plain words.
// The catalog is the device's copy of the camera list, so this works with no network.
import type { Camera } from '@shared/schemas/cameras'
import { classifyScannedCode } from '@shared/target/cameraLabel'

export type ScanProblem = 'foreign' | 'target' | 'damaged' | 'not-on-device'

export type ScanOutcome =
  { kind: 'camera'; camera: Camera } | { kind: 'problem'; problem: ScanProblem; message: string }

const TYPE_INSTEAD = 'or type the asset tag in the search.'

/** The camera with this asset tag; asset tags are unique regardless of letter case. */
export function cameraByAssetTag(cameras: readonly Camera[], assetTag: string): Camera | null {
  const exact = cameras.find((c) => c.assetTag === assetTag)
  if (exact) return exact
  const upper = assetTag.toUpperCase()
  return cameras.find((c) => c.assetTag.toUpperCase() === upper) ?? null
}

export function scanOutcome(text: string, cameras: readonly Camera[]): ScanOutcome {
  const code = classifyScannedCode(text)
  switch (code.kind) {
    case 'camera': {
      const camera = cameraByAssetTag(cameras, code.label.assetTag)
      if (camera) return { kind: 'camera', camera }
      const tag = code.label.assetTag
      return {
        kind: 'problem',
        problem: 'not-on-device',
        message: cameras.length
          ? `Camera ${tag} is not among the ${cameras.length} cameras saved on this device. Connect and refresh the camera list; if it is still missing, ask your supervisor whether it is registered.`
          : `No cameras are saved on this device yet, so ${tag} cannot be found. Connect once to download the camera list, then scan again.`,
      }
    }
    case 'target':
      return {
        kind: 'problem',
        problem: 'target',
        message: `This is the code of focus target ${code.target.id}, not a camera label. Scan the label on the camera's housing or pole, ${TYPE_INSTEAD}`,
      }
    case 'damaged':
      return {
        kind: 'problem',
        problem: 'damaged',
        message: `${code.message} Try the label again, ${TYPE_INSTEAD}`,
      }
    case 'foreign':
      return {
        kind: 'problem',
        problem: 'foreign',
        message: `This code is not a Sharpfield camera label. Look for the label that shows the camera's asset tag, ${TYPE_INSTEAD}`,
      }
  }
}
