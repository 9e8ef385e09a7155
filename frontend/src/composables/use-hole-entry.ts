import { ref } from 'vue'
import { isApiError } from '../api/client'
import type { Structure, StructureInput } from '../api/types'
import { describeError } from '../components/format'
import {
  changedFields,
  draftFromStructure,
  emptyDraft,
  type EntryDraft,
  type EntryErrors,
  type EntryField,
  type EntrySource,
} from '../components/hole/entry-fields'
import type { HoleStructures } from './use-hole-structures'

const STEP_KEY = 'downdip.entry-step'
const DEFAULT_STEP = 0.1

/** The state of one row being typed (the new row, or a saved row edited in place). */
export interface RowState {
  busy: boolean
  message: string | null
  errors: EntryErrors
  /** The server answered 409: someone else changed the row since it was loaded. */
  conflict: boolean
}

const idle = (): RowState => ({ busy: false, message: null, errors: {}, conflict: false })

function storedStep(): number {
  const value = Number(globalThis.localStorage?.getItem(STEP_KEY))
  return Number.isFinite(value) && value > 0 ? value : DEFAULT_STEP
}

/** Server details (`body.alpha`) → the cell they name, so the message sits in place. */
function fieldErrors(err: unknown): EntryErrors {
  if (!isApiError(err)) return {}
  const out: EntryErrors = {}
  for (const d of err.details) {
    const field = d.path.replace(/^body\./, '') as EntryField
    out[field] = `${field}: ${d.message}`
  }
  return out
}

const depthText = (depth: number) => String(Math.round(depth * 1000) / 1000)

/** Core-entry page state: the new row, the row edited in place, the depth step, per-row messages. */
export function useHoleEntry(structures: HoleStructures) {
  const source = ref<EntrySource>('core')
  const attributesOpen = ref(false)
  const draft = ref<EntryDraft>(emptyDraft())
  const state = ref<RowState>(idle())
  const step = ref(storedStep())
  const lastSaved = ref<Structure | null>(null)
  const editing = ref<{ row: Structure; draft: EntryDraft; state: RowState } | null>(null)
  const rowMessages = ref<Record<number, string>>({})
  /** Rows saved from this page: marked in the grid so the logger sees where they left off. */
  const savedHere = ref<number[]>([])

  function nextDepth(from: number) {
    return depthText(from + step.value)
  }

  /** Starts from the deepest saved row when nothing has been entered yet. */
  function suggestStart() {
    if (draft.value.depth !== '' || lastSaved.value) return
    const deepest = structures.rows.value.at(-1)
    if (deepest) draft.value.depth = nextDepth(deepest.depth)
  }

  function setStep(value: number) {
    if (!(value > 0)) return
    step.value = Math.round(value * 1000) / 1000
    globalThis.localStorage?.setItem(STEP_KEY, String(step.value))
  }

  async function submitNew(input: StructureInput): Promise<Structure | null> {
    state.value = { ...idle(), busy: true }
    try {
      const row = await structures.create(input)
      const before = lastSaved.value
      if (before && row.depth > before.depth) setStep(row.depth - before.depth)
      lastSaved.value = row
      savedHere.value = [...savedHere.value, row.id]
      draft.value = emptyDraft(nextDepth(row.depth))
      state.value = idle()
      // The server recomputed the run's other rows (beta jumps): fetch them behind the typing.
      void structures.load()
      return row
    } catch (err: unknown) {
      state.value = {
        ...idle(),
        errors: fieldErrors(err),
        message: describeError(err, 'The structure could not be saved.'),
      }
      return null
    }
  }

  /** The last row saved here (else the deepest), one step deeper: for runs of similar structures. */
  function repeatLast() {
    const last = lastSaved.value ?? structures.rows.value.at(-1)
    if (!last) return
    source.value = last.source === 'true' ? 'true' : 'core'
    draft.value = { ...draftFromStructure(last), depth: nextDepth(last.depth) }
    state.value = idle()
  }

  function setDraft(value: EntryDraft) {
    draft.value = value
  }

  function setEditDraft(value: EntryDraft) {
    if (editing.value) editing.value.draft = value
  }

  function setAttributesOpen(value: boolean) {
    attributesOpen.value = value
  }

  function toggleSource() {
    source.value = source.value === 'core' ? 'true' : 'core'
  }

  function clearNew() {
    draft.value = emptyDraft(draft.value.depth)
    state.value = idle()
  }

  function startEdit(row: Structure) {
    editing.value = { row, draft: draftFromStructure(row), state: idle() }
  }

  function cancelEdit() {
    editing.value = null
  }

  async function submitEdit(input: StructureInput): Promise<boolean> {
    const edit = editing.value
    if (!edit) return false
    edit.state = { ...idle(), busy: true }
    try {
      const fields = changedFields(edit.row, input)
      if (Object.keys(fields).length) {
        await structures.update(edit.row, fields)
        void structures.load()
      }
      editing.value = null
      return true
    } catch (err: unknown) {
      edit.state = {
        ...idle(),
        conflict: isApiError(err, 409),
        errors: fieldErrors(err),
        message: isApiError(err, 409)
          ? 'Someone else changed this structure since you loaded it. Reload it to see their change (your edit here is dropped).'
          : describeError(err, 'The change could not be saved.'),
      }
      return false
    }
  }

  /** After a conflict: the row as stored now; editing continues from it. */
  async function reloadEditing() {
    const edit = editing.value
    if (!edit) return
    const fresh = await structures.reloadOne(edit.row.id)
    editing.value = fresh ? { row: fresh, draft: draftFromStructure(fresh), state: idle() } : null
  }

  async function remove(row: Structure) {
    const { [row.id]: _dropped, ...rest } = rowMessages.value
    rowMessages.value = rest
    try {
      await structures.remove(row)
      if (lastSaved.value?.id === row.id) lastSaved.value = null
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
    state,
    step,
    lastSaved,
    editing,
    rowMessages,
    savedHere,
    suggestStart,
    setStep,
    setDraft,
    setEditDraft,
    setAttributesOpen,
    toggleSource,
    submitNew,
    repeatLast,
    clearNew,
    startEdit,
    cancelEdit,
    submitEdit,
    reloadEditing,
    remove,
  }
}

export type HoleEntry = ReturnType<typeof useHoleEntry>
