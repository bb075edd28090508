// Applies the migrations in drizzle/ to the configured database (DATABASE_URL or DB_*).
import { loadConfig, redactUrl } from '../server/config'
import { createDb } from '../server/db/client'
import { runMigrations } from '../server/db/migrate'

const config = loadConfig()
const handle = createDb(config.databaseUrl, { connectionLimit: 1 })
try {
  await runMigrations(handle.db)
  console.log(`Migrations applied to ${redactUrl(config.databaseUrl)}`)
} catch (err) {
  console.error(`Migrating ${redactUrl(config.databaseUrl)} failed:`, err)
  process.exitCode = 1
} finally {
  await handle.close()
}
