// Router with role guards: no session → sign-in (coming back afterwards); another role's page →
// the user's own home, with a toast saying why.
import { createRouter, createWebHistory } from 'vue-router'
import { showToast } from 'vant'
import 'vant/es/toast/style'
import { useAuthStore } from '@/stores/auth'
import { decideAccess } from './access'
import { ROLE_LABEL } from './roles'
import { routes } from './routes'

export const router = createRouter({
  history: createWebHistory(import.meta.env.BASE_URL),
  routes,
  scrollBehavior: (_to, _from, saved) => saved ?? { top: 0 },
})

router.beforeEach((to) => {
  const auth = useAuthStore()
  const decision = decideAccess(to.meta, auth.role, to.name === 'sign-in')
  if (decision.kind === 'allow') return true
  if (decision.kind === 'sign-in') {
    return { name: 'sign-in', query: to.fullPath === '/' ? {} : { redirect: to.fullPath } }
  }
  if (decision.denied && auth.role) {
    showToast({
      message: `${to.meta.title ?? 'That page'} is not part of the ${ROLE_LABEL[auth.role]} role.`,
      duration: 3000,
    })
  }
  return auth.home
})

router.afterEach((to) => {
  document.title = to.meta.title ? `${to.meta.title} · Sharpfield` : 'Sharpfield'
})
