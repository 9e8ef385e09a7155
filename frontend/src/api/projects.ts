import { api, seg } from './client'
import type {
  IdParam,
  Member,
  Project,
  ProjectCreate,
  ProjectRole,
  ProjectUpdate,
  ProjectWithRole,
} from './types'

const base = (projectId: IdParam) => `/projects/${seg(projectId)}`

export const listProjects = () => api.get<ProjectWithRole[]>('/projects')

export const createProject = (body: ProjectCreate) => api.post<Project>('/projects', body)

export const getProject = (projectId: IdParam) => api.get<ProjectWithRole>(base(projectId))

export const updateProject = (projectId: IdParam, body: ProjectUpdate) =>
  api.patch<Project>(base(projectId), body)

export const listMembers = (projectId: IdParam) => api.get<Member[]>(`${base(projectId)}/members`)

/** Invites into the project (202): the answer is the same whether or not the address has an account. */
export const addMember = (projectId: IdParam, email: string, role: ProjectRole) =>
  api.post<{ email: string; role: ProjectRole; expiresAt: string; mailed: boolean }>(
    `${base(projectId)}/members`,
    { email, role },
  )

export const changeMemberRole = (projectId: IdParam, userId: IdParam, role: ProjectRole) =>
  api.patch<Member>(`${base(projectId)}/members/${seg(userId)}`, { role })

export const removeMember = (projectId: IdParam, userId: IdParam) =>
  api.delete<unknown>(`${base(projectId)}/members/${seg(userId)}`)
