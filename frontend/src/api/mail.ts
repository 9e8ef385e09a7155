import { api, seg } from './client'
import type { Id, LoginResult, ProjectRole } from './types'

export interface InvitationInput {
  email: string
  projectId?: Id
  role?: ProjectRole
}

export interface Invitation {
  id: Id
  email: string
  projectId: Id | null
  role: ProjectRole | null
  expiresAt: string
  /** False when the mail server could not be reached: the invitation exists, its mail did not go. */
  mailed: boolean
}

/** What an invitation link opens onto, before it is accepted. */
export interface InvitationPreview {
  email: string
  projectName: string | null
  role: ProjectRole | null
  expiresAt: string
  /** The address already has an account: accepting asks for its password, not a new one. */
  existingAccount: boolean
}

export interface AcceptInput {
  token: string
  name?: string
  password: string
}

export interface CapturedMail {
  id: Id
  from: string
  to: string
  subject: string
  text: string
  html: string | null
  receivedAt: string
}

export const inviteByEmail = (body: InvitationInput) => api.post<Invitation>('/invitations', body)

export const getInvitation = (token: string) =>
  api.get<InvitationPreview>(`/invitations/${seg(token)}`)

export const acceptInvitation = (body: AcceptInput) =>
  api.post<LoginResult>('/invitations/accept', body, { expect401: true })

export const requestPasswordReset = (email: string) =>
  api.post<{ ok: true; message: string }>('/auth/reset-request', { email })

export const resetPassword = (token: string, password: string) =>
  api.post<{ ok: true }>('/auth/reset', { token, password })

export const listMailbox = () => api.get<CapturedMail[]>('/dev/mailbox')

export const clearMailbox = () => api.delete<{ removed: number }>('/dev/mailbox')
