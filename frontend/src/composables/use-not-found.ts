import { useRoute, useRouter } from 'vue-router'
import { isApiError } from '../api/client'
import { notFoundLocation } from '../router/access'

/**
 * Returns a handler for load failures: 403/404 show the "not found or not yours" page at the same
 * URL and return true; anything else returns false for the page to report.
 */
export function useNotFound() {
  const route = useRoute()
  const router = useRouter()
  return function handleMissing(err: unknown): boolean {
    if (isApiError(err, 404) || isApiError(err, 403)) {
      void router.replace(notFoundLocation(route))
      return true
    }
    return false
  }
}
