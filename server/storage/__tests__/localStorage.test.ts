import { mkdtempSync, readdirSync, rmSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { afterEach, describe, expect, it } from 'vitest'
import { AppError } from '../../errors'
import { storageError } from '../errors'
import { createLocalStorage } from '../local'

const dirs: string[] = []
function tempDir(): string {
  const d = mkdtempSync(join(tmpdir(), 'sf-storage-'))
  dirs.push(d)
  return d
}
afterEach(() => {
  for (const d of dirs.splice(0)) rmSync(d, { recursive: true, force: true })
})

describe('local file storage', () => {
  it('stores bytes under a key and reads back exactly the same bytes', async () => {
    const store = createLocalStorage(tempDir())
    const bytes = new Uint8Array([0, 1, 2, 250, 255])
    await store.put('checks/abc/roi-01.png', bytes, { contentType: 'image/png' })
    expect(await store.get('checks/abc/roi-01.png')).toEqual(bytes)
  })

  it('leaves no temporary file behind after a write', async () => {
    const root = tempDir()
    const store = createLocalStorage(root)
    await store.put('a/b.png', new Uint8Array([1]), { contentType: 'image/png' })
    expect(readdirSync(join(root, 'a'))).toEqual(['b.png'])
  })

  it('answers null for a missing key and deletes idempotently', async () => {
    const store = createLocalStorage(tempDir())
    expect(await store.get('nothing/here.png')).toBeNull()
    await store.put('x.png', new Uint8Array([1]), { contentType: 'image/png' })
    await store.delete('x.png')
    await store.delete('x.png')
    expect(await store.get('x.png')).toBeNull()
  })

  it('refuses keys that could leave the storage folder', async () => {
    const store = createLocalStorage(tempDir())
    for (const key of ['../escape.png', '/etc/passwd', 'a/../../b', '', 'a//b']) {
      await expect(store.put(key, new Uint8Array([1]), { contentType: 'x' })).rejects.toThrow(
        TypeError,
      )
    }
  })

  it('reports a store that cannot be written as 503 storage.unavailable', async () => {
    const root = tempDir()
    const blocked = join(root, 'blocked')
    writeFileSync(blocked, 'a file where the folder should be')
    const store = createLocalStorage(blocked)
    const err = await store
      .put('k.png', new Uint8Array([1]), { contentType: 'image/png' })
      .catch((e: unknown) => e)
    expect(err).toBeInstanceOf(AppError)
    expect((err as AppError).status).toBe(503)
    expect((err as AppError).code).toBe('storage.unavailable')
  })
})

describe('storage error mapping', () => {
  it('maps a full disk to 507 storage.full with a sentence saying the check is kept', () => {
    const err = storageError(Object.assign(new Error('no space'), { code: 'ENOSPC' }), 'store it')
    expect(err).toBeInstanceOf(AppError)
    expect((err as AppError).status).toBe(507)
    expect((err as AppError).code).toBe('storage.full')
    expect((err as AppError).message).toMatch(/check is saved/)
  })

  it('passes other errors through unchanged', () => {
    const original = new Error('bug')
    expect(storageError(original, 'x')).toBe(original)
  })
})
