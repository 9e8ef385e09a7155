// How a form reads the server's refusal of what it sent (400 bad field, 409 conflict), so a dialog
// can mark the field and keep what was typed; other failures go through describeError.
import { isApiError } from '../api/client'
import type { ErrorDetail } from '../api/types'

/** The row changed since it was loaded (409 stale_version): offer to reload, keep the form. */
export function isStaleVersion(err: unknown): boolean {
  return isApiError(err, 409) && err.code === 'stale_version'
}

/** A 400 or 409 answer's message and the first field it names; null for any other failure. */
export function refusalOf(err: unknown): { message: string; detail: ErrorDetail | null } | null {
  if (!isApiError(err, 409) && !isApiError(err, 400)) return null
  return { message: err.message, detail: err.details[0] ?? null }
}
