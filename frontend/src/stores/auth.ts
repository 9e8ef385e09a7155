import { defineStore } from 'pinia'
import { computed, ref } from 'vue'
import { getCsrf, getMe, login, logout } from '../api/auth'
import { isApiError, setCsrfToken } from '../api/client'
import { effectiveRole, roleAtLeast } from '../api/roles'
import type { Id, Me, Membership, ProjectRole, User } from '../api/types'

export const useAuthStore = defineStore('auth', () => {
  const user = ref<User | null>(null)
  const memberships = ref<Membership[]>([])
  const csrfToken = ref<string | null>(null)
  /** True once the server has said who we are (or that nobody is signed in). */
  const loaded = ref(false)
  let loading: Promise<boolean> | null = null

  const signedIn = computed(() => user.value !== null)
  const isAdmin = computed(() => user.value?.isAdmin ?? false)

  function useToken(token: string | null) {
    csrfToken.value = token
    setCsrfToken(token)
  }

  function apply(me: Me) {
    user.value = me.user
    memberships.value = me.memberships
  }

  /** Forget the session locally (after sign-out or when the server answers 401). */
  function clear() {
    user.value = null
    memberships.value = []
    useToken(null)
  }

  async function loadMe(): Promise<boolean> {
    try {
      apply(await getMe())
      if (!csrfToken.value) useToken((await getCsrf()).csrfToken)
      loaded.value = true
      return true
    } catch (err: unknown) {
      if (!isApiError(err, 401)) throw err
      clear()
      loaded.value = true
      return false
    }
  }

  /** Loads the session on first use; later calls share the answer. */
  function ensureLoaded(): Promise<boolean> {
    if (loaded.value) return Promise.resolve(signedIn.value)
    loading ??= loadMe().finally(() => {
      loading = null
    })
    return loading
  }

  async function signIn(email: string, password: string) {
    const result = await login(email, password)
    // The session is regenerated at sign-in: only the token returned now is valid.
    useToken(result.csrfToken)
    apply(result)
    loaded.value = true
  }

  async function signOut() {
    try {
      await logout()
    } finally {
      clear()
    }
    try {
      useToken((await getCsrf()).csrfToken)
    } catch {
      // A fresh token is fetched on the next mutating request anyway.
    }
  }

  function roleIn(projectId: Id | string): ProjectRole | null {
    const membership = memberships.value.find((m) => String(m.projectId) === String(projectId))
    return effectiveRole(isAdmin.value, membership?.role ?? null)
  }

  function can(projectId: Id | string, minimum: ProjectRole): boolean {
    return roleAtLeast(roleIn(projectId), minimum)
  }

  return {
    user,
    memberships,
    csrfToken,
    loaded,
    signedIn,
    isAdmin,
    loadMe,
    ensureLoaded,
    signIn,
    signOut,
    clear,
    roleIn,
    can,
  }
})
