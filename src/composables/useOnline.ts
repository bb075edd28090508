// Whether the browser believes it has a network. One shared ref for the whole app.
import { readonly, ref, type Ref } from 'vue'

const online = ref(typeof navigator === 'undefined' ? true : navigator.onLine !== false)
let listening = false

function listen(): void {
  if (listening || typeof window === 'undefined') return
  listening = true
  window.addEventListener('online', () => (online.value = true))
  window.addEventListener('offline', () => (online.value = false))
}

export function useOnline(): { online: Readonly<Ref<boolean>> } {
  listen()
  return { online: readonly(online) }
}
