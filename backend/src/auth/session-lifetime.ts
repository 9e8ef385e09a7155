import type { RequestHandler } from 'express'
import { ApiError } from '../http/errors'

declare module 'express-session' {
  interface SessionData {
    /** When the user signed in (ms since epoch): the absolute lifetime counts from here. */
    signedInAt?: number
  }
}

/**
 * Ends a signed-in session `maxHours` after sign-in however active it is (the idle timeout is the
 * rolling cookie's maxAge); OWASP ASVS 4.0 V3.3.2. A session from before this rule starts now.
 */
export function sessionLifetime(maxHours: number): RequestHandler {
  const limitMs = maxHours * 60 * 60 * 1000
  return (req, _res, next) => {
    if (!req.user || !req.session) return next()
    const started = req.session.signedInAt
    if (started === undefined) {
      req.session.signedInAt = Date.now()
      return next()
    }
    if (Date.now() - started <= limitMs) return next()
    req.session.destroy(() =>
      next(new ApiError(401, 'session_expired', 'Your session has ended: sign in again.')),
    )
  }
}
