import { ref } from 'vue'
import { createUser, listUsers, updateUser } from '../api/users'
import type { AdminUser, UserCreate, UserUpdate } from '../api/types'
import { describeError } from '../logic/format'

/** Page state of user administration. */
export function useAdminUsers() {
  const users = ref<AdminUser[]>([])
  const loading = ref(false)
  const error = ref<string | null>(null)

  async function load() {
    loading.value = true
    error.value = null
    try {
      users.value = (await listUsers()).sort((a, b) => a.email.localeCompare(b.email))
    } catch (err: unknown) {
      error.value = describeError(err, 'Users could not be loaded.')
    } finally {
      loading.value = false
    }
  }

  async function create(body: UserCreate) {
    await createUser(body)
    await load()
  }

  async function update(user: AdminUser, change: Omit<UserUpdate, 'version'>) {
    error.value = null
    try {
      const saved = await updateUser(user.id, { version: user.version, ...change })
      users.value = users.value.map((u) => (u.id === saved.id ? saved : u))
    } catch (err: unknown) {
      error.value = describeError(err)
      await load()
    }
  }

  return { users, loading, error, load, create, update }
}
