// Calls of the project's measurement error model: read by any member, replaced by the lead.
import type { ErrorModelAnswer, ErrorModelValues } from '../../../schema/index'
import { api, seg } from './client'
import type { IdParam } from './types'

export type { ErrorModelAnswer, ErrorModelValues } from '../../../schema/index'
export type ErrorModelKey = keyof ErrorModelValues

const path = (projectId: IdParam) => `/projects/${seg(projectId)}/error-model`

export const getErrorModel = (projectId: IdParam, signal?: AbortSignal) =>
  api.get<ErrorModelAnswer>(path(projectId), { signal })

/**
 * Replaces the whole model (all ten keys) at the version it was read at. The server recomputes
 * every structure's cone in the project; 409 when the version moved or an approved interval
 * would change.
 */
export const saveErrorModel = (projectId: IdParam, model: ErrorModelValues, version: number) =>
  api.put<ErrorModelAnswer>(path(projectId), { model, version })
