import { computed } from 'vue'
import type { ComputeContext, StructureComputed } from '../../../orient/index'
import type { Structure, StructureInput } from '../api/types'
import {
  parseEntry,
  parseNumber,
  type EntryDraft,
  type EntrySource,
} from '../components/hole/entry-fields'
import { pickStructureType } from '../components/hole/entry-choices'
import { previewStructure } from '../components/hole/entry-preview'
import { entryNotes } from '../components/hole/entry-warnings'

const inRange = (v: number | undefined, max: number): v is number =>
  v !== undefined && !Number.isNaN(v) && v >= 0 && v <= max

/**
 * What a row being typed means: the parsed body (null while incomplete), and the live orientation
 * and warnings as soon as depth and angles are readable, before the rest of the row is filled.
 */
export function useHoleEntryRow(
  draft: () => EntryDraft,
  source: () => EntrySource,
  ctx: () => ComputeContext | null,
  saved: () => readonly Structure[],
  editingId: () => number | undefined,
  /** Once the logger has tried to save, blank required cells are named too. */
  attempted: () => boolean,
) {
  const parsed = computed(() => parseEntry(draft(), source()))

  const previewInput = computed((): StructureInput | null => {
    const d = draft()
    const depth = parseNumber(d.depth)
    if (!inRange(depth, 5000)) return null
    const type = pickStructureType(d.type) ?? ''
    if (source() === 'true') {
      const dip = parseNumber(d.dip)
      const dipDirection = parseNumber(d.dipDirection)
      if (!inRange(dip, 90) || !inRange(dipDirection, 360)) return null
      return { depth, type, source: 'true', dip, dipDirection }
    }
    const alpha = parseNumber(d.alpha)
    const beta = parseNumber(d.beta)
    if (!inRange(alpha, 90)) return null
    return { depth, type, source: 'core', alpha, ...(inRange(beta, 360) ? { beta } : {}) }
  })

  const computedValues = computed((): StructureComputed | null => {
    const c = ctx()
    const input = previewInput.value
    return c && input ? previewStructure(c, saved(), input, editingId()) : null
  })

  const notes = computed(() =>
    entryNotes(
      parsed.value.errors,
      attempted() ? parsed.value.missing : [],
      computedValues.value,
      ctx(),
      previewInput.value?.beta !== undefined,
    ),
  )

  return { parsed, computed: computedValues, notes }
}
