import { Router } from 'express'
import { rateLimit } from 'express-rate-limit'
import type { PassportStatic } from 'passport'
import { z } from 'zod'
import type { Db } from '../db/client'
import { csrfTokenFor, newCsrfToken } from '../auth/csrf'
import { ApiError, unauthorized } from '../http/errors'
import { inputOf, validate } from '../http/validate'
import { membershipsOf } from '../services/memberships'

const LoginBody = z.object({
  email: z.string().trim().email().max(254),
  password: z.string().min(1).max(200),
})

export function authRouter(db: Db, passport: PassportStatic, attemptsPerWindow: number): Router {
  const router = Router()

  // Failed sign-ins per client address; a successful one does not count.
  const loginLimiter = rateLimit({
    windowMs: 15 * 60 * 1000,
    limit: attemptsPerWindow,
    skipSuccessfulRequests: true,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    handler: (_req, _res, next) =>
      next(new ApiError(429, 'too_many_attempts', 'Too many sign-in attempts: wait 15 minutes.')),
  })

  router.get('/csrf', (req, res) => {
    res.json({ data: { csrfToken: csrfTokenFor(req) } })
  })

  router.post('/login', loginLimiter, validate({ body: LoginBody }), async (req, res, next) => {
    const { body } = inputOf(res, { body: LoginBody })
    req.body = body
    const user = await new Promise<Express.User | false>((resolve, reject) => {
      passport.authenticate('local', { session: false }, (err: unknown, u: Express.User | false) =>
        err ? reject(err) : resolve(u),
      )(req, res, next)
    })
    if (!user) {
      throw new ApiError(401, 'invalid_credentials', 'E-mail or password is not right.')
    }
    // req.login regenerates the session (fixation defence), so a fresh CSRF token follows.
    await new Promise<void>((resolve, reject) =>
      req.login(user, (err: unknown) => (err ? reject(err) : resolve())),
    )
    const csrfToken = newCsrfToken(req)
    res.json({ data: { user, memberships: await membershipsOf(db, user.id), csrfToken } })
  })

  router.post('/logout', async (req, res) => {
    await new Promise<void>((resolve, reject) =>
      req.logout((err: unknown) => (err ? reject(err) : resolve())),
    )
    res.json({ data: { ok: true } })
  })

  router.get('/me', async (req, res) => {
    if (!req.user) throw unauthorized()
    res.json({ data: { user: req.user, memberships: await membershipsOf(db, req.user.id) } })
  })

  return router
}
