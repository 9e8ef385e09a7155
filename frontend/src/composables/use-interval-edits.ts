import { computed, ref, watch } from 'vue'
import { useConfirm } from 'primevue/useconfirm'
import type { Line } from '../logic/net/net-geometry'
import type { AnalysisSet, SetCreate } from '../api/interval-types'
import type { useIntervalData } from './use-interval-data'
import type { useIntervalNet } from './use-interval-net'

/**
 * The net's editing gestures on the interval view: picking and lassoing poles, the cone being
 * placed, and the set edits they lead to (each confirmed or cleared when it succeeds).
 */
export function useIntervalEdits(
  data: ReturnType<typeof useIntervalData>,
  net: ReturnType<typeof useIntervalNet>,
) {
  const confirm = useConfirm()
  const coneCentre = ref<Line | null>(null)
  const coneAngle = ref(20)
  const hoverId = ref<number | null>(null)

  const preview = computed(() =>
    net.tool.value === 'cone' && coneCentre.value
      ? { centre: coneCentre.value, angle: coneAngle.value }
      : null,
  )
  const infoId = computed(() => hoverId.value ?? net.highlight.value)
  const info = computed(
    () => data.analysis.value?.structures.find((s) => s.id === infoId.value) ?? null,
  )
  watch(net.tool, () => {
    coneCentre.value = null
  })

  function onPick(id: number) {
    if (net.tool.value === 'lasso') {
      const s = net.selected.value
      net.selected.value = s.includes(id) ? s.filter((x) => x !== id) : [...s, id]
    } else net.highlight.value = id
  }

  function onLasso(found: number[]) {
    net.selected.value = [...new Set([...net.selected.value, ...found])]
  }

  async function addCone(body: SetCreate) {
    if (await data.createSet(body)) coneCentre.value = null
  }

  async function assign(setId: number) {
    if (await data.assign(setId, net.selected.value)) net.selected.value = []
  }

  async function unassign() {
    if (await data.unassign(net.selected.value)) net.selected.value = []
  }

  function removeSet(set: AnalysisSet) {
    confirm.require({
      header: `Delete ${set.name}?`,
      message: 'Its poles return to no set (or to another set whose cone holds them).',
      acceptLabel: 'Delete set',
      rejectLabel: 'Cancel',
      accept: () => void data.remove(set),
    })
  }

  return {
    coneCentre,
    coneAngle,
    hoverId,
    preview,
    info,
    onPick,
    onLasso,
    addCone,
    assign,
    unassign,
    removeSet,
  }
}
