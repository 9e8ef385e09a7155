import { computed } from 'vue'
import type { ComputeContext, StructureComputed } from '../../../orient/index'
import type { Structure, StructureInput } from '../api/types'
import { beyondFinalDepth } from '../logic/hole/entry-depth'
import {
  parseEntry,
  parseNumber,
  type EntryDraft,
  type EntrySource,
  type ParsedEntry,
} from '../logic/hole/entry-fields'
import { pickStructureType } from '../logic/hole/entry-choices'
import { previewStructure } from '../logic/hole/entry-preview'
import { entryNotes } from '../logic/hole/entry-warnings'

const inRange = (v: number | undefined, max: number): v is number =>
  v !== undefined && !Number.isNaN(v) && v >= 0 && v <= max

export interface EntryRowOptions {
  draft: () => EntryDraft
  source: () => EntrySource
  ctx: () => ComputeContext | null
  saved: () => readonly Structure[]
  /** Rows committed before this one and still in the save queue, in commit order. */
  queued: () => readonly StructureInput[]
  editingId: () => number | undefined
  /** The hole's final depth: a deeper row is held back with a note before it is sent. */
  finalDepth: () => number | undefined
  /** The stored depth of a row edited in place: an old row past the end can still be corrected. */
  savedDepth: () => number | undefined
  /** Once the logger has tried to save, blank required cells are named too. */
  attempted: () => boolean
}

/** The cells parsed, with a depth past the end of the hole counted as an error of the depth cell. */
function parseWithinHole(o: EntryRowOptions): ParsedEntry {
  const parsed = parseEntry(o.draft(), o.source())
  const depth = parseNumber(o.draft().depth)
  if (depth === undefined || parsed.errors.depth || depth === o.savedDepth()) return parsed
  const beyond = beyondFinalDepth(depth, o.finalDepth())
  return beyond ? { ...parsed, input: null, errors: { depth: beyond, ...parsed.errors } } : parsed
}

/**
 * What a row being typed means: the parsed body (null while incomplete), and the live orientation
 * and warnings as soon as depth and angles are readable, before the rest of the row is filled.
 */
export function useHoleEntryRow(o: EntryRowOptions) {
  const parsed = computed(() => parseWithinHole(o))

  const previewInput = computed((): StructureInput | null => {
    const d = o.draft()
    const depth = parseNumber(d.depth)
    if (!inRange(depth, 5000)) return null
    const type = pickStructureType(d.type) ?? ''
    if (o.source() === 'true') {
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
    const c = o.ctx()
    const input = previewInput.value
    return c && input ? previewStructure(c, o.saved(), input, o.editingId(), o.queued()) : null
  })

  const notes = computed(() =>
    entryNotes(
      parsed.value.errors,
      o.attempted() ? parsed.value.missing : [],
      computedValues.value,
      o.ctx(),
      previewInput.value?.beta !== undefined,
    ),
  )

  return { parsed, computed: computedValues, notes }
}
