import { api, seg } from './client'
import type {
  IdParam,
  Run,
  RunInput,
  RunUpdate,
  Structure,
  StructureInput,
  StructureUpdate,
} from './types'

const holePath = (projectId: IdParam, holeId: IdParam) =>
  `/projects/${seg(projectId)}/holes/${seg(holeId)}`
const runsPath = (projectId: IdParam, holeId: IdParam) => `${holePath(projectId, holeId)}/runs`
const structuresPath = (projectId: IdParam, holeId: IdParam) =>
  `${holePath(projectId, holeId)}/structures`

export const listRuns = (projectId: IdParam, holeId: IdParam) =>
  api.get<Run[]>(runsPath(projectId, holeId))

export const addRun = (projectId: IdParam, holeId: IdParam, run: RunInput) =>
  api.post<Run>(runsPath(projectId, holeId), run)

export const updateRun = (projectId: IdParam, holeId: IdParam, runId: IdParam, body: RunUpdate) =>
  api.patch<Run>(`${runsPath(projectId, holeId)}/${seg(runId)}`, body)

export const deleteRun = (projectId: IdParam, holeId: IdParam, runId: IdParam) =>
  api.delete<unknown>(`${runsPath(projectId, holeId)}/${seg(runId)}`)

export const listStructures = (projectId: IdParam, holeId: IdParam) =>
  api.get<Structure[]>(structuresPath(projectId, holeId))

export const getStructure = (projectId: IdParam, holeId: IdParam, structureId: IdParam) =>
  api.get<Structure>(`${structuresPath(projectId, holeId)}/${seg(structureId)}`)

export const createStructure = (
  projectId: IdParam,
  holeId: IdParam,
  body: StructureInput,
  idempotencyKey?: string,
) => api.post<Structure>(structuresPath(projectId, holeId), body, { idempotencyKey })

export const updateStructure = (
  projectId: IdParam,
  holeId: IdParam,
  structureId: IdParam,
  body: StructureUpdate,
) => api.patch<Structure>(`${structuresPath(projectId, holeId)}/${seg(structureId)}`, body)

/** The version guards against deleting a row someone else has just changed. */
export const deleteStructure = (
  projectId: IdParam,
  holeId: IdParam,
  structureId: IdParam,
  version: number,
) =>
  api.delete<unknown>(
    `${structuresPath(projectId, holeId)}/${seg(structureId)}?version=${seg(version)}`,
  )
