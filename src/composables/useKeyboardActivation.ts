// Enter and Space activate focused elements that act as buttons, tabs or links but are not native
// controls (Vant renders cells and tab-bar items as <div role="button|tab">), so every tap target
// also works from a keyboard.
import { onMounted, onUnmounted } from 'vue'

const NATIVE = new Set(['BUTTON', 'A', 'INPUT', 'TEXTAREA', 'SELECT', 'SUMMARY'])
const ROLES = new Set(['button', 'tab', 'link', 'menuitem'])

function onKeydown(event: KeyboardEvent): void {
  if (event.key !== 'Enter' && event.key !== ' ') return
  if (event.defaultPrevented || event.altKey || event.ctrlKey || event.metaKey) return
  const el = event.target
  if (!(el instanceof HTMLElement) || NATIVE.has(el.tagName) || el.isContentEditable) return
  if (!ROLES.has(el.getAttribute('role') ?? '')) return
  event.preventDefault()
  el.click()
}

export function useKeyboardActivation(): void {
  onMounted(() => document.addEventListener('keydown', onKeydown))
  onUnmounted(() => document.removeEventListener('keydown', onKeydown))
}
