import { computed, onBeforeUnmount, onMounted, ref, type Ref } from 'vue'
import type { useDepthData } from './use-depth-data'
import type { useDepthFilters } from './use-depth-filters'
import type { DepthRange, PanelCurve, TrackInterval } from '../logic/track/track-types'

/** Room above and below the tracks (header, toolbar, filters), in pixels. */
const CHROME = 330

/**
 * What the depth view derives for display: track height from the window, labels, counts, the
 * curves and intervals in track form, the hole axis at the brush, the tracks offered for export.
 */
export function useDepthLayout(
  data: ReturnType<typeof useDepthData>,
  filters: ReturnType<typeof useDepthFilters>,
  brush: Ref<DepthRange | null>,
) {
  const windowHeight = ref(typeof window === 'undefined' ? 900 : window.innerHeight)
  const onResize = () => (windowHeight.value = window.innerHeight)
  onMounted(() => window.addEventListener('resize', onResize))
  onBeforeUnmount(() => window.removeEventListener('resize', onResize))
  const trackHeight = computed(() => Math.max(380, Math.min(1400, windowHeight.value - CHROME)))

  const brushLabel = computed(() =>
    brush.value
      ? `Brushed ${brush.value[0].toFixed(2)}–${brush.value[1].toFixed(2)} m`
      : 'Whole hole (no brush)',
  )

  const typeCounts = computed(() => {
    const counts: Record<string, number> = {}
    for (const s of data.structures.value) counts[s.type] = (counts[s.type] ?? 0) + 1
    return counts
  })

  function panelCurves(ids: number[]): PanelCurve[] {
    return ids.flatMap((id) => {
      const c = data.curveData.value[id]
      return c
        ? [{ id, mnemonic: c.mnemonic, unit: c.unit, depths: c.depths, values: c.values }]
        : []
    })
  }

  const trackIntervals = computed<TrackInterval[]>(() =>
    data.intervals.value.map((i) => ({
      id: i.id,
      name: i.name,
      fromDepth: i.fromDepth,
      toDepth: i.toDepth,
      status: i.status,
    })),
  )

  /**
   * The hole's direction at the middle of the brush (or of the hole): the blind zone's axis. Kept
   * to the half degree and the same object while it stays so, so a brush move does not retrace it.
   */
  let lastAxis: { trend: number; plunge: number } | null = null
  const holeAxis = computed(() => {
    const list = filters.brushed.value.length ? filters.brushed.value : data.structures.value
    const s = list[Math.floor(list.length / 2)]
    if (!s || s.holeTrend === null || s.holePlunge === null) return (lastAxis = null)
    const half = (v: number) => Math.round(v * 2) / 2
    const next = { trend: half(s.holeTrend), plunge: half(s.holePlunge) }
    if (lastAxis?.trend !== next.trend || lastAxis.plunge !== next.plunge) lastAxis = next
    return lastAxis
  })

  const trackKeys = computed(() => [
    { label: 'All tracks', value: 'all' },
    { label: 'Core structures', value: 'core' },
    ...(filters.hasImage.value ? [{ label: 'Image picks', value: 'image' }] : []),
    { label: 'Fractures', value: 'fractures' },
    { label: 'RQD', value: 'rqd' },
    { label: 'TCR', value: 'tcr' },
    { label: 'SCR', value: 'scr' },
    ...Object.values(data.curveData.value).map((c) => ({
      label: c.mnemonic,
      value: `curve-${c.id}`,
    })),
    { label: 'Intervals', value: 'intervals' },
  ])

  return { trackHeight, brushLabel, typeCounts, panelCurves, trackIntervals, holeAxis, trackKeys }
}
