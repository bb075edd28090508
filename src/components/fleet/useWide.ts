// True on screens wide enough for tables (desktop), false on phones.
import { onBeforeUnmount, ref, type Ref } from 'vue'

export function useWide(minWidthPx = 760): Ref<boolean> {
  const query =
    typeof window === 'undefined' ? null : window.matchMedia(`(min-width: ${minWidthPx}px)`)
  const wide = ref(query?.matches ?? false)
  const update = (e: MediaQueryListEvent) => (wide.value = e.matches)
  query?.addEventListener('change', update)
  onBeforeUnmount(() => query?.removeEventListener('change', update))
  return wide
}
