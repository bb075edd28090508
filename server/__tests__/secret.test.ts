import { mkdtempSync, readFileSync, statSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { describe, expect, it } from 'vitest'
import { loadJwtKey } from '../secret'

describe('JWT signing key', () => {
  it('is generated once into the data folder with mode 600 and reused afterwards', () => {
    const dir = join(mkdtempSync(join(tmpdir(), 'sf-secret-')), 'nested')
    const first = loadJwtKey(undefined, dir)
    const file = join(dir, 'jwt-secret')
    expect(first.length).toBe(48)
    expect(statSync(file).mode & 0o777).toBe(0o600)
    expect(Buffer.from(readFileSync(file, 'utf8').trim(), 'base64url')).toEqual(Buffer.from(first))
    expect(loadJwtKey(undefined, dir)).toEqual(first)
  })

  it('uses JWT_SECRET when it is set', () => {
    const dir = mkdtempSync(join(tmpdir(), 'sf-secret-'))
    const key = loadJwtKey('x'.repeat(40), dir)
    expect(new TextDecoder().decode(key)).toBe('x'.repeat(40))
  })
})
