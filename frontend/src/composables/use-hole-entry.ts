import { ref } from 'vue'
import { isApiError } from '../api/client'
import type { Structure, StructureInput } from '../api/types'
import { describeError } from '../logic/format'
import { suggestDepth } from '../logic/hole/entry-depth'
import {
  draftFromStructure,
  emptyDraft,
  type EntryDraft,
  type EntryField,
  type EntrySource,
} from '../logic/hole/entry-fields'
import { useHoleEntryEdit } from './use-hole-entry-edit'
import { useHoleEntryQueue, type PendingRow } from './use-hole-entry-queue'
import type { HoleStructures } from './use-hole-structures'

export type { RowState } from './use-hole-entry-queue'

const STEP_KEY = 'downdip.entry-step'
const DEFAULT_STEP = 0.1

function storedStep(): number {
  const value = Number(globalThis.localStorage?.getItem(STEP_KEY))
  return Number.isFinite(value) && value > 0 ? value : DEFAULT_STEP
}

/** The row last committed from this page, as typed: F2 repeats it, the step is measured from it. */
interface Committed {
  key: number
  depth: number
  source: EntrySource
  draft: EntryDraft
  /** Set once the server has stored it. */
  savedId?: number
}

/**
 * Core-entry page state: the new row and the cells the logger has touched in it, the save queue
 * behind it, the row edited in place, the depth step and per-row messages. Nothing the server
 * answers is written into a cell the logger has typed in.
 */
export function useHoleEntry(structures: HoleStructures, finalDepth: () => number | undefined) {
  const source = ref<EntrySource>('core')
  const attributesOpen = ref(false)
  const draft = ref<EntryDraft>(emptyDraft())
  const touched = ref<Partial<Record<EntryField, true>>>({})
  const step = ref(storedStep())
  const lastCommitted = ref<Committed | null>(null)
  const rowMessages = ref<Record<number, string>>({})
  /** Rows saved from this page: marked in the grid so the logger sees where they left off. */
  const savedHere = ref<number[]>([])
  const queue = useHoleEntryQueue(structures.create, onSaved, (saved) => {
    // The server recomputed the run's other rows (beta jumps): fetch them once the queue is dry.
    if (saved > 0) void structures.load()
  })
  const edit = useHoleEntryEdit(structures)

  const nextDepth = (from: number) => suggestDepth(from, step.value, finalDepth())

  /** A suggestion fills the depth cell only while the logger has not typed in it. */
  function suggest(depth: string) {
    if (!touched.value.depth) draft.value.depth = depth
  }

  /** Starts from the deepest saved row when nothing has been entered yet. */
  function suggestStart() {
    if (lastCommitted.value) return
    const deepest = structures.rows.value.at(-1)
    if (deepest) suggest(nextDepth(deepest.depth))
  }

  function setStep(value: number) {
    if (!(value > 0)) return
    step.value = Math.round(value * 1000) / 1000
    globalThis.localStorage?.setItem(STEP_KEY, String(step.value))
  }

  function touch(field: EntryField) {
    touched.value[field] = true
  }

  /**
   * Hands the row to the save queue and opens the next one at once, one step deeper: typing goes
   * on while the save travels. The step is the distance between the last two rows committed.
   */
  function commitNew(input: StructureInput) {
    const before = lastCommitted.value
    if (before && input.depth > before.depth) setStep(input.depth - before.depth)
    const typed = { ...draft.value }
    const key = queue.enqueue(typed, source.value, input)
    lastCommitted.value = { key, depth: input.depth, source: source.value, draft: typed }
    draft.value = emptyDraft(nextDepth(input.depth))
    touched.value = {}
  }

  function onSaved(row: Structure, item: PendingRow) {
    savedHere.value = [...savedHere.value, row.id]
    const last = lastCommitted.value
    if (last?.key !== item.key) return
    last.savedId = row.id
    // The stored depth is the authority; a depth the logger has begun to type is left alone.
    suggest(nextDepth(row.depth))
  }

  /** The last row committed here (else the deepest saved), one step deeper: for runs of similar structures. */
  function repeatLast() {
    const last = lastCommitted.value
    const deepest = structures.rows.value.at(-1)
    if (last) {
      source.value = last.source
      draft.value = { ...last.draft, depth: nextDepth(last.depth) }
    } else if (deepest) {
      source.value = deepest.source === 'true' ? 'true' : 'core'
      draft.value = { ...draftFromStructure(deepest), depth: nextDepth(deepest.depth) }
    } else return
    // Asked for with F2: the logger's own choice, not a suggestion to replace later.
    touched.value = { depth: true }
  }

  function setDraft(value: EntryDraft) {
    draft.value = value
  }

  function setAttributesOpen(value: boolean) {
    attributesOpen.value = value
  }

  function toggleSource() {
    source.value = source.value === 'core' ? 'true' : 'core'
  }

  /** Esc: the cells are emptied, the depth stays. */
  function clearNew() {
    draft.value = emptyDraft(draft.value.depth)
    touched.value = touched.value.depth ? { depth: true } : {}
  }

  async function remove(row: Structure) {
    const { [row.id]: _dropped, ...rest } = rowMessages.value
    rowMessages.value = rest
    try {
      await structures.remove(row)
      if (lastCommitted.value?.savedId === row.id) lastCommitted.value = null
      void structures.load()
    } catch (err: unknown) {
      const message = isApiError(err, 409)
        ? 'Someone else changed this structure: refresh before deleting it.'
        : describeError(err, 'The structure could not be deleted.')
      rowMessages.value = { ...rowMessages.value, [row.id]: message }
    }
  }

  return {
    source,
    attributesOpen,
    draft,
    touched,
    step,
    lastCommitted,
    rowMessages,
    savedHere,
    queue,
    ...edit,
    suggestStart,
    setStep,
    touch,
    setDraft,
    setAttributesOpen,
    toggleSource,
    commitNew,
    repeatLast,
    clearNew,
    remove,
  }
}

export type HoleEntry = ReturnType<typeof useHoleEntry>
