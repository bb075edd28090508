import { randomBytes } from 'node:crypto'
import { chmodSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs'
import { join } from 'node:path'

export const JWT_SECRET_FILE = 'jwt-secret'

/**
 * The JWT signing key: JWT_SECRET when set, otherwise `${dataDir}/jwt-secret`, generated there
 * (48 random bytes, base64url, mode 600) on first start. The file is never committed (.data/ is ignored).
 */
export function loadJwtKey(jwtSecret: string | undefined, dataDir: string): Uint8Array {
  if (jwtSecret) return new TextEncoder().encode(jwtSecret)
  const file = join(dataDir, JWT_SECRET_FILE)
  mkdirSync(dataDir, { recursive: true })
  try {
    writeFileSync(file, randomBytes(48).toString('base64url') + '\n', { mode: 0o600, flag: 'wx' })
  } catch (err) {
    if ((err as NodeJS.ErrnoException).code !== 'EEXIST') throw err
  }
  chmodSync(file, 0o600)
  const text = readFileSync(file, 'utf8').trim()
  const key = Buffer.from(text, 'base64url')
  if (key.length < 32)
    throw new Error(`${file} holds fewer than 32 bytes; delete it to generate a new key.`)
  return new Uint8Array(key)
}
