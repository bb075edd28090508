// MariaDB/MySQL error codes as mysql2 reports them (drizzle wraps them in `cause`).

function codeOf(err: unknown): string | undefined {
  let cur: unknown = err
  for (let depth = 0; cur && typeof cur === 'object' && depth < 5; depth++) {
    const code = (cur as { code?: unknown }).code
    if (typeof code === 'string' && code.startsWith('ER_')) return code
    cur = (cur as { cause?: unknown }).cause
  }
  return undefined
}

/** A unique key already holds this value (`ER_DUP_ENTRY`); `key` narrows it to one index. */
export function isDuplicateEntry(err: unknown, key?: string): boolean {
  if (codeOf(err) !== 'ER_DUP_ENTRY') return false
  if (!key) return true
  let cur: unknown = err
  for (let depth = 0; cur && typeof cur === 'object' && depth < 5; depth++) {
    const message = (cur as { sqlMessage?: unknown; message?: unknown }).sqlMessage
    if (typeof message === 'string') return message.includes(`'${key}'`)
    cur = (cur as { cause?: unknown }).cause
  }
  return false
}

/** The transaction lost a deadlock or waited too long for a lock: running it again may work. */
export function isRetryableTx(err: unknown): boolean {
  const code = codeOf(err)
  return code === 'ER_LOCK_DEADLOCK' || code === 'ER_LOCK_WAIT_TIMEOUT'
}

const DATA_ERRORS = new Set([
  'ER_DATA_TOO_LONG',
  'ER_TRUNCATED_WRONG_VALUE',
  'ER_TRUNCATED_WRONG_VALUE_FOR_FIELD',
  'ER_WARN_DATA_OUT_OF_RANGE',
  'ER_NO_REFERENCED_ROW_2',
  'ER_NO_REFERENCED_ROW',
  'ER_BAD_NULL_ERROR',
  'ER_CONSTRAINT_FAILED',
  'ER_DUP_ENTRY',
])

/** The database refused the values themselves: the same operation will always fail. */
export function isDataError(err: unknown): boolean {
  const code = codeOf(err)
  return code !== undefined && DATA_ERRORS.has(code)
}

const CONNECTIVITY = new Set([
  'ECONNREFUSED',
  'ECONNRESET',
  'ETIMEDOUT',
  'EHOSTUNREACH',
  'EPIPE',
  'PROTOCOL_CONNECTION_LOST',
  'PROTOCOL_SEQUENCE_TIMEOUT',
  'ER_CON_COUNT_ERROR',
  'ER_SERVER_SHUTDOWN',
  'ER_CONNECTION_KILLED',
  'ER_QUERY_INTERRUPTED',
])

/**
 * The database is unreachable or went away mid-request: a known network/shutdown code anywhere in
 * the `cause` chain, or mysql2's `fatal` flag (a connection that died, e.g. a failed rollback on a
 * connection closed by a MariaDB restart: "Can't add new command when connection is in closed state").
 */
export function isConnectivity(err: unknown): boolean {
  let cur: unknown = err
  for (let depth = 0; cur && typeof cur === 'object' && depth < 5; depth++) {
    const code = (cur as { code?: unknown }).code
    if (typeof code === 'string' && CONNECTIVITY.has(code)) return true
    if ((cur as { fatal?: unknown }).fatal === true) return true
    cur = (cur as { cause?: unknown }).cause
  }
  return false
}
