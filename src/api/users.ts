// Users (admin only on the server).
import { userListSchema, type User } from '@shared/schemas/users'
import { http } from './http'

export type { User }

export async function fetchUsers(signal?: AbortSignal): Promise<User[]> {
  return (await http.get('/api/users', { schema: userListSchema, signal })).items
}
