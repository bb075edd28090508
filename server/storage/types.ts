/**
 * Where uploaded files live. Keys are relative paths such as `checks/<uuid>/roi-<sha256>.png`
 * (letters, digits, `-`, `_`, `.` and `/` only). Implementations map failures of the medium to
 * AppError `storage.full` (507) or `storage.unavailable` (503) so callers can tell the client to
 * retry later; nothing else about the medium leaks out. See README.md in this folder.
 */
export interface ObjectStorage {
  /** A name for logs and health output, e.g. `local:/srv/sharpfield/uploads`. */
  readonly describe: string
  /** Stores the bytes under `key`, replacing what was there. Atomic: readers never see half a file. */
  put(key: string, bytes: Uint8Array, options: { contentType: string }): Promise<void>
  /** The bytes under `key`, or null when there are none. */
  get(key: string): Promise<Uint8Array | null>
  /** Removes `key`; removing a missing key is not an error. */
  delete(key: string): Promise<void>
}

const KEY_PATTERN = /^[A-Za-z0-9_-][A-Za-z0-9_.-]*(\/[A-Za-z0-9_-][A-Za-z0-9_.-]*)*$/

/** Throws a TypeError for a key that could escape the storage root or is not portable. */
export function assertStorageKey(key: string): void {
  if (typeof key !== 'string' || key.length === 0 || key.length > 255 || !KEY_PATTERN.test(key)) {
    throw new TypeError(`"${String(key)}" is not a valid storage key.`)
  }
}
