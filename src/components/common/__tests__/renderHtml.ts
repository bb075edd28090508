// Renders a component to HTML in Node (no DOM) with Vant registered, for tests that check
// what a component shows; plus small readers of that HTML.
import { createSSRApp, h, type Component, type Plugin } from 'vue'
import { renderToString } from 'vue/server-renderer'
import Vant from 'vant'

export function renderHtml(
  component: unknown,
  props: Record<string, unknown> = {},
  options: { slots?: Record<string, () => unknown>; plugins?: Plugin[] } = {},
): Promise<string> {
  const app = createSSRApp({ render: () => h(component as Component, props, options.slots) })
  app.use(Vant)
  for (const plugin of options.plugins ?? []) app.use(plugin)
  return renderToString(app)
}

/** The text a person reads: tags and comments dropped, white space folded. */
export function textOf(html: string): string {
  return html
    .replace(/<!--.*?-->/g, '')
    .replace(/<[^>]+>/g, ' ')
    .replace(/\s+/g, ' ')
    .trim()
}

/** The classes of the first element whose class list contains `cls`. */
export function classesOf(html: string, cls: string): string[] {
  const m = html.match(new RegExp(`class="([^"]*\\b${cls}\\b[^"]*)"`))
  return m ? m[1].split(/\s+/) : []
}
