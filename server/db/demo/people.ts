import type { Role } from '../../../shared/schemas/enums'

// Demo accounts (invented people, reserved .test domain). Demo only: the README says so.
export const DEMO_PASSWORD = 'sharpfield-demo'

export interface DemoUser {
  key: string
  email: string
  name: string
  role: Role
  active?: boolean
}

export const DEMO_USERS: readonly DemoUser[] = [
  { key: 'inspector', email: 'inspector@sharpfield.test', name: 'Ines Okafor', role: 'inspector' },
  {
    key: 'inspector2',
    email: 'inspector2@sharpfield.test',
    name: 'Tomas Brandt',
    role: 'inspector',
  },
  {
    key: 'supervisor',
    email: 'supervisor@sharpfield.test',
    name: 'Sofia Marchetti',
    role: 'supervisor',
  },
  {
    key: 'maintenance',
    email: 'maintenance@sharpfield.test',
    name: 'Declan Moss',
    role: 'maintenance',
  },
  {
    key: 'maintenance2',
    email: 'maintenance2@sharpfield.test',
    name: 'Aiko Berg',
    role: 'maintenance',
  },
  { key: 'admin', email: 'admin@sharpfield.test', name: 'Morgan Reyes', role: 'admin' },
  {
    key: 'former',
    email: 'former.inspector@sharpfield.test',
    name: 'Lena Vos',
    role: 'inspector',
    active: false,
  },
]
