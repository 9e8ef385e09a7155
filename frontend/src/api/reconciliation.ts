import { api, seg } from './client'
import type { IdParam } from './types'
import type {
  AdjustmentAnswer,
  ReconciliationAnswer,
  ReconciliationApplyAnswer,
} from '../../../schema/index'

export type { AdjustmentAnswer, ReconciliationAnswer, ReconciliationApplyAnswer }

/** The query of `GET H/reconciliation`: matching window and verdict thresholds. */
export type ReconciliationOptions = ReconciliationAnswer['options']

/** What an apply records: totals from the logged records, never increments. */
export interface ReconciliationApply {
  depthShift?: number
  runRotations?: { runId: number; rotation: number }[]
  reason?: string
}

export interface UndoAnswer {
  undone: AdjustmentAnswer
  recomputed: number
}

const basePath = (projectId: IdParam, holeId: IdParam) =>
  `/projects/${seg(projectId)}/holes/${seg(holeId)}/reconciliation`

/** Pairs the hole's core and image structures and estimates the depth shift and run rotations. */
export function getReconciliation(
  projectId: IdParam,
  holeId: IdParam,
  options: Partial<ReconciliationOptions> = {},
  signal?: AbortSignal,
) {
  const query = new URLSearchParams()
  for (const [key, value] of Object.entries(options))
    if (value !== undefined) query.set(key, String(value))
  const search = query.toString()
  return api.get<ReconciliationAnswer>(
    `${basePath(projectId, holeId)}${search ? `?${search}` : ''}`,
    { signal },
  )
}

/** Records the chosen adjustments (engineer and lead); the key makes a retry store them once. */
export const applyReconciliation = (
  projectId: IdParam,
  holeId: IdParam,
  body: ReconciliationApply,
  idempotencyKey?: string,
) =>
  api.post<ReconciliationApplyAnswer>(`${basePath(projectId, holeId)}/apply`, body, {
    idempotencyKey,
  })

/** Undoes one recorded adjustment; the hole's structures are recomputed without it. */
export const undoAdjustment = (projectId: IdParam, holeId: IdParam, adjustmentId: IdParam) =>
  api.delete<UndoAnswer>(`${basePath(projectId, holeId)}/adjustments/${seg(adjustmentId)}`)
