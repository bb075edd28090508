// Registers the generated service worker (production builds only) and feeds the PWA store.
import { registerSW } from 'virtual:pwa-register'
import type { usePwaStore } from '@/stores/pwa'

const UPDATE_CHECK_MS = 60 * 60 * 1000

export function registerServiceWorker(pwa: ReturnType<typeof usePwaStore>): void {
  if (!import.meta.env.PROD || typeof navigator === 'undefined' || !('serviceWorker' in navigator))
    return
  const update = registerSW({
    immediate: true,
    onNeedRefresh() {
      pwa.needRefresh = true
    },
    onOfflineReady() {
      pwa.offlineReady = true
    },
    onRegisteredSW(_url, registration) {
      if (!registration) return
      // Long-running tabs (a day in the field) still learn about new versions.
      setInterval(() => {
        if (navigator.onLine) void registration.update().catch(() => undefined)
      }, UPDATE_CHECK_MS)
    },
  })
  pwa.attach(update)
}
