// Pointer gestures on the wall, as plain data in and events out (ImageCanvas feeds it pointer
// events in wall pixels). Press on a point handle and drag: move the point. Press on a pick or the
// draft and drag: shift it in depth. Click a trace: select it. Click the bare wall: a point (when
// picking). Drag the bare wall: pan (touch, middle button, or a view not picking) or brush a
// depth range (mouse, where the view brushes). Two fingers: pinch to zoom, move to pan.
import type { TracePoint } from '../../api/images'
import type { DrawnSinusoid } from './image-types'
import { hitPoint, hitSinusoid, xToAzimuth, yToDepth, type WallScale } from './sinusoid-path'

export interface WallPointer {
  id: number
  x: number
  y: number
  button: number
  pointerType: string
}

export type WallEvent =
  | { type: 'point'; p: TracePoint }
  | { type: 'drag-point'; index: number; p: TracePoint; final: boolean }
  | { type: 'drag-sinusoid'; key: string; metres: number; final: boolean }
  | { type: 'select'; key: string | null }
  | { type: 'cursor'; p: TracePoint | null }
  | { type: 'pan'; metres: number }
  | { type: 'zoom'; depth: number; factor: number }
  | { type: 'brush'; range: [number, number]; final: boolean }

export interface WallState {
  scale: WallScale
  interactive: boolean
  brushable: boolean
  sinusoids: readonly DrawnSinusoid[]
  points: readonly TracePoint[]
}

/** Movement (px) before a press counts as a drag rather than a click. */
const SLOP = 4
/** Roles a drag may move in depth. */
const DRAGGABLE = new Set(['pick', 'draft'])

type Mode =
  | { kind: 'point'; index: number }
  | { kind: 'sinusoid'; key: string; draggable: boolean }
  | { kind: 'wall'; pan: boolean }

