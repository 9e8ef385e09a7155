import { api, API_BASE, seg } from './client'
import type { IdParam, Pack } from './types'
import type { Interval } from './interval-types'
import type { PackStatus } from '../../../schema/vocabulary'

export type { PackStatus }

/**
 * A pack as listed, with who built and issued it. `draft`: built with intervals that were not
 * approved, a preview that says DRAFT and is never issued.
 */
export type PackSummary = Omit<Pack, 'selection'> & {
  selection: PackSelection
  createdByName: string | null
  issuedByName: string | null
}

export interface PackFile {
  name: string
  mime: string
  size: number
  sha256: string
}

/** A packed interval as it is now (its status may have moved on since the build). */
export type PackInterval = Pick<Interval, 'id' | 'holeId' | 'name' | 'status'> & {
  holeName: string
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
