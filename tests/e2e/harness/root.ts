import { fileURLToPath } from 'node:url'

/** The repository root. */
export const ROOT = fileURLToPath(new URL('../../../', import.meta.url))
