import { taskListSchema, type Task } from '@shared/schemas/catalog'
import { http } from './http'

export type { Task }

export async function fetchTasks(signal?: AbortSignal): Promise<Task[]> {
  return (await http.get('/api/tasks', { schema: taskListSchema, signal })).items
}
