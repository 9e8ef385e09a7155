// Calls of the depth view and the interval view: the hole's logged data read for tracks, and the
// engineer's domains, intervals, sets and analysis.
import { analysisSettingKeys } from '../../../schema/vocabulary'
import { api, seg } from './client'
import type { IdParam } from './types'
import type {
  Analysis,
  AnalysisQuery,
  CurveData,
  CurveInfo,
  DepthRun,
  DepthStructure,
  Domain,
  Interval,
  IntervalCreate,
  IntervalUpdate,
  KSuggestion,
  SetCreate,
  SetUpdate,
} from './interval-types'

const projectPath = (projectId: IdParam) => `/projects/${seg(projectId)}`
const holePath = (projectId: IdParam, holeId: IdParam) =>
  `${projectPath(projectId)}/holes/${seg(holeId)}`
const intervalsPath = (projectId: IdParam, holeId: IdParam) =>
  `${holePath(projectId, holeId)}/intervals`
const intervalPath = (projectId: IdParam, holeId: IdParam, intervalId: IdParam) =>
  `${intervalsPath(projectId, holeId)}/${seg(intervalId)}`
const setsPath = (projectId: IdParam, holeId: IdParam, intervalId: IdParam) =>
  `${intervalPath(projectId, holeId, intervalId)}/sets`

/** The three ids that place an interval. */
export interface IntervalRef {
  projectId: IdParam
  holeId: IdParam
  intervalId: IdParam
}

export const listStructures = (projectId: IdParam, holeId: IdParam, signal?: AbortSignal) =>
  api.get<DepthStructure[]>(`${holePath(projectId, holeId)}/structures`, { signal })

export const listRuns = (projectId: IdParam, holeId: IdParam, signal?: AbortSignal) =>
  api.get<DepthRun[]>(`${holePath(projectId, holeId)}/runs`, { signal })

export const listCurves = (projectId: IdParam, holeId: IdParam) =>
  api.get<CurveInfo[]>(`${holePath(projectId, holeId)}/logs`)

export const getCurve = (projectId: IdParam, holeId: IdParam, curveId: IdParam) =>
  api.get<CurveData>(`${holePath(projectId, holeId)}/logs/${seg(curveId)}`)

export const listDomains = (projectId: IdParam) =>
  api.get<Domain[]>(`${projectPath(projectId)}/domains`)

export const createDomain = (projectId: IdParam, body: { name: string; description?: string }) =>
  api.post<Domain>(`${projectPath(projectId)}/domains`, body)

export const listIntervals = (projectId: IdParam, holeId: IdParam) =>
  api.get<Interval[]>(intervalsPath(projectId, holeId))

export const createInterval = (projectId: IdParam, holeId: IdParam, body: IntervalCreate) =>
  api.post<Interval>(intervalsPath(projectId, holeId), body)

export const updateInterval = (ref: IntervalRef, body: IntervalUpdate) =>
  api.patch<Interval>(intervalPath(ref.projectId, ref.holeId, ref.intervalId), body)

export const deleteInterval = (ref: IntervalRef, version: number) =>
  api.delete<unknown>(
    `${intervalPath(ref.projectId, ref.holeId, ref.intervalId)}?version=${version}`,
  )

/**
 * The query string of an analysis request. Empty filters are left out (all types, all sources),
 * and so is every setting not given or null: the server then uses the interval's saved setting.
 */
export function analysisSearch(query: AnalysisQuery): string {
  const params = new URLSearchParams()
  if (query.types?.length) params.set('types', query.types.join(','))
  if (query.sources?.length) params.set('sources', query.sources.join(','))
  for (const key of analysisSettingKeys) {
    const value = query[key]
    if (value !== undefined && value !== null) params.set(key, String(value))
  }
  return params.toString()
}

export const getAnalysis = (ref: IntervalRef, query: AnalysisQuery = {}, signal?: AbortSignal) => {
  const search = analysisSearch(query)
  return api.get<Analysis>(
    `${intervalPath(ref.projectId, ref.holeId, ref.intervalId)}/analysis${search ? `?${search}` : ''}`,
    { signal },
  )
}

export const createSet = (ref: IntervalRef, body: SetCreate) =>
  api.post<unknown>(setsPath(ref.projectId, ref.holeId, ref.intervalId), body)

/** Replaces the interval's sets with k sets found by clustering. */
export const clusterSets = (ref: IntervalRef, k: number) =>
  api.post<unknown>(`${setsPath(ref.projectId, ref.holeId, ref.intervalId)}/cluster`, { k })

export const suggestSets = (ref: IntervalRef, maxK = 6) =>
  api.get<KSuggestion>(
    `${setsPath(ref.projectId, ref.holeId, ref.intervalId)}/suggest?maxK=${maxK}`,
  )

export const updateSet = (ref: IntervalRef, setId: IdParam, body: SetUpdate) =>
  api.patch<unknown>(`${setsPath(ref.projectId, ref.holeId, ref.intervalId)}/${seg(setId)}`, body)

export const deleteSet = (ref: IntervalRef, setId: IdParam) =>
  api.delete<unknown>(`${setsPath(ref.projectId, ref.holeId, ref.intervalId)}/${seg(setId)}`)

/** Sets a set's members by hand. */
export const replaceSetMembers = (ref: IntervalRef, setId: IdParam, structureIds: number[]) =>
  api.put<unknown>(`${setsPath(ref.projectId, ref.holeId, ref.intervalId)}/${seg(setId)}/members`, {
    structureIds,
  })
