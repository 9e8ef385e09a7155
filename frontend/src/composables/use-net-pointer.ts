import { computed, ref, type Ref } from 'vue'
import { pointer, polygonContains, quadtree } from 'd3'
import type { NetTool } from '../logic/net/net-types'

/** Net positions of the plotted poles, by index, with their structure ids. */
export interface PointerTargets {
  ids: readonly number[]
  xs: Float64Array
  ys: Float64Array
}

export interface NetPointerHandlers {
  hover: (id: number | null) => void
  pick: (id: number) => void
  lasso: (ids: number[]) => void
  /** A click on the net in the cone tool: the screen point (user units). */
  point: (p: { x: number; y: number }) => void
}

const PICK_DISTANCE = 9

/**
 * Pointer handling of the net in its own user units (d3.pointer reads the viewBox): nearest pole
 * by quadtree for hover and click, a freehand lasso in the lasso tool, a point in the cone tool.
 */
export function useNetPointer(
  svg: Ref<SVGSVGElement | undefined>,
  targets: () => PointerTargets,
  tool: () => NetTool,
  on: NetPointerHandlers,
) {
  const lassoPoints = ref<[number, number][]>([])
  let dragging = false
  let moved = false
  let start: [number, number] = [0, 0]

  const tree = computed(() => {
    const { xs, ys } = targets()
    const indices: number[] = []
    for (let i = 0; i < xs.length; i++) if (Number.isFinite(xs[i])) indices.push(i)
    return quadtree<number>()
      .x((i) => xs[i])
      .y((i) => ys[i])
      .addAll(indices)
  })

  const at = (event: PointerEvent): [number, number] =>
    svg.value ? pointer(event, svg.value) : [event.offsetX, event.offsetY]

  function nearest([x, y]: [number, number]): number | null {
    const i = tree.value.find(x, y, PICK_DISTANCE)
    return i === undefined ? null : (targets().ids[i] ?? null)
  }

  function down(event: PointerEvent) {
    if (event.button !== 0) return
    dragging = true
    moved = false
    start = at(event)
    if (tool() === 'lasso') lassoPoints.value = [start]
    ;(event.currentTarget as Element | null)?.setPointerCapture?.(event.pointerId)
  }

  function move(event: PointerEvent) {
    const p = at(event)
    if (!dragging) {
      on.hover(nearest(p))
      return
    }
    if (Math.hypot(p[0] - start[0], p[1] - start[1]) > 3) moved = true
    if (tool() === 'lasso' && moved) lassoPoints.value = [...lassoPoints.value, p]
  }

  function up(event: PointerEvent) {
    if (!dragging) return
    dragging = false
    const p = at(event)
    if (tool() === 'lasso' && moved && lassoPoints.value.length > 2) {
      const polygon = lassoPoints.value
      const { ids, xs, ys } = targets()
      const inside: number[] = []
      for (let i = 0; i < ids.length; i++)
        if (Number.isFinite(xs[i]) && polygonContains(polygon, [xs[i], ys[i]])) inside.push(ids[i])
      on.lasso(inside)
    } else if (!moved) {
      if (tool() === 'cone') on.point({ x: p[0], y: p[1] })
      else {
        const id = nearest(p)
        if (id !== null) on.pick(id)
      }
    }
    lassoPoints.value = []
  }

  function leave() {
    if (!dragging) on.hover(null)
  }

  const lassoPath = computed(() =>
    lassoPoints.value.length > 1 ? `M${lassoPoints.value.map((p) => p.join(',')).join('L')}Z` : '',
  )

  return { down, move, up, leave, lassoPath }
}
