import { api } from './client'
import type { LoginResult, Me } from './types'

export const getCsrf = () => api.get<{ csrfToken: string }>('/auth/csrf')

export const login = (email: string, password: string) =>
  api.post<LoginResult>('/auth/login', { email, password }, { expect401: true })

export const logout = () => api.post<{ ok: true }>('/auth/logout')

export const getMe = () => api.get<Me>('/auth/me', { expect401: true })
