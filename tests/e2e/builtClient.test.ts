import { readdirSync, readFileSync } from 'node:fs'
import { join } from 'node:path'
import { describe, expect, it } from 'vitest'
import { remoteFontUrls } from '../../scripts/vite/dropRemoteFonts'
import { ROOT } from './harness/root'

// The client global-setup built (dist/): its styles ask for no font from another host, which
// the Content-Security-Policy would block and the browser log as an error.

describe('the built client', () => {
  it('references no remote font in its CSS, and keeps the icon font embedded', () => {
    const assets = join(ROOT, 'dist', 'assets')
    const files = readdirSync(assets).filter((f) => f.endsWith('.css'))
    expect(files.length).toBeGreaterThan(0)
    const css = files.map((f) => [f, readFileSync(join(assets, f), 'utf8')] as const)
    expect(css.flatMap(([f, text]) => remoteFontUrls(text).map((u) => `${f}: ${u}`))).toEqual([])
    const icons = css.filter(([, text]) => /font-family:\s*vant-icon/.test(text))
    expect(icons.length).toBeGreaterThan(0)
    expect(icons.some(([, text]) => /url\(data:font\/woff2;/.test(text))).toBe(true)
  })
})
