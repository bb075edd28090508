// Fills a database with a large fleet for scale tests: 100 000 cameras at 500 sites and
// 1 000 000 measurements (about 350 000 checks, recurring at each task's interval), in
// multi-row INSERT batches, then rebuilds the fleet chart aggregates.
//   npm run seed:large                     # the configured database (DATABASE_URL or DB_*)
//   DATABASE_URL=mysql://…/sf_large npm run seed:large -- --cameras 100000 --measurements 1000000
// Applies the migrations first; refuses to run twice on the same database.
import { performance } from 'node:perf_hooks'
import { parseArgs } from 'node:util'
import mysql from 'mysql2/promise'
import { loadConfig, redactUrl } from '../server/config'
import { createDb } from '../server/db/client'
import { runMigrations } from '../server/db/migrate'
import { TASK_DEFAULTS } from '../server/db/taskDefaults'
import { rebuildFleetWeeks } from '../server/services/fleet/weeks'
import { hashPassword } from '../server/services/passwords'
import {
  CAMERA_COLUMNS,
  CHECK_COLUMNS,
  MEASUREMENT_COLUMNS,
  MODEL_SPECS,
  cameraBatch,
  rng,
} from './seedLarge/generate'

const { values: args } = parseArgs({
  options: {
    cameras: { type: 'string', default: '100000' },
    measurements: { type: 'string', default: '1000000' },
    sites: { type: 'string', default: '500' },
  },
})
const CAMERAS = Number(args.cameras)
const MEASUREMENTS = Number(args.measurements)
const SITES = Number(args.sites)
if (
  ![CAMERAS, MEASUREMENTS, SITES].every((n) => Number.isInteger(n) && n > 0) ||
  MEASUREMENTS < CAMERAS * 2
) {
  console.error(
    '--cameras, --measurements and --sites must be positive whole numbers, with at least 2 measurements per camera.',
  )
  process.exit(2)
}
const PER_CAMERA = Math.round(MEASUREMENTS / CAMERAS)
const BATCH = 1000 // cameras per round trip (with their checks and measurements)

const config = loadConfig()
const started = performance.now()
const handle = createDb(config.databaseUrl, { connectionLimit: 2 })
const conn = await mysql.createConnection({ uri: config.databaseUrl, timezone: 'Z' })

