import { api, seg } from './client'
import type { IdParam } from './types'

export interface LasCurveSummary {
  mnemonic: string
  unit: string
  description: string
  nullCount: number
  min: number | null
  max: number | null
  /** A LAS 3.0 text column: previewed, kept in the file, never stored as a curve. */
  text?: boolean
  sample?: string[]
}

export interface LasPreview {
  importId: string
  fileName: string
  version: string
  wrap: boolean
  depthUnit: string
  curves: LasCurveSummary[]
  depthRange: { from: number; to: number }
  step: number | null
  sampleCount: number
  problems: { line: number | null; message: string }[]
  wellNameMatchesHole: boolean
  deviation: unknown
  /** LAS 3.0 data sets read besides the log (an inclinometry set is offered as a survey). */
  dataSets: {
    name: string
    kind: 'log' | 'inclinometry' | 'other'
    line: number
    rows: number
    columns: string[]
  }[]
}

export interface StoredCurve {
  id: number
  mnemonic: string
  unit: string
  description: string
  sourceFile: string
  depthShift: number
  minDepth: number
  maxDepth: number
  sampleCount: number
  importId: string | null
}

const logsPath = (projectId: IdParam, holeId: IdParam) =>
  `/projects/${seg(projectId)}/holes/${seg(holeId)}/logs`

export function uploadLas(projectId: IdParam, holeId: IdParam, file: File) {
  const form = new FormData()
  form.append('file', file, file.name)
  return api.upload<LasPreview>(logsPath(projectId, holeId), form)
}

export const commitLas = (
  projectId: IdParam,
  holeId: IdParam,
  importId: string,
  body: { depthShift: number; curves?: string[] },
) =>
  api.post<{ curves: { id: number; mnemonic: string }[] }>(
    `${logsPath(projectId, holeId)}/imports/${seg(importId)}/commit`,
    body,
  )

export const listCurves = (projectId: IdParam, holeId: IdParam) =>
  api.get<StoredCurve[]>(logsPath(projectId, holeId))

/** Where the original file of a LAS import downloads from (same-origin link, session cookie). */
export const originalFileUrl = (projectId: IdParam, holeId: IdParam, importId: string) =>
  `/api${logsPath(projectId, holeId)}/imports/${seg(importId)}/file`
