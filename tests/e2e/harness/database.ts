// A throwaway database on the test MariaDB, dropped at teardown.
import { randomBytes } from 'node:crypto'
import mysql from 'mysql2/promise'

export interface TestDatabase {
  /** mysql:// URL of the new database. */
  url: string
  name: string
  drop(): Promise<void>
}

export async function createTestDatabase(serverUrl: string): Promise<TestDatabase> {
  const base = new URL(serverUrl)
  base.pathname = '/'
  const name = `sf_e2e_${randomBytes(5).toString('hex')}`
  const admin = await mysql.createConnection({ uri: base.toString() }).catch((error: Error) => {
    throw new Error(
      `The e2e tests need the test MariaDB at ${base.host} (${error.message}). ` +
        'Start it with: bash scripts/db.sh start 3317 .test-data/mariadb',
    )
  })
  try {
    await admin.query(
      `CREATE DATABASE \`${name}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`,
    )
  } finally {
    await admin.end()
  }
  const url = new URL(base.toString())
  url.pathname = `/${name}`
  return {
    url: url.toString(),
    name,
    async drop() {
      const conn = await mysql.createConnection({ uri: base.toString() })
      try {
        await conn.query(`DROP DATABASE IF EXISTS \`${name}\``)
      } finally {
        await conn.end()
      }
    },
  }
}
