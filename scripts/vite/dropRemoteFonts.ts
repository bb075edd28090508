// Vite plugin: drops remote sources from @font-face rules in the CSS the client bundles.
// Vant's icon font is embedded as a data: woff2 with a CDN woff as fallback; the app's
// Content-Security-Policy allows fonts only from itself and data:, so the browser would log a
// blocked request for the fallback. Every browser the app supports reads woff2, so the embedded
// font is all it needs.
import type { Plugin } from 'vite'

const FONT_FACE = /@font-face\s*\{[^}]*\}/gi
const SRC = /\bsrc\s*:/gi
/** url(…) pointing at another host: http:, https: or protocol-relative //host. */
const REMOTE_URL = /url\(\s*(['"]?)\s*(?:https?:)?\/\//i
const CSS_ID = /\.css(?:$|\?)/

/**
 * Splits a declaration value at top-level commas, up to its end (a top-level `;` or `}`):
 * data: URLs carry commas and semicolons inside url().
 */
function splitSources(text: string, from: number): { sources: string[]; end: number } {
  const sources: string[] = []
  let depth = 0
  let quote: string | null = null
  let start = from
  let i = from
  for (; i < text.length; i++) {
    const ch = text[i]
    if (quote) {
      if (ch === quote) quote = null
    } else if (ch === '"' || ch === "'") quote = ch
    else if (ch === '(') depth++
    else if (ch === ')') depth--
    else if (depth === 0 && (ch === ';' || ch === '}')) break
    else if (depth === 0 && ch === ',') {
      sources.push(text.slice(start, i))
      start = i + 1
    }
  }
  sources.push(text.slice(start, i))
  return { sources, end: i }
}

export interface DroppedFonts {
  css: string
  /** The remote sources taken out. */
  dropped: string[]
  /** @font-face rules left alone because every source is remote (nothing local to keep). */
  remoteOnly: string[]
}

/**
 * Removes remote url() sources from every @font-face `src` that also has a local one
 * (data:, a bundled file or local()). Everything else in the CSS stays byte for byte.
 */
export function dropRemoteFontSources(css: string): DroppedFonts {
  const dropped: string[] = []
  const remoteOnly: string[] = []
  const out = css.replace(FONT_FACE, (rule) => {
    let result = ''
    let copied = 0
    for (const match of rule.matchAll(SRC)) {
      const from = match.index + match[0].length
      const { sources, end } = splitSources(rule, from)
      const remote = sources.filter((s) => REMOTE_URL.test(s))
      if (remote.length === 0) continue
      if (remote.length === sources.length) {
        remoteOnly.push(rule.slice(0, 120))
        continue
      }
      dropped.push(...remote.map((s) => s.trim()))
      const kept = sources.filter((s) => !REMOTE_URL.test(s))
      result += rule.slice(copied, from) + kept.join(',')
      copied = end
    }
    return result + rule.slice(copied)
  })
  return { css: out, dropped, remoteOnly }
}

/** url(…) sources of @font-face rules that point at another host (for checks of built CSS). */
export function remoteFontUrls(css: string): string[] {
  const rules = css.match(FONT_FACE) ?? []
  return rules.flatMap((r) => r.match(/url\(\s*['"]?\s*(?:https?:)?\/\/[^)]*\)/gi) ?? [])
}

/** The plugin: runs on CSS before Vite bundles it (Vant's included). */
export function dropRemoteFonts(): Plugin {
  return {
    name: 'sharpfield:drop-remote-fonts',
    enforce: 'pre',
    transform(code, id) {
      if (!CSS_ID.test(id) || !code.includes('@font-face')) return null
      const { css, dropped, remoteOnly } = dropRemoteFontSources(code)
      for (const rule of remoteOnly) {
        this.warn(`an @font-face in ${id} has only remote sources, kept as is: ${rule}`)
      }
      return dropped.length ? { code: css, map: null } : null
    },
  }
}
