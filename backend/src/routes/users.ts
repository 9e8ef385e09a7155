import { Router } from 'express'
import { IdParam, UserCreateBody, UserUpdateBody } from '../../../schema/index'
import type { Db } from '../db/client'
import { requireAdmin } from '../auth/guards'
import { inputOf, validate } from '../http/validate'
import { createUser, listUsers, updateUser } from '../services/users'

const UserParams = IdParam('userId')

/** /api/users: the admin's user list. */
export function usersRouter(db: Db): Router {
  const router = Router()
  router.use(requireAdmin)
  router.get('/', async (_req, res) => {
    res.json({ data: await listUsers(db) })
  })
  router.post('/', validate({ body: UserCreateBody }), async (req, res) => {
    const { body } = inputOf(res, { body: UserCreateBody })
    res.status(201).json({ data: await createUser(db, req.user!.id, body) })
  })
  router.patch(
    '/:userId',
    validate({ params: UserParams, body: UserUpdateBody }),
    async (req, res) => {
      const { params, body } = inputOf(res, { params: UserParams, body: UserUpdateBody })
      res.json({ data: await updateUser(db, req.user!.id, params.userId, body) })
    },
  )
  return router
}
