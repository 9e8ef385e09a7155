import { computed, ref } from 'vue'
import type { DepthRange } from '../logic/track/track-types'

/** Shortest depth span the view zooms to (m). */
const MIN_SPAN = 0.5

/**
 * The depth window all tracks share: [top, bottom] in metres along hole, zoomed about a depth and
 * panned, always inside the hole's extent.
 */
export function useDepthAxis(extent: () => DepthRange) {
  const domain = ref<DepthRange>([0, 1])

  function clamp([a, b]: DepthRange): DepthRange {
    const [lo, hi] = extent()
    const span = Math.min(Math.max(b - a, MIN_SPAN), hi - lo)
    let top = Math.max(lo, Math.min(a, hi - span))
    if (!Number.isFinite(top)) top = lo
    return [top, top + span]
  }

  function reset() {
    domain.value = [...extent()]
  }

  /** Zooms by `factor` (< 1 in, > 1 out) keeping `depth` where it is on screen. */
  function zoomAt(depth: number, factor: number) {
    const [a, b] = domain.value
    const f = Math.max(0.05, Math.min(20, factor))
    domain.value = clamp([depth - (depth - a) * f, depth + (b - depth) * f])
  }

  function panBy(metres: number) {
    const [a, b] = domain.value
    domain.value = clamp([a + metres, b + metres])
  }

  function show(range: DepthRange) {
    const [a, b] = range[0] <= range[1] ? range : [range[1], range[0]]
    const pad = (b - a) * 0.05
    domain.value = clamp([a - pad, b + pad])
  }

  const span = computed(() => domain.value[1] - domain.value[0])

  return { domain, span, reset, zoomAt, panBy, show }
}
