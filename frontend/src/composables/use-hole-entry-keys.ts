import { nextTick, type Ref } from 'vue'
import type { StructureInput } from '../api/types'
import {
  fieldOrder,
  type EntryField,
  type EntrySource,
  type ParsedEntry,
} from '../logic/hole/entry-fields'

export interface EntryKeyOptions {
  /** Prefix of the row's input ids (several rows can be on the page: new and edited). */
  uid: string
  source: () => EntrySource
  open: Ref<boolean>
  attempted: Ref<boolean>
  parsed: () => ParsedEntry
  /** The type cell's word when a code or start was typed, else ''. */
  typeWord: () => string
  setType: (word: string) => void
  submit: (input: StructureInput) => void
  cancel: () => void
  repeat: () => void
  toggleSource: () => void
}

/**
 * The entry row's keyboard: Enter and Tab walk depth → type → angles → attributes → comment, Enter
 * on the last cell (or Ctrl+Enter anywhere) saves, F2 repeats, Esc clears, Alt+A shows the
 * attributes, Alt+T switches core angles and true dip.
 */
export function useHoleEntryKeys(o: EntryKeyOptions) {
  const inputId = (field: EntryField) => `${o.uid}-${field}`

  function focusField(field: EntryField) {
    const el = document.getElementById(inputId(field)) as HTMLInputElement | null
    el?.focus()
    el?.select()
  }

  /** A type typed as a code or a start of the word is written out in full on leaving the cell. */
  function normalise(field: EntryField) {
    if (field === 'type' && o.typeWord()) o.setType(o.typeWord())
  }

  function submit() {
    o.attempted.value = true
    const { input, errors, missing } = o.parsed()
    if (input) {
      o.attempted.value = false
      o.submit(input)
      return
    }
    const first = fieldOrder(o.source(), o.open.value).find((f) => errors[f] || missing.includes(f))
    if (first) focusField(first)
  }

  async function toggleAttributes() {
    o.open.value = !o.open.value
    await nextTick()
    focusField(o.open.value ? 'roughness' : 'comment')
  }

  async function toggleSource() {
    o.toggleSource()
    await nextTick()
    focusField(o.source() === 'true' ? 'dip' : 'alpha')
  }

  function onKeydown(event: KeyboardEvent) {
    const field = (event.target as HTMLElement).dataset.field as EntryField | undefined
    if (!field) return
    const order = fieldOrder(o.source(), o.open.value)
    const at = order.indexOf(field)
    const key = event.key
    if (key === 'Enter' && !event.shiftKey && !event.altKey) {
      event.preventDefault()
      normalise(field)
      if (event.ctrlKey || event.metaKey || at === order.length - 1) submit()
      else focusField(order[at + 1]!)
    } else if (key === 'Tab') {
      const next = order[event.shiftKey ? at - 1 : at + 1]
      if (!next) return
      event.preventDefault()
      normalise(field)
      focusField(next)
    } else if (key === 'F2') {
      event.preventDefault()
      o.repeat()
      void nextTick(() => focusField('depth'))
    } else if (key === 'Escape') {
      event.preventDefault()
      o.attempted.value = false
      o.cancel()
    } else if (event.altKey && event.code === 'KeyA') {
      event.preventDefault()
      void toggleAttributes()
    } else if (event.altKey && event.code === 'KeyT') {
      event.preventDefault()
      void toggleSource()
    }
  }

  return { inputId, focusField, normalise, submit, toggleAttributes, onKeydown }
}
