// Sites, cameras and tasks for the screens: read from the device first (works offline), then
// refreshed from the server when online and saved back to the device.
import { defineStore } from 'pinia'
import { computed, ref, watch } from 'vue'
import type { Camera } from '@shared/schemas/cameras'
import type { Task } from '@shared/schemas/catalog'
import type { Site } from '@shared/schemas/sites'
import { fetchAllCameras } from '@/api/cameras'
import { ApiError, errorMessage } from '@/api/errors'
import { fetchSites } from '@/api/sites'
import { fetchTasks } from '@/api/tasks'
import { useOnline } from '@/composables/useOnline'
import { clearCatalog, loadCatalog, saveCatalog } from '@/db/catalogCache'
import { db } from '@/db/database'
import { useAuthStore, type StoreError } from './auth'

export const useCamerasStore = defineStore('cameras', () => {
  const auth = useAuthStore()
  const { online } = useOnline()

  const sites = ref<Site[]>([])
  const cameras = ref<Camera[]>([])
  const tasks = ref<Task[]>([])
  const refreshedAt = ref<string | null>(null)
  /** True once the device's copy has been read (it may be empty). */
  const loaded = ref(false)
  const refreshing = ref(false)
  const error = ref<StoreError | null>(null)

  const taskById = computed(() => new Map(tasks.value.map((t) => [t.id, t])))
  const siteById = computed(() => new Map(sites.value.map((s) => [s.id, s])))
  const cameraById = computed(() => new Map(cameras.value.map((c) => [c.id, c])))

  async function readDevice(): Promise<void> {
    const cached = await loadCatalog(db)
    // Never show another user's download.
    if (cached.userId !== null && cached.userId !== auth.user?.id) {
      await clearCatalog(db)
    } else {
      sites.value = cached.sites
      cameras.value = cached.cameras
      tasks.value = cached.tasks
      refreshedAt.value = cached.refreshedAt
    }
    loaded.value = true
  }

  /** Downloads everything, then replaces the device's copy. Offline: keeps the copy, no error. */
  async function refresh(): Promise<void> {
    if (!online.value || !auth.user || refreshing.value) return
    const userId = auth.user.id
    refreshing.value = true
    error.value = null
    try {
      const [s, c, t] = await Promise.all([fetchSites(), fetchAllCameras(), fetchTasks()])
      if (auth.user?.id !== userId) return
      const at = new Date()
      await saveCatalog(db, { sites: s, cameras: c, tasks: t }, userId, at)
      sites.value = s
      cameras.value = c
      tasks.value = t
      refreshedAt.value = at.toISOString()
    } catch (e) {
      if (e instanceof ApiError && e.isConnectivity) return
      error.value = { code: e instanceof ApiError ? e.code : 'unknown', message: errorMessage(e) }
    } finally {
      refreshing.value = false
    }
  }

  // The device's copy is read once per session, so a late read never overwrites a fresh download.
  let cachedRead: Promise<void> | null = null

  /** Shows what is saved on the device (no network). */
  function loadCached(): Promise<void> {
    cachedRead ??= readDevice()
    return cachedRead
  }

  /** What a screen calls on open: the device's copy at once, the server's when it arrives. */
  async function load(): Promise<void> {
    await loadCached()
    await refresh()
  }

  function reset(): void {
    cachedRead = null
    sites.value = []
    cameras.value = []
    tasks.value = []
    refreshedAt.value = null
    loaded.value = false
    error.value = null
  }

  // Signing out (or in as someone else) drops what this store holds and the device's copy.
  watch(
    () => auth.user?.id ?? null,
    (now, before) => {
      if (now === before) return
      reset()
      if (now === null) void clearCatalog(db)
    },
  )

  return {
    sites,
    cameras,
    tasks,
    refreshedAt,
    loaded,
    refreshing,
    error,
    taskById,
    siteById,
    cameraById,
    load,
    loadCached,
    refresh,
  }
})
