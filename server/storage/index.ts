import { join } from 'node:path'
import { createLocalStorage } from './local'
import type { ObjectStorage } from './types'

export type { ObjectStorage } from './types'
export { assertStorageKey } from './types'
export { STORAGE_ERRORS, storageError } from './errors'
export { createLocalStorage } from './local'

/** The storage the server uses: a folder under DATA_DIR (see README.md for S3-compatible stores). */
export function createStorage(dataDir: string): ObjectStorage {
  return createLocalStorage(join(dataDir, 'uploads'))
}
