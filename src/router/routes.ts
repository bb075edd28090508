// The route table. Views load lazily; `roles` lists who may open a route (absent: every
// signed-in user); `public` routes need no session.
import type { RouteRecordRaw } from 'vue-router'
import { useAuthStore } from '@/stores/auth'
import type { Role } from './roles'

declare module 'vue-router' {
  interface RouteMeta {
    /** Shown in the nav bar and the document title. */
    title?: string
    roles?: readonly Role[]
    public?: boolean
    /** Show a back arrow in the nav bar. */
    back?: boolean
    /** No nav bar and no tab bar (sign-in). */
    bare?: boolean
    /** Tabs to mark active, first one the role has, when the path is under none of them. */
    tabs?: readonly string[]
  }
}

export const routes: RouteRecordRaw[] = [
  { path: '/', name: 'start', redirect: () => useAuthStore().home },
  {
    path: '/sign-in',
    name: 'sign-in',
    component: () => import('@/views/SignInView.vue'),
    meta: { title: 'Sign in', public: true, bare: true },
  },
  {
    path: '/rounds',
    name: 'rounds',
    component: () => import('@/views/RoundsView.vue'),
    meta: { title: 'Rounds', roles: ['inspector'] },
  },
  {
    path: '/sync',
    name: 'sync',
    component: () => import('@/views/SyncView.vue'),
    meta: { title: 'Sync', roles: ['inspector'] },
  },
  {
    path: '/tools',
    name: 'tools',
    component: () => import('@/views/ToolsView.vue'),
    meta: { title: 'Tools', roles: ['inspector'] },
  },
  {
    path: '/fleet',
    name: 'fleet',
    component: () => import('@/views/FleetView.vue'),
    meta: { title: 'Fleet', roles: ['supervisor', 'admin'] },
  },
  {
    path: '/work-orders',
    name: 'work-orders',
    component: () => import('@/views/WorkOrdersView.vue'),
    meta: { title: 'Work orders', roles: ['supervisor', 'maintenance'] },
  },
  {
    path: '/work-orders/:id(\\d+)',
    name: 'work-order',
    component: () => import('@/views/WorkOrderView.vue'),
    props: (route) => ({ id: Number(route.params.id) }),
    meta: { title: 'Work order', back: true, roles: ['supervisor', 'maintenance'] },
  },
  {
    path: '/mailbox',
    name: 'mailbox',
    component: () => import('@/views/MailboxView.vue'),
    meta: { title: 'Mailbox (demo)', back: true, roles: ['supervisor', 'admin'] },
  },
  {
    path: '/cameras',
    name: 'cameras',
    component: () => import('@/views/CamerasView.vue'),
    meta: { title: 'Cameras', roles: ['supervisor', 'admin'] },
  },
  {
    path: '/cameras/:id(\\d+)',
    name: 'camera',
    component: () => import('@/views/CameraView.vue'),
    props: (route) => ({ id: Number(route.params.id) }),
    meta: { title: 'Camera', back: true, tabs: ['/rounds', '/cameras', '/fleet', '/work-orders'] },
  },
  {
    path: '/cameras/:id(\\d+)/check',
    name: 'camera-check',
    component: () => import('@/views/CheckView.vue'),
    props: (route) => ({ id: Number(route.params.id) }),
    meta: { title: 'Check', back: true, roles: ['inspector', 'supervisor'], tabs: ['/rounds', '/cameras'] },
  },
  {
    path: '/checks/:checkId([0-9a-fA-F-]{36})',
    name: 'check',
    component: () => import('@/views/CheckResultView.vue'),
    props: true,
    meta: { title: 'Check result', back: true, roles: ['inspector', 'supervisor'], tabs: ['/rounds', '/cameras'] },
  },
  {
    path: '/tools/targets',
    name: 'targets',
    component: () => import('@/views/TargetsView.vue'),
    meta: { title: 'Targets', back: true, tabs: ['/tools', '/me'] },
  },
  {
    path: '/tools/lens',
    name: 'lens',
    component: () => import('@/views/LensView.vue'),
    meta: { title: 'Lens calculator', back: true, tabs: ['/tools', '/me'] },
  },
  {
    path: '/fleet/cameras/:id(\\d+)',
    name: 'fleet-camera',
    component: () => import('@/views/FleetCameraView.vue'),
    props: (route) => ({ id: Number(route.params.id) }),
    meta: { title: 'Camera history', back: true, roles: ['supervisor', 'admin'], tabs: ['/cameras', '/fleet'] },
  },
  {
    path: '/fleet/rounds',
    name: 'fleet-rounds',
    component: () => import('@/views/RoundsAssignView.vue'),
    meta: { title: 'Rounds', back: true, roles: ['supervisor'] },
  },
  {
    path: '/fleet/thresholds',
    name: 'fleet-thresholds',
    component: () => import('@/views/ThresholdsView.vue'),
    meta: { title: 'Task thresholds', back: true, roles: ['supervisor', 'admin'] },
  },
  {
    path: '/setup/audit',
    name: 'setup-audit',
    component: () => import('@/views/AuditLogView.vue'),
    meta: { title: 'Audit log', back: true, roles: ['admin'] },
  },
  {
    path: '/setup',
    name: 'setup',
    component: () => import('@/views/SetupView.vue'),
    meta: { title: 'Setup', roles: ['admin'] },
  },
  {
    path: '/me',
    name: 'me',
    component: () => import('@/views/MeView.vue'),
    meta: { title: 'Me' },
  },
  {
    path: '/safety',
    name: 'safety',
    component: () => import('@/views/SafetyView.vue'),
    meta: { title: 'Safety notes', back: true, public: true, tabs: ['/tools', '/me'] },
  },
  {
    path: '/:pathMatch(.*)*',
    name: 'not-found',
    component: () => import('@/views/NotFoundView.vue'),
    meta: { title: 'Not found', public: true },
  },
]
