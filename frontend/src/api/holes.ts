import { api, seg } from './client'
import type { Hole, HoleFields, HoleUpdate, IdParam, Station, StationInput } from './types'

const holesPath = (projectId: IdParam) => `/projects/${seg(projectId)}/holes`
const holePath = (projectId: IdParam, holeId: IdParam) => `${holesPath(projectId)}/${seg(holeId)}`
const surveyPath = (projectId: IdParam, holeId: IdParam) => `${holePath(projectId, holeId)}/survey`

export const listHoles = (projectId: IdParam) => api.get<Hole[]>(holesPath(projectId))

export const getHole = (projectId: IdParam, holeId: IdParam) =>
  api.get<Hole>(holePath(projectId, holeId))

export const createHole = (projectId: IdParam, body: HoleFields) =>
  api.post<Hole>(holesPath(projectId), body)

export const updateHole = (projectId: IdParam, holeId: IdParam, body: HoleUpdate) =>
  api.patch<Hole>(holePath(projectId, holeId), body)

export const deleteHole = (projectId: IdParam, holeId: IdParam) =>
  api.delete<unknown>(holePath(projectId, holeId))

export const getSurvey = (projectId: IdParam, holeId: IdParam) =>
  api.get<Station[]>(surveyPath(projectId, holeId))

/** Replaces every station of the hole in one transaction. */
export const replaceSurvey = (projectId: IdParam, holeId: IdParam, stations: StationInput[]) =>
  api.put<Station[]>(surveyPath(projectId, holeId), { stations })

export const addStation = (projectId: IdParam, holeId: IdParam, station: StationInput) =>
  api.post<Station>(surveyPath(projectId, holeId), station)

export const updateStation = (
  projectId: IdParam,
  holeId: IdParam,
  stationId: IdParam,
  body: { version: number } & Partial<StationInput>,
) => api.patch<Station>(`${surveyPath(projectId, holeId)}/${seg(stationId)}`, body)

export const deleteStation = (projectId: IdParam, holeId: IdParam, stationId: IdParam) =>
  api.delete<unknown>(`${surveyPath(projectId, holeId)}/${seg(stationId)}`)

/** A deleted hole in the project's bin (leads), with what it holds and until when it comes back. */
export interface DeletedHole {
  id: number
  name: string
  deletedAt: string
  deletedBy: string | null
  restorableUntil: string
  structures: number
  runs: number
  stations: number
  intervals: number
  issuedIntervals: number
  curves: number
}

export const listDeletedHoles = (projectId: IdParam) =>
  api.get<DeletedHole[]>(`${holesPath(projectId)}/deleted`)

export const restoreHole = (projectId: IdParam, holeId: IdParam) =>
  api.post<Hole>(`${holePath(projectId, holeId)}/restore`)

/** Administrators only: removes a deleted hole for good (never one with issued intervals). */
export const purgeHole = (projectId: IdParam, holeId: IdParam) =>
  api.delete<unknown>(`${holePath(projectId, holeId)}/purge`)
