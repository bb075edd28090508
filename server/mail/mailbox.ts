import { randomUUID } from 'node:crypto'
import { mkdir, readFile, readdir, rename, writeFile } from 'node:fs/promises'
import { join } from 'node:path'
import { mailboxMessageSchema } from '../../shared/schemas/mailbox'
import type { MailboxMessage } from '../../shared/schemas/mailbox'

// The demo mailbox: one JSON file per caught e-mail under `${DATA_DIR}/mailbox/`.
// File names start with the arrival time, so a name sort is a time sort.

export function mailboxDir(dataDir: string): string {
  return join(dataDir, 'mailbox')
}

let sequence = 0

export async function storeMessage(
  dir: string,
  message: Omit<MailboxMessage, 'id'>,
): Promise<MailboxMessage> {
  await mkdir(dir, { recursive: true })
  sequence = (sequence + 1) % 1_000_000
  const id = `${Date.now().toString().padStart(15, '0')}-${String(sequence).padStart(6, '0')}-${randomUUID().slice(0, 8)}`
  const stored: MailboxMessage = { id, ...message }
  const tmp = join(dir, `.${id}.tmp`)
  await writeFile(tmp, JSON.stringify(stored, null, 2))
  await rename(tmp, join(dir, `${id}.json`)) // readers never see a half-written file
  return stored
}

/** Newest first; unreadable or foreign files are skipped. */
export async function readMailbox(dir: string, limit = 200): Promise<MailboxMessage[]> {
  let names: string[]
  try {
    names = await readdir(dir)
  } catch (err) {
    if ((err as NodeJS.ErrnoException).code === 'ENOENT') return []
    throw err
  }
  const files = names
    .filter((n) => n.endsWith('.json') && !n.startsWith('.'))
    .sort()
    .reverse()
  const out: MailboxMessage[] = []
  for (const name of files) {
    if (out.length >= limit) break
    try {
      const parsed = mailboxMessageSchema.safeParse(
        JSON.parse(await readFile(join(dir, name), 'utf8')),
      )
      if (parsed.success) out.push(parsed.data)
    } catch {
      // skip a file that is not a stored message
    }
  }
  return out
}
