import { ref } from 'vue'
import { createProject, listProjects } from '../api/projects'
import { listUsers } from '../api/users'
import type { AdminUser, ProjectCreate, ProjectWithRole } from '../api/types'
import { useAuthStore } from '../stores/auth'

/** Page state of the projects list: the projects, and for admins the users to pick a lead from. */
export function useProjects() {
  const auth = useAuthStore()
  const projects = ref<ProjectWithRole[]>([])
  const users = ref<AdminUser[]>([])
  const loading = ref(false)
  const error = ref<string | null>(null)

  async function load() {
    loading.value = true
    error.value = null
    try {
      projects.value = await listProjects()
    } catch (err: unknown) {
      error.value = err instanceof Error ? err.message : 'Projects could not be loaded.'
    } finally {
      loading.value = false
    }
  }

  async function loadUsers() {
    if (auth.isAdmin) users.value = (await listUsers()).filter((u) => !u.disabled)
  }

  async function create(body: ProjectCreate) {
    const project = await createProject(body)
    await Promise.all([load(), auth.loadMe()])
    return project
  }

  return { projects, users, loading, error, load, loadUsers, create }
}
