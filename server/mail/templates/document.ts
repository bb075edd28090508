// One e-mail document rendered twice: plain text and a small self-contained HTML page. All text
// passed in is treated as untrusted (names, notes and reasons come from users) and escaped here;
// nothing else in the mail code writes HTML.

export interface MailFact {
  label: string
  value: string
}

export interface MailDoc {
  /** First line of the body, also the HTML heading. */
  heading: string
  /** Paragraphs of plain words. */
  paragraphs: string[]
  /** Label/value pairs shown as a table (HTML) or aligned lines (text). */
  facts?: MailFact[]
  /** A quoted user text (a note or a reason), with its label. */
  quote?: { label: string; text: string }
  /** A list of lines (e.g. overdue orders in the digest). */
  list?: { heading: string; items: { text: string; url?: string }[] }
  action?: { label: string; url: string }
}

export interface MailContent {
  subject: string
  text: string
  html: string
}

const HTML_ESCAPES: Record<string, string> = {
  '&': '&amp;',
  '<': '&lt;',
  '>': '&gt;',
  '"': '&quot;',
  "'": '&#39;',
}

export function escapeHtml(value: string): string {
  return value.replace(/[&<>"']/g, (c) => HTML_ESCAPES[c])
}

/** Only http(s) links go into an href; anything else is dropped. */
function safeUrl(url: string): string | null {
  return /^https?:\/\//i.test(url) ? url : null
}

/** Collapses control characters (but keeps line breaks) so a header-like text stays one mail. */
function clean(value: string): string {
  return value.replace(/[\u0000-\u0008\u000b\u000c\u000e-\u001f\u007f]/g, ' ')
}

/** A subject line: one line, no control characters, at most 200 characters. */
export function subjectLine(value: string): string {
  const one = clean(value).replace(/\s+/g, ' ').trim()
  return one.length > 200 ? `${one.slice(0, 199)}…` : one
}

const FOOTER =
  'You receive this because of your role in Sharpfield. Replies to this address are not read.'

export function renderText(doc: MailDoc): string {
  const out: string[] = [clean(doc.heading), '']
  for (const p of doc.paragraphs) out.push(clean(p), '')
  if (doc.facts?.length) {
    const width = Math.max(...doc.facts.map((f) => f.label.length))
    for (const f of doc.facts) out.push(`${`${f.label}:`.padEnd(width + 2)}${clean(f.value)}`)
    out.push('')
  }
  if (doc.quote) {
    out.push(`${doc.quote.label}:`)
    for (const line of clean(doc.quote.text).split(/\r?\n/)) out.push(`  > ${line}`)
    out.push('')
  }
  if (doc.list) {
    out.push(doc.list.heading)
    for (const item of doc.list.items)
      out.push(`  - ${clean(item.text)}${item.url ? `\n    ${item.url}` : ''}`)
    out.push('')
  }
  if (doc.action) out.push(`${doc.action.label}: ${doc.action.url}`, '')
  out.push('-- ', FOOTER)
  return out.join('\n')
}

const css = {
  body: 'margin:0;padding:24px;background:#eef2f1;font-family:Inter,Arial,sans-serif;color:#13201f;',
  card: 'max-width:560px;margin:0 auto;background:#ffffff;border-radius:12px;padding:24px;border-top:6px solid #0f3d3e;',
  h1: 'margin:0 0 16px;font-size:20px;line-height:28px;color:#0f3d3e;',
  p: 'margin:0 0 12px;font-size:15px;line-height:22px;',
  th: 'text-align:left;padding:4px 12px 4px 0;font-size:14px;color:#3a4a49;font-weight:600;vertical-align:top;',
  td: 'padding:4px 0;font-size:14px;',
  quote: 'margin:12px 0;padding:8px 12px;border-left:4px solid #e8a33d;background:#fbefd9;font-size:14px;white-space:pre-wrap;',
  button: 'display:inline-block;margin-top:12px;padding:10px 16px;border-radius:8px;background:#0f3d3e;color:#ffffff;text-decoration:none;font-weight:600;',
  foot: 'max-width:560px;margin:12px auto 0;font-size:12px;color:#5c6b6a;',
}

export function renderHtml(doc: MailDoc): string {
  const e = (s: string) => escapeHtml(clean(s))
  const parts: string[] = [`<h1 style="${css.h1}">${e(doc.heading)}</h1>`]
  for (const p of doc.paragraphs) parts.push(`<p style="${css.p}">${e(p)}</p>`)
  if (doc.facts?.length) {
    const rows = doc.facts
      .map((f) => `<tr><th style="${css.th}">${e(f.label)}</th><td style="${css.td}">${e(f.value)}</td></tr>`)
      .join('')
    parts.push(`<table role="presentation" cellspacing="0" cellpadding="0">${rows}</table>`)
  }
  if (doc.quote) {
    parts.push(`<p style="${css.p}"><strong>${e(doc.quote.label)}</strong></p>`)
    parts.push(`<blockquote style="${css.quote}">${e(doc.quote.text)}</blockquote>`)
  }
  if (doc.list) {
    const items = doc.list.items
      .map((item) => {
        const url = item.url ? safeUrl(item.url) : null
        return `<li style="${css.td}">${url ? `<a href="${escapeHtml(url)}">${e(item.text)}</a>` : e(item.text)}</li>`
      })
      .join('')
    parts.push(`<p style="${css.p}"><strong>${e(doc.list.heading)}</strong></p><ul>${items}</ul>`)
  }
  const actionUrl = doc.action ? safeUrl(doc.action.url) : null
  if (doc.action && actionUrl)
    parts.push(`<a style="${css.button}" href="${escapeHtml(actionUrl)}">${e(doc.action.label)}</a>`)
  return [
    '<!doctype html>',
    '<html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width">',
    `<title>${e(doc.heading)}</title></head>`,
    `<body style="${css.body}"><div style="${css.card}">${parts.join('\n')}</div>`,
    `<p style="${css.foot}">${escapeHtml(FOOTER)}</p></body></html>`,
  ].join('\n')
}

export function renderMail(subject: string, doc: MailDoc): MailContent {
  return { subject: subjectLine(subject), text: renderText(doc), html: renderHtml(doc) }
}
