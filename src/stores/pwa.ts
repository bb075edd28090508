// Service-worker state for the shell: whether a new version waits, and how to switch to it.
import { defineStore } from 'pinia'
import { ref } from 'vue'

type Updater = (reloadPage?: boolean) => Promise<void>

export const usePwaStore = defineStore('pwa', () => {
  /** A new version is installed and waits for the user's go-ahead. */
  const needRefresh = ref(false)
  /** The app shell is cached: the app opens with no network from now on. */
  const offlineReady = ref(false)
  let updater: Updater | null = null

  function attach(update: Updater): void {
    updater = update
  }

  /** Activates the waiting service worker; the page reloads on the new version. */
  async function applyUpdate(): Promise<void> {
    needRefresh.value = false
    await updater?.(true)
  }

  function dismissUpdate(): void {
    needRefresh.value = false
  }

  return { needRefresh, offlineReady, attach, applyUpdate, dismissUpdate }
})
