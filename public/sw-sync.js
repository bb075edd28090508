// Loaded into the generated service worker (workbox `importScripts` in vite.config.ts).
// Background Sync: when the browser reports the network is back for the tag the page registered,
// tell the open Sharpfield pages to push their outbox. The push itself runs in the page, which
// holds the session; this worker never sees tokens or queued data.
self.addEventListener('sync', (event) => {
  if (event.tag !== 'sharpfield-sync') return
  event.waitUntil(
    self.clients.matchAll({ type: 'window', includeUncontrolled: true }).then((pages) => {
      for (const page of pages) page.postMessage({ type: 'sharpfield:sync' })
    }),
  )
})