export function createWallGesture(state: () => WallState, emit: (e: WallEvent) => void) {
  const down = new Map<number, { x: number; y: number }>()
  let mode: Mode | null = null
  let start = { x: 0, y: 0 }
  let last = { x: 0, y: 0 }
  let moved = false
  let pinch: { distance: number; y: number } | null = null

  const at = (s: WallState, x: number, y: number): TracePoint => ({
    depth: yToDepth(s.scale, y),
    azimuth: xToAzimuth(s.scale, x),
  })
  const metresPerPx = (s: WallState) => (s.scale.domain[1] - s.scale.domain[0]) / s.scale.height

  function pinchOf() {
    const [a, b] = [...down.values()]
    return { distance: Math.hypot(a.x - b.x, a.y - b.y), y: (a.y + b.y) / 2 }
  }

  function press(e: WallPointer) {
    down.set(e.id, { x: e.x, y: e.y })
    if (down.size === 2) {
      // A second finger: whatever the first began becomes a pinch, nothing is clicked.
      mode = null
      pinch = pinchOf()
      return
    }
    if (down.size > 2) return
    const s = state()
    start = last = { x: e.x, y: e.y }
    moved = false
    if (e.button === 1) {
      mode = { kind: 'wall', pan: true }
      return
    }
    if (e.button !== 0) return
    const index = s.interactive ? hitPoint(s.scale, s.points, e.x, e.y) : -1
    const key = index < 0 ? hitSinusoid(s.scale, s.sinusoids, e.x, e.y) : null
    const hit = key === null ? undefined : s.sinusoids.find((x) => x.key === key)
    if (index >= 0) mode = { kind: 'point', index }
    else if (hit)
      mode = { kind: 'sinusoid', key: hit.key, draggable: s.interactive && DRAGGABLE.has(hit.role) }
    else mode = { kind: 'wall', pan: e.pointerType === 'touch' || !s.brushable || s.interactive }
  }

  function move(e: WallPointer) {
    const s = state()
    if (!down.has(e.id)) {
      if (down.size === 0) emit({ type: 'cursor', p: at(s, e.x, e.y) })
      return
    }
    down.set(e.id, { x: e.x, y: e.y })
    if (pinch && down.size === 2) {
      const now = pinchOf()
      const depth = yToDepth(s.scale, now.y)
      if (now.distance > 0 && pinch.distance > 0)
        emit({ type: 'zoom', depth, factor: pinch.distance / now.distance })
      if (now.y !== pinch.y) emit({ type: 'pan', metres: (pinch.y - now.y) * metresPerPx(s) })
      pinch = now
      return
    }
    if (!mode) return
    if (!moved && Math.hypot(e.x - start.x, e.y - start.y) > SLOP) moved = true
    if (!moved) return
    if (mode.kind === 'point')
      emit({ type: 'drag-point', index: mode.index, p: at(s, e.x, e.y), final: false })
    else if (mode.kind === 'sinusoid' && mode.draggable)
      emit({
        type: 'drag-sinusoid',
        key: mode.key,
        metres: (e.y - start.y) * metresPerPx(s),
        final: false,
      })
    else if (mode.kind === 'wall' && mode.pan) {
      if (e.y !== last.y) emit({ type: 'pan', metres: (last.y - e.y) * metresPerPx(s) })
    } else if (mode.kind === 'wall')
      emit({ type: 'brush', range: ordered(s, start.y, e.y), final: false })
    last = { x: e.x, y: e.y }
  }

  function release(e: WallPointer, cancelled = false) {
    if (!down.delete(e.id)) return
    if (pinch) {
      if (down.size < 2) pinch = null
      return
    }
    const m = mode
    mode = null
    if (!m) return
    const s = state()
    const p = at(s, e.x, e.y)
    if (m.kind === 'point') {
      if (moved) emit({ type: 'drag-point', index: m.index, p, final: true })
    } else if (m.kind === 'sinusoid') {
      if (moved && m.draggable)
        emit({
          type: 'drag-sinusoid',
          key: m.key,
          metres: (e.y - start.y) * metresPerPx(s),
          final: true,
        })
      else if (!moved && !cancelled) emit({ type: 'select', key: m.key })
    } else if (moved && !m.pan)
      emit({ type: 'brush', range: ordered(s, start.y, e.y), final: true })
    else if (!moved && !cancelled && s.interactive) {
      if (s.sinusoids.some((x) => x.selected)) emit({ type: 'select', key: null })
      emit({ type: 'point', p })
    }
  }

  function wheel(y: number, deltaY: number) {
    emit({ type: 'zoom', depth: yToDepth(state().scale, y), factor: Math.exp(deltaY * 0.0015) })
  }

  return {
    down: press,
    move,
    up: (e: WallPointer) => release(e),
    cancel: (e: WallPointer) => release(e, true),
    leave: () => {
      if (down.size === 0) emit({ type: 'cursor', p: null })
    },
    wheel,
  }
}

function ordered(s: WallState, y0: number, y1: number): [number, number] {
  const [lo, hi] = s.scale.domain
  const c = (y: number) => Math.max(lo, Math.min(hi, yToDepth(s.scale, y)))
  const a = c(y0)
  const b = c(y1)
  return a <= b ? [a, b] : [b, a]
}

/**
 * DOM handlers feeding a gesture with pointer and wheel events in the element's own pixels; the
 * element captures the pointer on press, so a drag carries on past its edges.
 */
export function wallHandlers(
  el: () => HTMLElement | undefined,
  gesture: ReturnType<typeof createWallGesture>,
) {
  const at = (event: PointerEvent): WallPointer => {
    const rect = el()?.getBoundingClientRect()
    return {
      id: event.pointerId,
      x: event.clientX - (rect?.left ?? 0),
      y: event.clientY - (rect?.top ?? 0),
      button: event.button,
      pointerType: event.pointerType,
    }
  }
  return {
    down(event: PointerEvent) {
      if (event.button === 1) event.preventDefault() // no autoscroll: the middle button pans
      el()?.setPointerCapture?.(event.pointerId)
      gesture.down(at(event))
    },
    move: (event: PointerEvent) => gesture.move(at(event)),
    up: (event: PointerEvent) => gesture.up(at(event)),
    cancel: (event: PointerEvent) => gesture.cancel(at(event)),
    leave: () => gesture.leave(),
    wheel(event: WheelEvent) {
      event.preventDefault()
      gesture.wheel(event.clientY - (el()?.getBoundingClientRect().top ?? 0), event.deltaY)
    },
  }
}
