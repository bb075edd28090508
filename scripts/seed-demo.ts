// Loads the invented demo scenario into an empty database (idempotent).
import { loadConfig, redactUrl } from '../server/config'
import { createDb } from '../server/db/client'
import { seedDemo } from '../server/db/demo/seed'
import { DEMO_PASSWORD, DEMO_USERS } from '../server/db/demo/people'

const config = loadConfig()
const handle = createDb(config.databaseUrl, { connectionLimit: 2 })
try {
  const result = await seedDemo(handle.db)
  if (!result.seeded) {
    console.log('demo data already present')
  } else {
    const c = result.counts
    console.log(
      `Demo scenario loaded into ${redactUrl(config.databaseUrl)}: ${c.sites} sites, ${c.cameras} cameras, ` +
        `${c.checks} checks, ${c.measurements} measurements, ${c.workOrders} work orders.`,
    )
    const accounts = DEMO_USERS.filter((u) => u.active !== false).map(
      (u) => `${u.email} (${u.role})`,
    )
    console.log(`Demo accounts (password ${DEMO_PASSWORD}): ${accounts.join(', ')}`)
  }
} catch (err) {
  console.error('Loading the demo scenario failed:', err)
  process.exitCode = 1
} finally {
  await handle.close()
}
