import { mkdtempSync, readdirSync, readFileSync, writeFileSync } from 'node:fs'
import { createRequire } from 'node:module'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { build, resolveConfig, type Plugin } from 'vite'
import { describe, expect, it } from 'vitest'
import { dropRemoteFonts, dropRemoteFontSources, remoteFontUrls } from '../vite/dropRemoteFonts'

// The built client must not ask for fonts from other hosts: the Content-Security-Policy allows
// fonts only from the app itself and data: URLs, so such a request is blocked and logged.

const ROOT = process.cwd()
const require = createRequire(join(ROOT, 'package.json'))
const vantIconCss = readFileSync(require.resolve('vant/es/icon/index.css'), 'utf8')

const outsideFontFaces = (css: string) => css.replace(/@font-face\s*\{[^}]*\}/gi, '@font-face{}')

describe('remote font sources', () => {
  it("drops the CDN fallback from Vant's icon font and keeps the embedded woff2", () => {
    // Vant as installed declares the CDN fallback; if it stops doing so this test needs a look.
    expect(remoteFontUrls(vantIconCss).length).toBeGreaterThan(0)
    const { css, dropped, remoteOnly } = dropRemoteFontSources(vantIconCss)
    expect(remoteFontUrls(css)).toEqual([])
    expect(dropped).toHaveLength(remoteFontUrls(vantIconCss).length)
    expect(remoteOnly).toEqual([])
    expect(css).toMatch(/@font-face\{[^}]*src:url\(data:font\/woff2;[^)]*\) format\("woff2"\)\}/)
    // The icon classes and everything else are untouched.
    expect(outsideFontFaces(css)).toBe(outsideFontFaces(vantIconCss))
  })

  it('handles quotes, http, https and protocol-relative URLs, and leaves other urls alone', () => {
    const input = [
      `@font-face { font-family: a; src: url("data:font/woff2;base64,AA,BB") format('woff2'), url('https://cdn.example.test/a.woff') format('woff'); }`,
      `@font-face { font-family: b; src: local('B'), url(http://cdn.example.test/b.ttf), url(/assets/b.woff2) format("woff2"); }`,
      `@font-face{font-family:c;src:url(/assets/c.woff2) format("woff2"),url( //cdn.example.test/c.woff )}`,
      `.hero { background: url(https://images.example.test/x.png); }`,
    ].join('\n')
    const { css, dropped } = dropRemoteFontSources(input)
    expect(dropped).toEqual([
      `url('https://cdn.example.test/a.woff') format('woff')`,
      'url(http://cdn.example.test/b.ttf)',
      'url( //cdn.example.test/c.woff )',
    ])
    expect(css.split('\n')).toEqual([
      `@font-face { font-family: a; src: url("data:font/woff2;base64,AA,BB") format('woff2'); }`,
      `@font-face { font-family: b; src: local('B'), url(/assets/b.woff2) format("woff2"); }`,
      `@font-face{font-family:c;src:url(/assets/c.woff2) format("woff2")}`,
      `.hero { background: url(https://images.example.test/x.png); }`,
    ])
  })

  it('keeps a font whose every source is remote, and reports it', () => {
    const input = `@font-face{font-family:d;src:url(https://cdn.example.test/d.woff2)}`
    const { css, dropped, remoteOnly } = dropRemoteFontSources(input)
    expect(css).toBe(input)
    expect(dropped).toEqual([])
    expect(remoteOnly).toHaveLength(1)
  })

  it("is one of the client build's plugins (vite.config.ts)", async () => {
    const config = await resolveConfig({ configFile: join(ROOT, 'vite.config.ts') }, 'build')
    expect(config.plugins.map((p) => p.name)).toContain('sharpfield:drop-remote-fonts')
  })

  it('leaves no remote font in the CSS Vite builds from the Vant icon styles', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'sharpfield-fonts-'))
    writeFileSync(join(dir, 'entry.js'), `import 'vant/es/icon/style/index'\n`)
    const builtCss = async (plugins: Plugin[], name: string) => {
      const outDir = join(dir, name)
      await build({
        configFile: false,
        root: dir,
        logLevel: 'silent',
        plugins,
        resolve: { alias: { vant: join(ROOT, 'node_modules/vant') } },
        build: {
          outDir,
          emptyOutDir: true,
          cssCodeSplit: false,
          rollupOptions: { input: join(dir, 'entry.js') },
        },
      })
      const assets = join(outDir, 'assets')
      const files = readdirSync(assets).filter((f) => f.endsWith('.css'))
      expect(files.length).toBeGreaterThan(0)
      return files.map((f) => readFileSync(join(assets, f), 'utf8')).join('\n')
    }
    // Without the plugin the fallback reaches the bundle; with it, only the data: font does.
    expect(remoteFontUrls(await builtCss([], 'plain')).length).toBeGreaterThan(0)
    const css = await builtCss([dropRemoteFonts()], 'cleaned')
    expect(remoteFontUrls(css)).toEqual([])
    expect(css).toMatch(/font-family:\s*vant-icon/)
    expect(css).toMatch(/url\(data:font\/woff2;/)
  }, 60_000)
})
