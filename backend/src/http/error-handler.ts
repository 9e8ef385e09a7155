import type { ErrorRequestHandler, RequestHandler } from 'express'
import { ApiError } from './errors'
import type { Logger } from '../logger'
import { isDatabaseUnavailable } from '../db/client'

/** The answer while PostgreSQL is away: 503, so clients and load balancers retry later. */
export const databaseUnavailable = () =>
  new ApiError(503, 'database_unavailable', 'The database is not answering; try again shortly.', [
    { path: 'database', message: 'not reachable' },
  ])

export const notFoundHandler: RequestHandler = (req) => {
  throw new ApiError(404, 'not_found', `No route for ${req.method} ${req.path}.`)
}

interface PgError {
  code?: string
  constraint?: string
  detail?: string
}
const isPgError = (err: unknown): err is PgError =>
  typeof err === 'object' && err !== null && typeof (err as PgError).code === 'string'

/** Writes every error as `{ error: { code, message, details } }` and hides internals. */
export function errorHandler(logger: Logger): ErrorRequestHandler {
  return (err: unknown, _req, res, _next) => {
    if (!(err instanceof ApiError) && isDatabaseUnavailable(err)) {
      logger.warn({ err: (err as Error).message }, 'database unavailable')
      err = databaseUnavailable()
    }
    if (err instanceof ApiError) {
      res.status(err.status).json({
        error: {
          code: err.code,
          message: err.message,
          details: err.details,
          ...(err.meta ? { meta: err.meta } : {}),
        },
      })
      return
    }
    // body-parser: malformed JSON or a body over the limit
    const status = (err as { status?: number; type?: string }).status
    const type = (err as { type?: string }).type
    if (type === 'entity.parse.failed') {
      res.status(400).json({
        error: {
          code: 'malformed_json',
          message: 'The request body is not valid JSON.',
          details: [],
        },
      })
      return
    }
    if (status === 413) {
      res
        .status(413)
        .json({ error: { code: 'too_large', message: 'The request is too large.', details: [] } })
      return
    }
    // drizzle wraps driver errors: look at the cause too
    const cause = (err as { cause?: unknown }).cause
    const pgErr = isPgError(err) ? err : isPgError(cause) ? cause : undefined
    if (pgErr?.code === '23505') {
      res.status(409).json({
        error: {
          code: 'duplicate',
          message: `Already exists (${pgErr.constraint ?? 'unique'}).`,
          details: [],
        },
      })
      return
    }
    // A NUL or a byte the database encoding cannot hold, in a value no schema checked
    if (pgErr?.code === '22021' || pgErr?.code === '22P05') {
      res.status(400).json({
        error: {
          code: 'invalid_input',
          message: 'The request holds a character that cannot be stored (a NUL byte?).',
          details: [],
        },
      })
      return
    }
    if (pgErr?.code === '23514') {
      res.status(400).json({
        error: {
          code: 'invalid_input',
          message: `Rejected by rule ${pgErr.constraint ?? ''}.`,
          details: [],
        },
      })
      return
    }
    logger.error({ err }, 'unhandled error')
    res.status(500).json({
      error: { code: 'internal', message: 'Something went wrong on the server.', details: [] },
    })
  }
}
