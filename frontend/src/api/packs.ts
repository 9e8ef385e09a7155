import { api, API_BASE, seg } from './client'
import type { IdParam } from './types'

export type PackStatus = 'queued' | 'building' | 'ready' | 'failed' | 'issued'

export interface PackSummary {
  id: string
  projectId: number
  status: PackStatus
  /** Built with intervals that were not approved: a preview that says DRAFT and is never issued. */
  draft: boolean
  selection: { holeIds?: number[]; intervalIds?: number[] }
  progress: number
  message: string
  inputsHash: string | null
  contentHash: string | null
  createdAt: string
  createdBy: number | null
  createdByName: string | null
  issuedAt: string | null
  issuedBy: number | null
  issuedByName: string | null
}

export interface PackFile {
  name: string
  mime: string
  size: number
  sha256: string
}

/** A packed interval as it is now (its status may have moved on since the build). */
export interface PackInterval {
  id: number
  holeId: number
  holeName: string
  name: string
  status: 'draft' | 'checked' | 'approved' | 'issued'
}

export interface PackDetail extends PackSummary {
  files: PackFile[]
  intervals: PackInterval[]
}

export interface PackSelection {
  holeIds?: number[]
  intervalIds?: number[]
}

const packsPath = (projectId: IdParam) => `/projects/${seg(projectId)}/packs`
const packPath = (projectId: IdParam, packId: string) => `${packsPath(projectId)}/${seg(packId)}`

export const listPacks = (projectId: IdParam) => api.get<PackSummary[]>(packsPath(projectId))

export const getPack = (projectId: IdParam, packId: string) =>
  api.get<PackDetail>(packPath(projectId, packId))

export const createPack = (projectId: IdParam, selection: PackSelection) =>
  api.post<{ id: string; status: PackStatus; progress: number }>(packsPath(projectId), selection)

export const issuePack = (projectId: IdParam, packId: string) =>
  api.post<PackDetail>(`${packPath(projectId, packId)}/issue`)

export const rebuildPack = (projectId: IdParam, packId: string) =>
  api.post<{ id: string; status: PackStatus; progress: number }>(
    `${packPath(projectId, packId)}/rebuild`,
  )

export const deletePack = (projectId: IdParam, packId: string) =>
  api.delete<unknown>(packPath(projectId, packId))

/** A file's download address (a plain GET with the session cookie, for links and the PDF tab). */
export const packFileUrl = (projectId: IdParam, packId: string, name: string) =>
  `${API_BASE}${packPath(projectId, packId)}/files/${seg(name)}`
