// The signed-in session: user + tokens, kept in localStorage so the app opens signed-in with no
// network. The store is the http wrapper's token store, so refreshed tokens are saved here too.
import { defineStore } from 'pinia'
import { computed, ref } from 'vue'
import { z } from 'zod'
import { sessionUserSchema } from '@shared/schemas/auth'
import { fetchMe, login, logout, type SessionUser } from '@/api/auth'
import { ApiError, errorMessage } from '@/api/errors'
import { http, type SessionTokens } from '@/api/http'
import { ROLE_HOME, ROLE_TABS } from '@/router/roles'
import { signInErrorMessage } from './signInErrors'

export const SESSION_STORAGE_KEY = 'sharpfield.session'

const storedSessionSchema = z.object({
  version: z.literal(1),
  user: sessionUserSchema,
  token: z.string().min(1),
  refreshToken: z.string().min(1),
  savedAt: z.string(),
})

function storage(): Storage | null {
  return typeof globalThis.localStorage === 'undefined' ? null : globalThis.localStorage
}

export interface StoreError {
  code: string
  message: string
}

export const useAuthStore = defineStore('auth', () => {
  const user = ref<SessionUser | null>(null)
  const tokens = ref<SessionTokens | null>(null)
  const busy = ref(false)
  const error = ref<StoreError | null>(null)
  /** Set when the server refused to renew the session; the sign-in screen explains it. */
  const expired = ref(false)

  const isSignedIn = computed(() => user.value !== null && tokens.value !== null)
  const role = computed(() => user.value?.role ?? null)
  const home = computed(() => (role.value ? ROLE_HOME[role.value] : '/sign-in'))
  const tabs = computed(() => (role.value ? ROLE_TABS[role.value] : []))

  function persist(): void {
    const s = storage()
    if (!s) return
    if (!user.value || !tokens.value) {
      s.removeItem(SESSION_STORAGE_KEY)
      return
    }
    const record: z.infer<typeof storedSessionSchema> = {
      version: 1,
      user: user.value,
      token: tokens.value.token,
      refreshToken: tokens.value.refreshToken,
      savedAt: new Date().toISOString(),
    }
    s.setItem(SESSION_STORAGE_KEY, JSON.stringify(record))
  }

  /** Reads the saved session; a missing, corrupt or outdated record leaves the user signed out. */
  function restore(): boolean {
    const raw = storage()?.getItem(SESSION_STORAGE_KEY)
    if (!raw) return false
    let parsed: z.ZodSafeParseResult<z.infer<typeof storedSessionSchema>>
    try {
      parsed = storedSessionSchema.safeParse(JSON.parse(raw))
    } catch {
      parsed = storedSessionSchema.safeParse(null)
    }
    if (!parsed.success) {
      storage()?.removeItem(SESSION_STORAGE_KEY)
      return false
    }
    user.value = parsed.data.user
    tokens.value = { token: parsed.data.token, refreshToken: parsed.data.refreshToken }
    return true
  }

  function clearSession(): void {
    user.value = null
    tokens.value = null
    persist()
  }

  http.configure({
    tokens: {
      get: () => tokens.value,
      set: (fresh) => {
        tokens.value = fresh
        persist()
      },
      expire: () => {
        clearSession()
        expired.value = true
      },
    },
  })
  restore()

  async function signIn(email: string, password: string): Promise<boolean> {
    busy.value = true
    error.value = null
    try {
      const answer = await login(email.trim(), password)
      user.value = answer.user
      tokens.value = { token: answer.token, refreshToken: answer.refreshToken }
      expired.value = false
      persist()
      return true
    } catch (e) {
      error.value = {
        code: e instanceof ApiError ? e.code : 'unknown',
        message: signInErrorMessage(e),
      }
      return false
    } finally {
      busy.value = false
    }
  }

  /** Ends the session here at once; tells the server when it can be reached. */
  async function signOut(): Promise<void> {
    const ended = tokens.value
    clearSession()
    expired.value = false
    error.value = null
    if (!ended) return
    try {
      await logout(ended)
    } catch {
      // Offline or already revoked: the local session is gone either way.
    }
  }

  /** Refreshes the user's name and role from the server when online (roles can change). */
  async function revalidate(): Promise<void> {
    if (!isSignedIn.value) return
    try {
      user.value = await fetchMe()
      persist()
    } catch (e) {
      if (e instanceof ApiError && e.isConnectivity) return
      if (isSignedIn.value) error.value = { code: 'revalidate', message: errorMessage(e) }
    }
  }

  return {
    user,
    tokens,
    busy,
    error,
    expired,
    isSignedIn,
    role,
    home,
    tabs,
    signIn,
    signOut,
    revalidate,
    restore,
  }
})
