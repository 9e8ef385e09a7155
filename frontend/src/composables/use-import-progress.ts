import { onBeforeUnmount, ref } from 'vue'
import { getImport } from '../api/imports'
import type { ImportRecord } from '../api/types'
import { describeError } from '../logic/format'

const POLL_MS = 1000
export const isRunning = (r: { status: string }) =>
  r.status === 'queued' || r.status === 'committing'

/**
 * Follows a background commit: GET the import every second until it is committed or failed.
 * Nothing but the import's status row is held.
 */
export function useImportProgress(projectId: () => string, holeId: () => string) {
  const record = ref<ImportRecord | null>(null)
  const error = ref<string | null>(null)
  let timer: ReturnType<typeof setTimeout> | undefined
  let onDone: ((r: ImportRecord) => void) | undefined

  function stop() {
    clearTimeout(timer)
    timer = undefined
  }

  async function tick(id: string) {
    try {
      record.value = await getImport(projectId(), holeId(), id)
      error.value = null
    } catch (err: unknown) {
      error.value = describeError(err, 'The import status could not be read.')
    }
    if (record.value && !isRunning(record.value)) {
      onDone?.(record.value)
      return
    }
    timer = setTimeout(() => void tick(id), POLL_MS)
  }

  function follow(start: ImportRecord, done?: (r: ImportRecord) => void) {
    stop()
    record.value = start
    onDone = done
    if (isRunning(start)) timer = setTimeout(() => void tick(start.id), POLL_MS)
    else done?.(start)
  }

  onBeforeUnmount(stop)
  return { record, error, follow, stop }
}
