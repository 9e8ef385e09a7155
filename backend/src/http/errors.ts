import type { z } from 'zod'

/** One error vocabulary for the API: a stable code, an HTTP status, optional field details. */
export interface ErrorDetail {
  path: string
  message: string
}

/** Turns zod issues into `{ path, message }` with the request part first (`body.stations.3.depth`). */
export function zodDetails(part: string, error: z.ZodError): ErrorDetail[] {
  return error.issues.map((issue) => ({
    path: [part, ...issue.path.map(String)].join('.'),
    message: issue.message,
  }))
}

export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly details: ErrorDetail[] = [],
    /** Extra context a client needs to act on the error (e.g. an import's columns and mapping). */
    readonly meta?: Record<string, unknown>,
  ) {
    super(message)
  }
}

export const badRequest = (message: string, details: ErrorDetail[] = [], code = 'invalid_input') =>
  new ApiError(400, code, message, details)
export const unauthorized = (message = 'Sign in first.') =>
  new ApiError(401, 'unauthenticated', message)
export const forbidden = (message = 'Your role in this project does not allow that.') =>
  new ApiError(403, 'forbidden', message)
export const notFound = (what = 'Resource') => new ApiError(404, 'not_found', `${what} not found.`)
export const conflict = (message: string, code = 'conflict') => new ApiError(409, code, message)
export const staleVersion = () =>
  new ApiError(
    409,
    'stale_version',
    'Someone else changed this since you loaded it. Reload to see their change.',
  )
