// Bundles app modules (from src/) into one script that a test can evaluate in the page, so the
// test drives the app's own code against the app's own IndexedDB (no test-only code ships).
import { join } from 'node:path'
import { build } from 'esbuild'
import { ROOT } from './root'

/** `source` is TypeScript using the app's `@/` and `@shared/` aliases; its exports land on `window[globalName]`. */
export async function bundleForPage(source: string, globalName: string): Promise<string> {
  const result = await build({
    stdin: { contents: source, resolveDir: ROOT, loader: 'ts', sourcefile: `${globalName}.ts` },
    bundle: true,
    format: 'iife',
    globalName,
    platform: 'browser',
    target: 'es2022',
    write: false,
    logLevel: 'silent',
    alias: { '@': join(ROOT, 'src'), '@shared': join(ROOT, 'shared') },
    define: { 'import.meta.env': JSON.stringify({ PROD: true, DEV: false, MODE: 'production' }) },
  })
  return result.outputFiles[0].text
}
