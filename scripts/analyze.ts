/**
 * `npm run analyze -- FILE... [--roi x,y,w,h] [--encoding srgb|linear|gamma:G] [--json]`
 * (see scripts/analyze/args.ts for the full help text).
 */
import { runAnalyzeCli } from './analyze/cli'

process.exitCode = await runAnalyzeCli(process.argv.slice(2), {
  stdout: process.stdout,
  stderr: process.stderr,
})
