// The user list for administrators (the server refuses it to other roles).
import { defineStore } from 'pinia'
import { ref } from 'vue'
import { ApiError, errorMessage } from '@/api/errors'
import { fetchUsers, type User } from '@/api/users'
import type { StoreError } from './auth'

export const useUsersStore = defineStore('users', () => {
  const users = ref<User[]>([])
  const loading = ref(false)
  const loaded = ref(false)
  const error = ref<StoreError | null>(null)

  async function load(): Promise<void> {
    loading.value = true
    error.value = null
    try {
      users.value = await fetchUsers()
      loaded.value = true
    } catch (e) {
      error.value = { code: e instanceof ApiError ? e.code : 'unknown', message: errorMessage(e) }
    } finally {
      loading.value = false
    }
  }

  return { users, loading, loaded, error, load }
})
