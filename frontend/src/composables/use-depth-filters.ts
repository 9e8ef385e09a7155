import { computed, ref, type Ref } from 'vue'
import { structureTypes } from '../../../schema/vocabulary'
import type { DepthStructure, StructureSource } from '../api/interval-types'
import type { NetPole } from '../logic/net/net-types'
import type { DepthRange, TrackStructure } from '../logic/track/track-types'
import { symbolOf } from '../logic/track/structure-symbols'

export const confidenceLevels = ['high', 'medium', 'low', 'unrated'] as const
export type ConfidenceLevel = (typeof confidenceLevels)[number]

const toTrack = (s: DepthStructure): TrackStructure => ({
  id: s.id,
  depth: s.depth,
  type: s.type,
  dip: s.dipDirection === null ? null : s.dip,
  dipDirection: s.dip === null ? null : s.dipDirection,
  flagged: s.flags.length > 0,
})

/** A structure's pole for a net, coloured by its type; undefined when it has no orientation. */
export function poleOfStructure(s: DepthStructure): NetPole | undefined {
  if (s.poleTrend === null || s.polePlunge === null || s.dip === null || s.dipDirection === null)
    return undefined
  return {
    id: s.id,
    trend: s.poleTrend,
    plunge: s.polePlunge,
    dip: s.dip,
    dipDirection: s.dipDirection,
    group: -1,
    colour: symbolOf(s.type).colour,
    flagged: s.flags.length > 0,
    weight: s.terzaghiWeight ?? 1,
  }
}

/**
 * The depth view's filters (type, source, confidence) and what follows from them: the tracks'
 * structures and, within the brushed range, the linked net's poles.
 */
export function useDepthFilters(structures: Ref<DepthStructure[]>, brush: Ref<DepthRange | null>) {
  const types = ref<string[]>([...structureTypes])
  const sources = ref<StructureSource[]>(['core', 'image', 'true'])
  const confidences = ref<ConfidenceLevel[]>([...confidenceLevels])
  const weighted = ref(true)

  const kept = computed(() => {
    const t = new Set(types.value)
    const s = new Set(sources.value)
    const c = new Set(confidences.value)
    return structures.value.filter(
      (x) => t.has(x.type) && s.has(x.source) && c.has(x.confidence ?? 'unrated'),
    )
  })

  const coreTrack = computed(() => kept.value.filter((s) => s.source !== 'image').map(toTrack))
  const imageTrack = computed(() => kept.value.filter((s) => s.source === 'image').map(toTrack))
  const hasImage = computed(() => structures.value.some((s) => s.source === 'image'))
  const depths = computed(() => kept.value.map((s) => s.depth))

  const brushed = computed(() => {
    if (!brush.value) return kept.value
    // Read the limits once: the brush may be a reactive array, thousands of reads are not free.
    const [from, to] = brush.value
    return kept.value.filter((s) => s.depth >= from && s.depth < to)
  })
  const poles = computed(() => brushed.value.flatMap((s) => poleOfStructure(s) ?? []))
  const unoriented = computed(() => brushed.value.length - poles.value.length)

  return {
    types,
    sources,
    confidences,
    weighted,
    kept,
    coreTrack,
    imageTrack,
    hasImage,
    depths,
    brushed,
    poles,
    unoriented,
  }
}
