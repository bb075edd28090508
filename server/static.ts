import { existsSync } from 'node:fs'
import { join } from 'node:path'
import express from 'express'
import type { Express } from 'express'

const NOT_BUILT_PAGE = `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><title>Sharpfield — client not built</title></head>
<body style="font-family:sans-serif;max-width:40rem;margin:3rem auto;line-height:1.5">
<h1>Sharpfield is running, but the app is not built yet</h1>
<p>The API answers under <code>/api</code>. To serve the app, build it with <code>npm run build</code>
(or start everything with <code>npm start</code>) and reload this page.</p>
</body></html>`

/**
 * Serves the built PWA from `staticDir`: hashed assets cached for a year, everything else
 * revalidated; any other GET that is not /api and not a file name gets index.html (the client router takes over).
 * Without a build, a clear 503 page explains what to do.
 */
export function mountClient(app: Express, staticDir: string): void {
  app.use(
    express.static(staticDir, {
      index: false,
      setHeaders(res, path) {
        if (path.includes(`${join(staticDir, 'assets')}`)) {
          res.setHeader('Cache-Control', 'public, max-age=31536000, immutable')
        } else {
          res.setHeader('Cache-Control', 'no-cache')
        }
      },
    }),
  )
  app.get('/{*splat}', (req, res, next) => {
    if (req.path === '/api' || req.path.startsWith('/api/')) return next()
    // A missing file (e.g. an old hashed asset) is a 404, not the app page.
    if (/\.[A-Za-z0-9]+$/.test(req.path)) {
      res.status(404).type('text').send('Not found')
      return
    }
    const index = join(staticDir, 'index.html')
    if (!existsSync(index)) {
      res.status(503).type('html').send(NOT_BUILT_PAGE)
      return
    }
    res.setHeader('Cache-Control', 'no-cache')
    res.sendFile(index)
  })
}
