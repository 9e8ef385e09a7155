import { api, seg } from './client'
import type { IdParam } from './types'
import type { IntervalStatus } from '../../../schema/vocabulary'

export type { IntervalStatus }

/** The fields of an interval the review steps read and return. */
export interface ReviewedInterval {
  id: number
  name: string
  status: IntervalStatus
  version: number
  checkedBy: number | null
  checkedAt: string | null
  approvedBy: number | null
  approvedAt: string | null
}

export interface CommentRow {
  id: number
  body: string
  mentions: number[]
  createdAt: string
  userId: number | null
  userName: string | null
}

export interface AuditRow {
  id: number
  at: string
  entity: string
  entityId: string
  action: string
  before: unknown
  after: unknown
  userId: number | null
  userName: string | null
}

const intervalPath = (projectId: IdParam, holeId: IdParam, intervalId: IdParam) =>
  `/projects/${seg(projectId)}/holes/${seg(holeId)}/intervals/${seg(intervalId)}`

export type ReviewStep = 'check' | 'approve' | 'reopen'

export const reviewInterval = (
  ids: { projectId: IdParam; holeId: IdParam; intervalId: IdParam },
  step: ReviewStep,
  body: { version: number; reason?: string },
) =>
  api.post<ReviewedInterval>(
    `${intervalPath(ids.projectId, ids.holeId, ids.intervalId)}/${step}`,
    body,
  )

export const submitInterval = (ids: { projectId: IdParam; holeId: IdParam; intervalId: IdParam }) =>
  api.post<{ notified: number }>(
    `${intervalPath(ids.projectId, ids.holeId, ids.intervalId)}/submit`,
    {},
  )

export const listComments = (
  projectId: IdParam,
  entity: 'structure' | 'interval',
  entityId: IdParam,
) =>
  api.get<CommentRow[]>(
    `/projects/${seg(projectId)}/comments?entity=${entity}&entityId=${seg(entityId)}`,
  )

export const addComment = (
  projectId: IdParam,
  body: { entity: 'structure' | 'interval'; entityId: number; body: string },
) => api.post<CommentRow>(`/projects/${seg(projectId)}/comments`, body)

export interface AuditFilter {
  entity?: string
  action?: string
  before?: number
  limit?: number
}

export function listAudit(projectId: IdParam, filter: AuditFilter) {
  const query = new URLSearchParams()
  for (const [k, v] of Object.entries(filter))
    if (v !== undefined && v !== '') query.set(k, String(v))
  return api.get<AuditRow[]>(`/projects/${seg(projectId)}/audit?${query}`)
}
