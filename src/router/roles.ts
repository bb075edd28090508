// Who lands where, and which tabs each role sees. The server enforces roles on every route;
// the client only hides what a role cannot use.
import { ROLES, type Role } from '@shared/schemas/enums'

export type { Role }

export const ROLE_LABEL: Record<Role, string> = {
  inspector: 'Inspector',
  supervisor: 'Supervisor',
  maintenance: 'Maintenance',
  admin: 'Administrator',
}

export const ROLE_HOME: Record<Role, string> = {
  inspector: '/rounds',
  supervisor: '/fleet',
  maintenance: '/work-orders',
  admin: '/setup',
}

export interface TabItem {
  /** Route path the tab opens; also the prefix that marks it active. */
  to: string
  label: string
  /** Vant icon name. */
  icon: string
}

const TAB = {
  rounds: { to: '/rounds', label: 'Rounds', icon: 'todo-list-o' },
  sync: { to: '/sync', label: 'Sync', icon: 'exchange' },
  tools: { to: '/tools', label: 'Tools', icon: 'setting-o' },
  me: { to: '/me', label: 'Me', icon: 'contact-o' },
  fleet: { to: '/fleet', label: 'Fleet', icon: 'chart-trending-o' },
  workOrders: { to: '/work-orders', label: 'Work orders', icon: 'records-o' },
  cameras: { to: '/cameras', label: 'Cameras', icon: 'video-o' },
  setup: { to: '/setup', label: 'Setup', icon: 'cluster-o' },
} satisfies Record<string, TabItem>

export const ROLE_TABS: Record<Role, TabItem[]> = {
  inspector: [TAB.rounds, TAB.sync, TAB.tools, TAB.me],
  supervisor: [TAB.fleet, TAB.workOrders, TAB.cameras, TAB.me],
  maintenance: [TAB.workOrders, TAB.me],
  admin: [TAB.setup, TAB.fleet, TAB.me],
}

export function isRole(value: unknown): value is Role {
  return typeof value === 'string' && (ROLES as readonly string[]).includes(value)
}
