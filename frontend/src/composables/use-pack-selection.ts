import { computed, ref, watch } from 'vue'
import { listIntervals } from '../api/intervals'
import type { Interval } from '../api/interval-types'
import type { PackSelection } from '../api/packs'
import type { Hole } from '../api/types'

const approved = (i: Interval) => i.status === 'approved' || i.status === 'issued'

/**
 * What a new pack will hold: the whole project, or chosen holes and intervals (each hole's
 * intervals loaded when the holes change), and which of those are not approved.
 */
export function usePackSelection(projectId: () => string, holes: () => Hole[]) {
  const intervalsByHole = ref<Record<number, Interval[]>>({})
  const whole = ref(true)
  const holeIds = ref<number[]>([])
  const intervalIds = ref<number[]>([])

  watch(
    holes,
    async (list) => {
      const entries = await Promise.all(
        list.map(async (h) => [h.id, await listIntervals(projectId(), h.id)] as const),
      )
      intervalsByHole.value = Object.fromEntries(entries)
    },
    { immediate: true },
  )

  const selection = computed<PackSelection>(() =>
    whole.value ? {} : { holeIds: holeIds.value, intervalIds: intervalIds.value },
  )
  const empty = computed(() => !whole.value && !holeIds.value.length && !intervalIds.value.length)
  const packed = (hole: Hole, i: Interval) =>
    whole.value ||
    intervalIds.value.includes(i.id) ||
    (!intervalIds.value.length && holeIds.value.includes(hole.id))
  /** The intervals the selection would pack that are not approved: the pack would be a draft. */
  const unapproved = computed(() =>
    holes().flatMap((h) =>
      (intervalsByHole.value[h.id] ?? [])
        .filter((i) => packed(h, i) && !approved(i))
        .map((i) => `${h.name} ${i.name} (${i.status})`),
    ),
  )

  return { intervalsByHole, whole, holeIds, intervalIds, selection, empty, unapproved, approved }
}
