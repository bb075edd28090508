import { describe, expect, it } from 'vitest'
import { toErrorResponse } from '../errors'

// How database outages map to answers. The errors are shaped as mysql2 and drizzle throw them.

function wrapped(cause: object): Error {
  return Object.assign(new Error('Failed query: rollback\nparams: '), { cause })
}

describe('a database outage', () => {
  it('answers 503 db.unavailable when the connection is refused', () => {
    const err = wrapped(Object.assign(new Error('connect ECONNREFUSED'), { code: 'ECONNREFUSED' }))
    expect(toErrorResponse(err)).toMatchObject({
      status: 503,
      body: { error: { code: 'db.unavailable' } },
    })
  })

  it('answers 503 when a rollback hits a connection closed by a restart (mysql2 fatal flag)', () => {
    const closed = Object.assign(
      new Error("Can't add new command when connection is in closed state"),
      { fatal: true },
    )
    expect(toErrorResponse(wrapped(closed)).status).toBe(503)
  })

  it('answers 503 when MariaDB is shutting down', () => {
    const err = wrapped(
      Object.assign(new Error('Server shutdown in progress'), { code: 'ER_SERVER_SHUTDOWN' }),
    )
    expect(toErrorResponse(err).status).toBe(503)
  })

  it('still answers 500 for an ordinary query error', () => {
    const err = wrapped(Object.assign(new Error('Unknown column'), { code: 'ER_BAD_FIELD_ERROR' }))
    expect(toErrorResponse(err)).toMatchObject({
      status: 500,
      body: { error: { code: 'internal' } },
    })
  })
})