async function insert(table: string, columns: readonly string[], rows: unknown[][], chunk = 2000) {
  for (let i = 0; i < rows.length; i += chunk) {
    await conn.query(
      `INSERT INTO \`${table}\` (${columns.map((c) => `\`${c}\``).join(',')}) VALUES ?`,
      [rows.slice(i, i + chunk)],
    )
  }
}

async function ids(sql: string, params: unknown[] = []): Promise<number[]> {
  const [rows] = await conn.query(sql, params)
  return (rows as { id: number }[]).map((r) => r.id)
}

try {
  await runMigrations(handle.db)
  await conn.query("SET time_zone = '+00:00', foreign_key_checks = 0, unique_checks = 0")
  const [[exists]] = (await conn.query(
    "SELECT COUNT(*) AS n FROM cameras WHERE asset_tag LIKE 'SCALE-%'",
  )) as unknown as [[{ n: number }]]
  if (Number(exists.n) > 0) {
    console.error(
      `${redactUrl(config.databaseUrl)} already holds the scale data set (${exists.n} SCALE- cameras); use an empty database.`,
    )
    process.exit(1)
  }
  const now = new Date()
  const random = rng(20_250_615)

  await conn.query(
    'INSERT IGNORE INTO tasks (id, name, description, required_px_per_m, min_mtf50_cy_px, check_interval_days, work_order_priority, work_order_due_days, sort_order) VALUES ?',
    [
      TASK_DEFAULTS.map((t, i) => [
        t.id,
        t.name,
        t.description,
        t.requiredPxPerM,
        t.minMtf50CyPx,
        t.checkIntervalDays,
        t.workOrderPriority,
        t.workOrderDueDays,
        i,
      ]),
    ],
  )
  const hash = await hashPassword('scale-test-password')
  await conn.query('INSERT IGNORE INTO users (email, name, role, password_hash) VALUES ?', [
    Array.from({ length: 20 }, (_, i) => [
      `scale.inspector${String(i + 1).padStart(2, '0')}@sharpfield.test`,
      `Scale Inspector ${i + 1}`,
      'inspector',
      hash,
    ]),
  ])
  const inspectorIds = await ids(
    "SELECT id FROM users WHERE email LIKE 'scale.inspector%' ORDER BY id",
  )
  await conn.query('INSERT INTO sites (name, address, time_zone) VALUES ?', [
    Array.from({ length: SITES }, (_, i) => [
      `Scale Site ${String(i + 1).padStart(4, '0')}`,
      `${i + 1} Scale Road`,
      i % 3 ? 'Europe/London' : 'Europe/Berlin',
    ]),
  ])
  const siteIds = await ids("SELECT id FROM sites WHERE name LIKE 'Scale Site %' ORDER BY id")
  await conn.query(
    'INSERT IGNORE INTO camera_models (name, sensor_width_px, sensor_height_px, pixel_pitch_um, focal_length_min_mm, focal_length_max_mm, f_number) VALUES ?',
    [MODEL_SPECS.map((m) => [m.name, m.w, m.h, m.pitch, m.fMin, m.fMax, m.n])],
  )
  const modelIds = await ids(
    `SELECT id FROM camera_models WHERE name IN (?) ORDER BY FIELD(name, ?)`,
    [MODEL_SPECS.map((m) => m.name), MODEL_SPECS.map((m) => m.name)],
  )

  let checks = 0
  let measurements = 0
  for (let first = 0; first < CAMERAS; first += BATCH) {
    const count = Math.min(BATCH, CAMERAS - first)
    // Cameras first (their ids are needed for the checks): insert, then read the ids back.
    const batch = cameraBatch({
      first,
      count,
      total: CAMERAS,
      firstCameraId: 0,
      perCamera: PER_CAMERA,
      siteIds,
      modelIds,
      inspectorIds,
      now,
      random,
    })
    await insert('cameras', CAMERA_COLUMNS, batch.cameras)
    const tags = batch.cameras.map((c) => c[0] as string)
    const [rows] = await conn.query('SELECT id, asset_tag FROM cameras WHERE asset_tag IN (?)', [
      tags,
    ])
    const idOf = new Map(
      (rows as { id: number; asset_tag: string }[]).map((r) => [r.asset_tag, r.id]),
    )
    // The generator numbered cameras from 0 within the batch: map them to the real ids.
    const realId = tags.map((t) => idOf.get(t)!)
    for (const c of batch.checks) c[1] = realId[c[1] as number]
    await insert('checks', CHECK_COLUMNS, batch.checks)
    await insert('measurements', MEASUREMENT_COLUMNS, batch.measurements, 1000)
    await conn.query('INSERT INTO changes (entity, entity_id) VALUES ?', [
      realId.map((id) => ['camera', String(id)]),
    ])
    checks += batch.checks.length
    measurements += batch.measurements.length
    if ((first / BATCH) % 10 === 9 || first + count >= CAMERAS)
      console.log(
        `  ${first + count} cameras, ${checks} checks, ${measurements} measurements (${((performance.now() - started) / 1000).toFixed(0)} s)`,
      )
  }
  await conn.query('INSERT INTO changes (entity, entity_id) VALUES ?', [
    siteIds.map((id) => ['site', String(id)]),
  ])
  await conn.query('ANALYZE TABLE cameras, checks, measurements, sites')
  // The weekly chart aggregates are kept up by recorded checks; rows loaded in bulk need a rebuild.
  await rebuildFleetWeeks(handle.db)
  console.log(
    `Scale data set loaded into ${redactUrl(config.databaseUrl)}: ${SITES} sites, ${CAMERAS} cameras, ${checks} checks, ` +
      `${measurements} measurements in ${((performance.now() - started) / 1000).toFixed(1)} s.`,
  )
} catch (err) {
  console.error('Loading the scale data set failed:', err)
  process.exitCode = 1
} finally {
  await conn.end()
  await handle.close()
}
