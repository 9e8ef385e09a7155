import { ref } from 'vue'
import { isApiError } from '../api/client'
import type { Structure, StructureInput } from '../api/types'
import { describeError } from '../logic/format'
import { changedFields, draftFromStructure, type EntryDraft } from '../logic/hole/entry-fields'
import { fieldErrors, idleState, type RowState } from './use-hole-entry-queue'
import type { HoleStructures } from './use-hole-structures'

/** A saved row edited in place: one at a time, PATCHed with its version, a 409 said in the row. */
export function useHoleEntryEdit(structures: HoleStructures) {
  const editing = ref<{ row: Structure; draft: EntryDraft; state: RowState } | null>(null)

  function startEdit(row: Structure) {
    editing.value = { row, draft: draftFromStructure(row), state: idleState() }
  }

  function cancelEdit() {
    editing.value = null
  }

  function setEditDraft(value: EntryDraft) {
    if (editing.value) editing.value.draft = value
  }

  async function submitEdit(input: StructureInput): Promise<boolean> {
    const edit = editing.value
    if (!edit) return false
    edit.state = { ...idleState(), busy: true }
    try {
      const fields = changedFields(edit.row, input)
      if (Object.keys(fields).length) {
        await structures.update(edit.row, fields)
        void structures.load()
      }
      editing.value = null
      return true
    } catch (err: unknown) {
      const conflict = isApiError(err, 409)
      edit.state = {
        ...idleState(),
        conflict,
        errors: fieldErrors(err),
        message: conflict
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
    editing.value = fresh
      ? { row: fresh, draft: draftFromStructure(fresh), state: idleState() }
      : null
  }

  return { editing, startEdit, cancelEdit, setEditDraft, submitEdit, reloadEditing }
}
