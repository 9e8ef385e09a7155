import { randomBytes, timingSafeEqual } from 'node:crypto'
import type { Request, RequestHandler } from 'express'
import { ApiError } from '../http/errors'

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS'])

/** The session's CSRF token, made on first use. */
export function csrfTokenFor(req: Request): string {
  if (!req.session.csrfToken) req.session.csrfToken = randomBytes(24).toString('base64url')
  return req.session.csrfToken
}

export function newCsrfToken(req: Request): string {
  req.session.csrfToken = randomBytes(24).toString('base64url')
  return req.session.csrfToken
}

/** Every mutating request carries the session's token in `X-CSRF-Token` (synchroniser token). */
export const requireCsrfToken: RequestHandler = (req, _res, next) => {
  if (SAFE_METHODS.has(req.method)) return next()
  const sent = req.get('x-csrf-token') ?? ''
  const expected = req.session?.csrfToken ?? ''
  const ok =
    expected.length > 0 &&
    sent.length === expected.length &&
    timingSafeEqual(Buffer.from(sent), Buffer.from(expected))
  if (!ok) {
    throw new ApiError(
      403,
      'csrf_token',
      'Missing or wrong X-CSRF-Token header: fetch one from GET /api/auth/csrf.',
    )
  }
  next()
}
