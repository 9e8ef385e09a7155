import { computed, ref } from 'vue'
import { isApiError } from '../api/client'
import type { Structure, StructureInput } from '../api/types'
import { describeError } from '../logic/format'
import type { EntryDraft, EntryErrors, EntryField, EntrySource } from '../logic/hole/entry-fields'

/** The state of one row being typed (the new row, a saved row edited in place, a failed save). */
export interface RowState {
  busy: boolean
  message: string | null
  errors: EntryErrors
  /** The server answered 409: someone else changed the row since it was loaded. */
  conflict: boolean
  /** A committed row the server did not take: kept with its message until retried or discarded. */
  failed: boolean
}

export const idleState = (): RowState => ({
  busy: false,
  message: null,
  errors: {},
  conflict: false,
  failed: false,
})

/** Server details (`body.alpha`) → the cell they name, so the message sits in place. */
export function fieldErrors(err: unknown): EntryErrors {
  if (!isApiError(err)) return {}
  const out: EntryErrors = {}
  for (const d of err.details) {
    const field = d.path.replace(/^body\./, '') as EntryField
    out[field] = `${field}: ${d.message}`
  }
  return out
}

const newKey = () =>
  globalThis.crypto?.randomUUID?.() ??
  `${Date.now().toString(36)}-${Math.random().toString(36).slice(2)}-${Math.random().toString(36).slice(2)}`

/** A row committed with Enter that is not stored yet: its cells exactly as typed. */
export interface PendingRow {
  key: number
  source: EntrySource
  draft: EntryDraft
  input: StructureInput
  /** One key per row as sent: a retry of the same cells can never store the row twice. */
  idempotencyKey: string
  status: 'queued' | 'saving' | 'failed'
  state: RowState
}

/**
 * The grid's save queue: committed rows are sent one at a time in the order they were committed,
 * while the logger types on. A row that saves leaves the queue for the stored list; a row that
 * fails stays, with the server's message, until it is retried or discarded by hand.
 */
export function useHoleEntryQueue(
  create: (input: StructureInput, idempotencyKey: string) => Promise<Structure>,
  onSaved: (row: Structure, item: PendingRow) => void,
  /** Called once the queue has run dry, with how many rows it stored on the way. */
  onDrained: (saved: number) => void,
) {
  const pending = ref<PendingRow[]>([])
  /** Rows still on their way (queued or in flight), not the failed ones. */
  const saving = computed(() => pending.value.some((p) => p.status !== 'failed'))
  const failedCount = computed(() => pending.value.filter((p) => p.status === 'failed').length)
  let lastKey = 0
  let running = false

  const find = (key: number) => pending.value.find((p) => p.key === key)

  function enqueue(draft: EntryDraft, source: EntrySource, input: StructureInput): number {
    const key = ++lastKey
    pending.value.push({
      key,
      source,
      draft,
      input,
      idempotencyKey: newKey(),
      status: 'queued',
      state: idleState(),
    })
    void drain()
    return key
  }

  async function drain() {
    if (running) return
    running = true
    let saved = 0
    try {
      for (let item = nextQueued(); item; item = nextQueued()) {
        item.status = 'saving'
        item.state = { ...idleState(), busy: true }
        try {
          const row = await create(item.input, item.idempotencyKey)
          const key = item.key
          pending.value = pending.value.filter((p) => p.key !== key)
          saved++
          onSaved(row, item)
        } catch (err: unknown) {
          item.status = 'failed'
          item.state = {
            ...idleState(),
            failed: true,
            errors: fieldErrors(err),
            message: describeError(err, 'The structure could not be saved.'),
          }
        }
      }
    } finally {
      running = false
    }
    onDrained(saved)
  }

  function nextQueued() {
    return pending.value.find((p) => p.status === 'queued')
  }

  /** Sends a failed row again, with its cells as they are now (the logger may have fixed them). */
  function retry(key: number, input: StructureInput) {
    const item = find(key)
    if (item?.status !== 'failed') return
    // The same cells keep their key (the first try may have been stored after all); new cells
    // are a new request.
    if (JSON.stringify(input) !== JSON.stringify(item.input)) item.idempotencyKey = newKey()
    item.input = input
    item.status = 'queued'
    item.state = idleState()
    void drain()
  }

  function setDraft(key: number, draft: EntryDraft) {
    const item = find(key)
    if (item?.status === 'failed') item.draft = draft
  }

  /** What the server will hold before a row committed as `key` (all rows on their way if none). */
  function inputsBefore(key = Number.POSITIVE_INFINITY): StructureInput[] {
    return pending.value.filter((p) => p.status !== 'failed' && p.key < key).map((p) => p.input)
  }

  /** Only a failed row can be dropped, and only by the logger's own choice. */
  function discard(key: number) {
    pending.value = pending.value.filter((p) => p.key !== key || p.status !== 'failed')
  }

  return { pending, saving, failedCount, enqueue, retry, setDraft, inputsBefore, discard }
}

export type HoleEntryQueue = ReturnType<typeof useHoleEntryQueue>
