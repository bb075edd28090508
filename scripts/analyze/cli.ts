import { analyzeFrame } from '../../shared/analysis/frame/analyzeFrame'
import { parseArgs, USAGE } from './args'
import { jsonLine, tableText } from './format'
import { loadFrame } from './loadFrame'

export interface CliIo {
  stdout: { write(text: string): unknown }
  stderr: { write(text: string): unknown }
}

/**
 * `npm run analyze`: analyses each file in turn and returns the exit code
 * (0 all analysed, 1 some file failed, 2 bad command line). A failing file is reported on
 * stderr and does not stop the others.
 */
export async function runAnalyzeCli(argv: string[], io: CliIo): Promise<number> {
  let args
  try {
    args = parseArgs(argv)
  } catch (error) {
    io.stderr.write(`analyze: ${(error as Error).message}\n\n${USAGE}\n`)
    return 2
  }
  if (args.help) {
    io.stdout.write(`${USAGE}\n`)
    return 0
  }
  let failed = 0
  for (const file of args.files) {
    try {
      const { image, encodingInfo } = await loadFrame(file, args.transfer)
      const analysis = analyzeFrame(image, {
        rois: args.rois.length > 0 ? args.rois : undefined,
        encodingInfo,
      })
      io.stdout.write(`${args.json ? jsonLine(file, analysis) : tableText(file, analysis)}\n`)
    } catch (error) {
      failed++
      io.stderr.write(`analyze: ${file}: ${describe(error)}\n`)
    }
  }
  return failed > 0 ? 1 : 0
}

function describe(error: unknown): string {
  if (error && typeof error === 'object' && 'code' in error) {
    const code = (error as { code?: string }).code
    if (code === 'ENOENT') return 'no such file.'
    if (code === 'EACCES') return 'permission denied.'
  }
  if (error instanceof RangeError || error instanceof TypeError) return error.message
  return error instanceof Error ? `unexpected error: ${error.message}` : String(error)
}
