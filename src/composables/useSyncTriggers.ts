// When the app syncs without being asked: when the network comes back (`online`), when the app
// comes back to the foreground, on a timer, and when the service worker relays a Background Sync
// event. The push itself always runs in the page (it needs the session), see registerBackgroundSync.

export const BACKGROUND_SYNC_TAG = 'sharpfield-sync'
export const SYNC_MESSAGE = 'sharpfield:sync'

export interface SyncTriggerOptions {
  /** Called with `force` = true when the network just returned or the SW asked. */
  run: (force: boolean) => void
  intervalMs?: number
  isOnline?: () => boolean
}

/** Installs the triggers; returns a function that removes them. */
export function installSyncTriggers(options: SyncTriggerOptions): () => void {
  if (typeof window === 'undefined') return () => undefined
  const isOnline = options.isOnline ?? (() => navigator.onLine !== false)
  const onOnline = () => options.run(true)
  const onVisible = () => {
    if (document.visibilityState === 'visible' && isOnline()) options.run(false)
  }
  const onMessage = (event: MessageEvent) => {
    if ((event.data as { type?: unknown } | null)?.type === SYNC_MESSAGE) options.run(true)
  }
  const timer = setInterval(() => {
    if (isOnline()) options.run(false)
  }, options.intervalMs ?? 60_000)
  window.addEventListener('online', onOnline)
  document.addEventListener('visibilitychange', onVisible)
  navigator.serviceWorker?.addEventListener('message', onMessage)
  return () => {
    clearInterval(timer)
    window.removeEventListener('online', onOnline)
    document.removeEventListener('visibilitychange', onVisible)
    navigator.serviceWorker?.removeEventListener('message', onMessage)
  }
}

interface SyncCapableRegistration extends ServiceWorkerRegistration {
  sync?: { register(tag: string): Promise<void> }
}

/**
 * Asks the browser for a Background Sync event when the network returns (Chromium has it; others
 * fall back to the `online` event and the timer). The service worker (public/sw-sync.js, loaded
 * by the generated worker through workbox `importScripts`) answers that event by messaging the
 * open pages, which then push: the worker never holds the session's tokens.
 */
export async function registerBackgroundSync(): Promise<boolean> {
  if (typeof navigator === 'undefined' || !navigator.serviceWorker?.controller) return false
  try {
    const registration = (await navigator.serviceWorker.ready) as SyncCapableRegistration
    if (!registration.sync) return false
    await registration.sync.register(BACKGROUND_SYNC_TAG)
    return true
  } catch {
    return false
  }
}
