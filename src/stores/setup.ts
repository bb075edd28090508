// Setup lists (users, sites, camera models, tasks) for the admin screens and the pickers of
// the fleet screens; each refreshed after a change.
import { defineStore } from 'pinia'
import { ref } from 'vue'
import { ApiError, errorMessage } from '@/api/errors'
import { fetchModels, type CameraModel, type Site, type Task, type User } from '@/api/setup'
import { fetchSites } from '@/api/sites'
import { fetchTasks } from '@/api/tasks'
import { fetchUsers } from '@/api/users'
import type { StoreError } from './auth'

export const useSetupStore = defineStore('setup', () => {
  const users = ref<User[]>([])
  const sites = ref<Site[]>([])
  const models = ref<CameraModel[]>([])
  const tasks = ref<Task[]>([])
  const loaded = ref(false)
  const error = ref<StoreError | null>(null)

  async function guard(work: () => Promise<void>): Promise<void> {
    error.value = null
    try {
      await work()
    } catch (e) {
      error.value = { code: e instanceof ApiError ? e.code : 'unknown', message: errorMessage(e) }
    }
  }

  /** Sites, models and tasks (every role that sees the fleet may read them). */
  function loadCatalog(): Promise<void> {
    return guard(async () => {
      const [s, m, t] = await Promise.all([fetchSites(), fetchModels(), fetchTasks()])
      sites.value = s
      models.value = m
      tasks.value = t
      loaded.value = true
    })
  }

  /** Users too (admins only). */
  function loadAll(): Promise<void> {
    return guard(async () => {
      const [u] = await Promise.all([fetchUsers(), loadCatalog()])
      users.value = u
    })
  }

  const refreshUsers = () => guard(async () => void (users.value = await fetchUsers()))
  const refreshSites = () => guard(async () => void (sites.value = await fetchSites()))
  const refreshModels = () => guard(async () => void (models.value = await fetchModels()))
  const refreshTasks = () => guard(async () => void (tasks.value = await fetchTasks()))

  return {
    users,
    sites,
    models,
    tasks,
    loaded,
    error,
    loadCatalog,
    loadAll,
    refreshUsers,
    refreshSites,
    refreshModels,
    refreshTasks,
  }
})
