import { hash, verify } from '@node-rs/argon2'

// Argon2id with the library defaults (m = 19 MiB, t = 2, p = 1; OWASP's minimum for argon2id).
export function hashPassword(password: string): Promise<string> {
  return hash(password)
}

export async function verifyPassword(passwordHash: string, password: string): Promise<boolean> {
  try {
    return await verify(passwordHash, password)
  } catch {
    return false // a malformed stored hash never signs anyone in
  }
}

// Verifying against a throwaway hash when the account does not exist keeps the response
// time the same as for a wrong password, so timing does not reveal which e-mails exist.
let dummyHash: Promise<string> | undefined
export async function burnPasswordCheck(password: string): Promise<void> {
  dummyHash ??= hash('sharpfield-timing-equaliser')
  await verifyPassword(await dummyHash, password)
}
