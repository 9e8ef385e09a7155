import { api, seg } from './client'
import type { AdminUser, IdParam, UserCreate, UserUpdate } from './types'

export const listUsers = () => api.get<AdminUser[]>('/users')

export const createUser = (body: UserCreate) => api.post<AdminUser>('/users', body)

export const updateUser = (userId: IdParam, body: UserUpdate) =>
  api.patch<AdminUser>(`/users/${seg(userId)}`, body)
