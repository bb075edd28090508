import { fileURLToPath } from 'node:url'
import { migrate } from 'drizzle-orm/mysql2/migrator'
import type { Db } from './client'

/** The generated SQL migrations, committed in drizzle/ at the repository root. */
export const MIGRATIONS_DIR = fileURLToPath(new URL('../../drizzle', import.meta.url))

/** Applies every migration in drizzle/ not yet recorded in the database (safe to repeat). */
export async function runMigrations(db: Db): Promise<void> {
  await migrate(db, { migrationsFolder: MIGRATIONS_DIR })
}
