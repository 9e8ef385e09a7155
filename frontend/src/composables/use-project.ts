import { computed, ref } from 'vue'
import {
  addMember,
  changeMemberRole,
  getProject,
  listMembers,
  removeMember,
  updateProject,
} from '../api/projects'
import { createHole, listHoles, updateHole } from '../api/holes'
import type {
  Hole,
  HoleFields,
  Id,
  Member,
  ProjectRole,
  ProjectUpdate,
  ProjectWithRole,
} from '../api/types'
import { useAuthStore } from '../stores/auth'
import { describeError } from '../logic/format'
import { useNotFound } from './use-not-found'

/** Page state of a project's home: its settings, holes and members, and the edits on them. */
export function useProject(projectId: () => string) {
  const auth = useAuthStore()
  const handleMissing = useNotFound()
  const project = ref<ProjectWithRole | null>(null)
  const holes = ref<Hole[]>([])
  const members = ref<Member[]>([])
  const loading = ref(false)
  const error = ref<string | null>(null)

  const role = computed(() => auth.roleIn(projectId()))
  const canLog = computed(() => auth.can(projectId(), 'logger'))
  const isLead = computed(() => auth.can(projectId(), 'lead'))

  async function load() {
    loading.value = true
    error.value = null
    try {
      const id = projectId()
      const [p, h, m] = await Promise.all([getProject(id), listHoles(id), listMembers(id)])
      project.value = p
      holes.value = [...h].sort((a, b) => a.name.localeCompare(b.name))
      members.value = m
    } catch (err: unknown) {
      if (!handleMissing(err)) error.value = describeError(err, 'The project could not be loaded.')
    } finally {
      loading.value = false
    }
  }

  async function reloadProject() {
    project.value = await getProject(projectId())
  }

  async function saveSettings(update: ProjectUpdate) {
    const saved = await updateProject(projectId(), update)
    project.value = { ...saved, role: project.value?.role ?? 'lead' }
  }

  async function saveHole(fields: HoleFields, existing: Hole | null) {
    const id = projectId()
    const saved = existing
      ? await updateHole(id, existing.id, { ...fields, version: existing.version })
      : await createHole(id, fields)
    const others = holes.value.filter((h) => h.id !== saved.id)
    holes.value = [...others, saved].sort((a, b) => a.name.localeCompare(b.name))
    return saved
  }

  async function refreshMembers() {
    members.value = await listMembers(projectId())
  }

  /** An invitation, not a membership: the member list changes when they accept. */
  async function addProjectMember(email: string, memberRole: ProjectRole) {
    return addMember(projectId(), email, memberRole)
  }

  async function changeRole(userId: Id, memberRole: ProjectRole) {
    await changeMemberRole(projectId(), userId, memberRole)
    await refreshMembers()
    if (auth.user && String(auth.user.id) === String(userId)) await auth.loadMe()
  }

  async function removeProjectMember(userId: Id) {
    await removeMember(projectId(), userId)
    await refreshMembers()
    if (auth.user && String(auth.user.id) === String(userId)) await auth.loadMe()
  }

  return {
    project,
    holes,
    members,
    loading,
    error,
    role,
    canLog,
    isLead,
    load,
    reloadProject,
    saveSettings,
    saveHole,
    addProjectMember,
    changeRole,
    removeProjectMember,
  }
}
