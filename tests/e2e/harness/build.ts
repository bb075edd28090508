// Builds the client when dist/ is missing or older than any of its sources.
import { spawnSync } from 'node:child_process'
import { existsSync, readdirSync, statSync } from 'node:fs'
import { join } from 'node:path'
import { ROOT } from './root'

const SOURCES = [
  'src',
  'shared',
  'public',
  'index.html',
  'vite.config.ts',
  'scripts/vite',
  'package.json',
]

function newestMtimeMs(path: string): number {
  if (!existsSync(path)) return 0
  const stat = statSync(path)
  if (!stat.isDirectory()) return stat.mtimeMs
  let newest = stat.mtimeMs
  for (const entry of readdirSync(path)) {
    if (entry === '__tests__' || entry === 'node_modules') continue
    newest = Math.max(newest, newestMtimeMs(join(path, entry)))
  }
  return newest
}

export function ensureClientBuilt(): void {
  const builtAt = join(ROOT, 'dist', 'sw.js')
  const stale =
    !existsSync(builtAt) ||
    statSync(builtAt).mtimeMs < Math.max(...SOURCES.map((s) => newestMtimeMs(join(ROOT, s))))
  if (!stale) return
  console.log('[e2e] building the client (vite build)…')
  const result = spawnSync(
    process.execPath,
    [join(ROOT, 'node_modules/vite/bin/vite.js'), 'build', '--logLevel', 'warn'],
    {
      cwd: ROOT,
      // vitest sets NODE_ENV=test, and Vite would bake that into the bundle (test-only code paths).
      env: { ...process.env, NODE_ENV: 'production' },
      stdio: 'inherit',
    },
  )
  if (result.status !== 0)
    throw new Error(`vite build failed (exit ${result.status}); the e2e tests need a built client.`)
}
