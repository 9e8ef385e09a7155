import { computed, onBeforeUnmount, ref } from 'vue'
import { commitImport, getImport, listImports, undoImport } from '../api/imports'
import type { ImportRecord, ImportUndone } from '../api/types'
import { describeError } from '../logic/format'
import { isRunning } from './use-import-progress'

const POLL_MS = 1000

/**
 * The hole's recent imports. Any still queued or committing (a background commit started before a
 * page reload, or by a colleague) is polled every second until it ends.
 */
export function useImportHistory(projectId: () => string, holeId: () => string) {
  const records = ref<ImportRecord[]>([])
  const loading = ref(false)
  const error = ref<string | null>(null)
  /** The import whose undo is on its way, and what the last undo did. */
  const undoing = ref<string | null>(null)
  const undone = ref<ImportUndone | null>(null)
  const running = computed(() => records.value.filter(isRunning))
  let timer: ReturnType<typeof setTimeout> | undefined
  let finished: ((r: ImportRecord) => void) | undefined

  function schedule() {
    clearTimeout(timer)
    timer = running.value.length ? setTimeout(() => void poll(), POLL_MS) : undefined
  }

  async function poll() {
    const updates = await Promise.allSettled(
      running.value.map((r) => getImport(projectId(), holeId(), r.id)),
    )
    for (const u of updates) {
      if (u.status !== 'fulfilled') continue
      const next = u.value
      records.value = records.value.map((r) => (r.id === next.id ? next : r))
      if (!isRunning(next)) finished?.(next)
    }
    schedule()
  }

  async function load() {
    loading.value = true
    try {
      records.value = await listImports(projectId(), holeId())
      error.value = null
    } catch (err: unknown) {
      error.value = describeError(err, 'The imports could not be listed.')
    } finally {
      loading.value = false
    }
    schedule()
  }

  /** Called when a followed import ends (to reload what it changed). */
  function onFinished(handler: (r: ImportRecord) => void) {
    finished = handler
  }

  /**
   * Undoes a committed import (after the dialog's confirmation), then reloads the list and tells
   * the page that the hole's data changed. A refusal (409: reviewed interval, edited rows) is shown
   * as the list's error, naming why.
   */
  async function undo(record: ImportRecord) {
    undoing.value = record.id
    error.value = null
    try {
      undone.value = await undoImport(projectId(), holeId(), record.id)
      await load()
      finished?.(undone.value)
    } catch (err: unknown) {
      error.value = describeError(err, 'The import could not be undone.')
    } finally {
      undoing.value = null
    }
  }

  /** Runs a failed (or interrupted) commit again; the list then follows it as any other. */
  async function recommit(record: ImportRecord) {
    error.value = null
    try {
      const next = await commitImport(projectId(), holeId(), record.id)
      records.value = records.value.map((r) => (r.id === next.id ? next : r))
      if (!isRunning(next)) finished?.(next)
      await load()
    } catch (err: unknown) {
      error.value = describeError(err, 'The import could not be committed.')
    }
  }

  onBeforeUnmount(() => clearTimeout(timer))
  return { records, loading, error, running, undoing, undone, load, onFinished, undo, recommit }
}
