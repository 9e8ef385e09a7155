import { Router, type Request } from 'express'
import { ipKeyGenerator, rateLimit } from 'express-rate-limit'
import type { PassportStatic } from 'passport'
import { z } from 'zod'
import type { Db } from '../db/client'
import { csrfTokenFor, newCsrfToken } from '../auth/csrf'
import { ApiError, unauthorized } from '../http/errors'
import { inputOf, validate } from '../http/validate'
import type { Mailer } from '../mail/transport'
import { membershipsOf } from '../services/memberships'
import { requestPasswordReset, resetPassword } from '../services/password-reset'

const LoginBody = z.object({
  email: z.string().trim().email().max(254),
  password: z.string().min(1).max(200),
})

/** The account a sign-in names, as the rate limiter's key (an unreadable body counts as one key). */
function accountKey(req: Request): string {
  const email = (req.body as { email?: unknown } | undefined)?.email
  return `account:${typeof email === 'string' ? email.trim().toLowerCase().slice(0, 254) : '?'}`
}

export function authRouter(db: Db, passport: PassportStatic, attemptsPerWindow: number): Router {
  const router = Router()

  // Failed sign-ins are counted per account (whatever address they come from, so a new address
  // gives no fresh guesses) and per address with ten times the allowance (so one person's typos
  // do not lock out the others behind the same address). Successful sign-ins do not count.
  const tooMany = (what: string) =>
    new ApiError(429, 'too_many_attempts', `Too many sign-in attempts ${what}: wait 15 minutes.`)
  const failures = (limit: number, key: (req: Request) => string, what: string) =>
    rateLimit({
      windowMs: 15 * 60 * 1000,
      limit,
      skipSuccessfulRequests: true,
      standardHeaders: 'draft-8',
      legacyHeaders: false,
      keyGenerator: key,
      handler: (_req, _res, next) => next(tooMany(what)),
    })
  const accountLimiter = failures(attemptsPerWindow, accountKey, 'for this account')
  const addressLimiter = failures(
    attemptsPerWindow * 10,
    (req) => ipKeyGenerator(req.ip ?? 'unknown'),
    'from this address',
  )

  router.get('/csrf', (req, res) => {
    res.json({ data: { csrfToken: csrfTokenFor(req) } })
  })

  router.post(
    '/login',
    addressLimiter,
    accountLimiter,
    validate({ body: LoginBody }),
    async (req, res, next) => {
      const { body } = inputOf(res, { body: LoginBody })
      req.body = body
      const user = await new Promise<Express.User | false>((resolve, reject) => {
        passport.authenticate(
          'local',
          { session: false },
          (err: unknown, u: Express.User | false) => (err ? reject(err) : resolve(u)),
        )(req, res, next)
      })
      if (!user) {
        throw new ApiError(401, 'invalid_credentials', 'E-mail or password is not right.')
      }
      // req.login regenerates the session (fixation defence), so a fresh CSRF token follows.
      await new Promise<void>((resolve, reject) =>
        req.login(user, (err: unknown) => (err ? reject(err) : resolve())),
      )
      req.session.signedInAt = Date.now()
      const csrfToken = newCsrfToken(req)
      res.json({ data: { user, memberships: await membershipsOf(db, user.id), csrfToken } })
    },
  )

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

const RESET_ANSWER_FLOOR_MS = 250
const ResetRequestBody = z.object({ email: z.string().trim().email().max(254) }).strict()
const ResetBody = z
  .object({
    token: z.string().regex(/^[A-Za-z0-9_-]{43}$/, 'not a reset token'),
    password: z.string().min(10).max(200),
  })
  .strict()

/** /api/auth/reset-request and /api/auth/reset: a forgotten password, by a mailed link. */
export function passwordResetRouter(db: Db, mail: Mailer, attemptsPerWindow: number): Router {
  const router = Router()
  const limiter = (skipSuccessfulRequests: boolean) =>
    rateLimit({
      windowMs: 15 * 60 * 1000,
      limit: attemptsPerWindow,
      skipSuccessfulRequests,
      standardHeaders: 'draft-8',
      legacyHeaders: false,
      handler: (_req, _res, next) =>
        next(new ApiError(429, 'too_many_attempts', 'Too many attempts: wait 15 minutes.')),
    })
  // Every reset request counts (the answer is always 200), so no one floods a mailbox; for the
  // reset itself only failures count, as for sign-in: they are guesses at a token.
  const requestLimiter = limiter(false)
  const resetLimiter = limiter(true)

  router.post(
    '/reset-request',
    requestLimiter,
    validate({ body: ResetRequestBody }),
    async (_req, res) => {
      const { body } = inputOf(res, { body: ResetRequestBody })
      const started = Date.now()
      await requestPasswordReset(db, mail, body.email)
      // A floor on the answer time hides the extra writes made when the account exists.
      const wait = RESET_ANSWER_FLOOR_MS - (Date.now() - started)
      if (wait > 0) await new Promise((resolve) => setTimeout(resolve, wait))
      res.json({
        data: { ok: true, message: 'If that address has an account, a reset link is on its way.' },
      })
    },
  )

  router.post('/reset', resetLimiter, validate({ body: ResetBody }), async (req, res) => {
    const { body } = inputOf(res, { body: ResetBody })
    await resetPassword(db, body, req.sessionID)
    res.json({ data: { ok: true } })
  })

  return router
}
