// The one HTTP client of the app: same-origin JSON under /api, CSRF header on every mutating
// request, `{ data }` unwrapped, `{ error }` turned into ApiError, and the first 401 reported once.
import type { ErrorBody, ErrorDetail } from './types'

export const API_BASE = '/api'

export class ApiError extends Error {
  readonly status: number
  readonly code: string
  readonly details: ErrorDetail[]
  /** Context the server adds to act on the error (e.g. an import's columns and mapping). */
  readonly meta: Record<string, unknown> | undefined

  constructor(
    status: number,
    code: string,
    message: string,
    details: ErrorDetail[] = [],
    meta?: Record<string, unknown>,
  ) {
    super(message)
    this.name = 'ApiError'
    this.status = status
    this.code = code
    this.details = details
    this.meta = meta
  }
}

export function isApiError(err: unknown, status?: number): err is ApiError {
  return err instanceof ApiError && (status === undefined || err.status === status)
}

type Method = 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE'

export interface RequestOptions {
  signal?: AbortSignal
  /** The caller expects 401 as an answer (session probe, sign-in): do not report it. */
  expect401?: boolean
  /** Sent as `Idempotency-Key`: a retry with the same key can never store the row twice. */
  idempotencyKey?: string
}

let csrfToken: string | null = null
let csrfPending: Promise<string> | null = null
let unauthorizedHandler: (() => void) | null = null
let unauthorizedReported = false

export function setCsrfToken(token: string | null): void {
  csrfToken = token
}

export function getCsrfToken(): string | null {
  return csrfToken
}

/** Called on the first 401 after a success, so parallel requests sign the user out only once. */
export function onUnauthorized(handler: (() => void) | null): void {
  unauthorizedHandler = handler
}

function fetchCsrfToken(): Promise<string> {
  csrfPending ??= send<{ csrfToken: string }>('GET', '/auth/csrf', undefined, { expect401: true })
    .then(({ csrfToken: token }) => {
      csrfToken = token
      return token
    })
    .finally(() => {
      csrfPending = null
    })
  return csrfPending
}

async function readJson(response: Response): Promise<unknown> {
  const text = await response.text()
  if (!text) return undefined
  try {
    return JSON.parse(text) as unknown
  } catch {
    return undefined
  }
}

function toApiError(status: number, payload: unknown): ApiError {
  const error = (payload as Partial<ErrorBody> | undefined)?.error as
    (ErrorBody['error'] & { meta?: Record<string, unknown> }) | undefined
  if (error && typeof error.code === 'string') {
    const { code, message, details, meta } = error
    return new ApiError(status, code, message ?? code, details ?? [], meta)
  }
  return new ApiError(status, `http_${status}`, `The server answered ${status}.`)
}

async function send<T>(
  method: Method,
  path: string,
  body: unknown,
  options: RequestOptions = {},
  retried = false,
): Promise<T> {
  const headers: Record<string, string> = { Accept: 'application/json' }
  // Multipart bodies set their own Content-Type with the boundary.
  const multipart = body instanceof FormData
  if (body !== undefined && !multipart) headers['Content-Type'] = 'application/json'
  if (method !== 'GET') headers['X-CSRF-Token'] = csrfToken ?? (await fetchCsrfToken())
  if (options.idempotencyKey) headers['Idempotency-Key'] = options.idempotencyKey

  let response: Response
  try {
    response = await fetch(API_BASE + path, {
      method,
      headers,
      body: body === undefined ? undefined : multipart ? body : JSON.stringify(body),
      credentials: 'same-origin',
      signal: options.signal,
    })
  } catch (err: unknown) {
    if (err instanceof Error && err.name === 'AbortError') throw err
    throw new ApiError(0, 'network', 'The server could not be reached.')
  }

  const payload = await readJson(response)
  if (response.ok) {
    unauthorizedReported = false
    return (payload as { data?: T } | undefined)?.data as T
  }

  const error = toApiError(response.status, payload)
  // A session regenerated elsewhere (another tab signed in) invalidates our token: renew once.
  if (response.status === 403 && /csrf/i.test(error.code) && method !== 'GET' && !retried) {
    csrfToken = null
    return send<T>(method, path, body, options, true)
  }
  if (response.status === 401 && !options.expect401 && !unauthorizedReported) {
    unauthorizedReported = true
    unauthorizedHandler?.()
  }
  throw error
}

export const api = {
  get: <T>(path: string, options?: RequestOptions) => send<T>('GET', path, undefined, options),
  post: <T>(path: string, body?: unknown, options?: RequestOptions) =>
    send<T>('POST', path, body, options),
  put: <T>(path: string, body?: unknown, options?: RequestOptions) =>
    send<T>('PUT', path, body, options),
  patch: <T>(path: string, body?: unknown, options?: RequestOptions) =>
    send<T>('PATCH', path, body, options),
  delete: <T>(path: string, options?: RequestOptions) =>
    send<T>('DELETE', path, undefined, options),
  /** POST as multipart/form-data (file uploads), with the same CSRF and 401 handling. */
  upload: <T>(path: string, form: FormData, options?: RequestOptions) =>
    send<T>('POST', path, form, options),
}

/** Encodes one path segment (ids, codes). */
export function seg(value: string | number): string {
  return encodeURIComponent(String(value))
}
