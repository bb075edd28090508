import { drizzle } from 'drizzle-orm/mysql2'
import type { MySql2Database } from 'drizzle-orm/mysql2'
import mysql from 'mysql2/promise'
import type { Pool } from 'mysql2/promise'
import * as schema from './schema'

export type Schema = typeof schema
export type Db = MySql2Database<Schema>
/** A database handle or an open transaction: services accept either. */
export type DbOrTx = Db | Parameters<Parameters<Db['transaction']>[0]>[0]

export interface DbHandle {
  db: Db
  pool: Pool
  close(): Promise<void>
}

export interface DbOptions {
  connectionLimit?: number
  connectTimeoutMs?: number
}

/** Opens a pool on a mysql:// URL. Every connection works in UTC. */
export function createDb(url: string, options: DbOptions = {}): DbHandle {
  const pool = mysql.createPool({
    uri: url,
    connectionLimit: options.connectionLimit ?? 10,
    connectTimeout: options.connectTimeoutMs ?? 5_000,
    timezone: 'Z',
    charset: 'utf8mb4_unicode_ci',
    waitForConnections: true,
    enableKeepAlive: true,
  })
  // The pool emits the callback-style connection; queries on it run before any other.
  pool.pool.on('connection', (conn) => {
    conn.query("SET time_zone = '+00:00'")
  })
  const db = drizzle(pool, { schema, mode: 'default', casing: 'snake_case' })
  let closed = false
  return {
    db,
    pool,
    async close() {
      if (closed) return
      closed = true
      await pool.end()
    },
  }
}
