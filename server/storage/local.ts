import { randomBytes } from 'node:crypto'
import { mkdir, readFile, rename, rm, writeFile } from 'node:fs/promises'
import { dirname, join, resolve } from 'node:path'
import { storageError } from './errors'
import { assertStorageKey } from './types'
import type { ObjectStorage } from './types'

/**
 * Files in a folder on the server's disk (DATA_DIR/uploads by default). Writes go to a temporary
 * file beside the target and are renamed into place, so a crash never leaves half a file under a key.
 */
export function createLocalStorage(root: string): ObjectStorage {
  const base = resolve(root)
  const pathOf = (key: string) => {
    assertStorageKey(key)
    return join(base, ...key.split('/'))
  }
  return {
    describe: `local:${base}`,
    async put(key, bytes) {
      const target = pathOf(key)
      const temp = `${target}.${randomBytes(6).toString('hex')}.part`
      try {
        await mkdir(dirname(target), { recursive: true })
        await writeFile(temp, bytes, { flush: true })
        await rename(temp, target)
      } catch (err) {
        await rm(temp, { force: true }).catch(() => undefined)
        throw storageError(err, 'store the file')
      }
    },
    async get(key) {
      try {
        return new Uint8Array(await readFile(pathOf(key)))
      } catch (err) {
        if ((err as NodeJS.ErrnoException).code === 'ENOENT') return null
        throw storageError(err, 'read the file')
      }
    },
    async delete(key) {
      try {
        await rm(pathOf(key), { force: true })
      } catch (err) {
        throw storageError(err, 'delete the file')
      }
    },
  }
}
