import { describe, expect, it } from 'vitest'
import {
  createWallGesture,
  type WallEvent,
  type WallState,
} from '../../frontend/src/logic/image/wall-gesture'
import { depthToY, traceDepth } from '../../frontend/src/logic/image/sinusoid-path'
import type { DrawnSinusoid } from '../../frontend/src/logic/image/image-types'

// 360 px per turn, 100–102 m over 1000 px (2 mm per px).
const scale = { width: 360, height: 1000, domain: [100, 102] as [number, number] }
const pick: DrawnSinusoid = {
  key: 'pick:7',
  depth: 101,
  height: 0.1,
  troughAzimuth: 90,
  role: 'pick',
}
const predicted: DrawnSinusoid = { ...pick, key: 'predicted:3', depth: 101.5, role: 'predicted' }

function setup(extra: Partial<WallState> = {}) {
  const events: WallEvent[] = []
  const state: WallState = {
    scale,
    interactive: true,
    brushable: false,
    sinusoids: [pick, predicted],
    points: [{ depth: 100.2, azimuth: 30 }],
    ...extra,
  }
  const g = createWallGesture(
    () => state,
    (e) => events.push(e),
  )
  const p = (
    x: number,
    y: number,
    extra2: Partial<{ id: number; button: number; pointerType: string }> = {},
  ) => ({
    id: 1,
    x,
    y,
    button: 0,
    pointerType: 'mouse',
    ...extra2,
  })
  return { g, p, events }
}
const onPick = (az: number) => depthToY(scale, traceDepth(pick, az))

describe('createWallGesture()', () => {
  it('a click on the bare wall while picking gives a point at that depth and azimuth', () => {
    const { g, p, events } = setup()
    g.down(p(180, 700))
    g.up(p(181, 701))
    expect(events).toHaveLength(1)
    const e = events[0]
    if (e.type !== 'point') throw new Error(e.type)
    expect(e.p.depth).toBeCloseTo(101.402, 9)
    expect(e.p.azimuth).toBeCloseTo(181, 9)
  })

  it('a click on a trace selects it (not a point); on the bare wall a selection is cleared first', () => {
    const { g, p, events } = setup()
    g.down(p(45, onPick(45)))
    g.up(p(45, onPick(45)))
    expect(events).toEqual([{ type: 'select', key: 'pick:7' }])
    const sel = setup({ sinusoids: [{ ...pick, selected: true }] })
    sel.g.down(sel.p(200, 900))
    sel.g.up(sel.p(200, 900))
    expect(sel.events.map((e) => e.type)).toEqual(['select', 'point'])
    expect(sel.events[0]).toEqual({ type: 'select', key: null })
  })

  it('dragging a point handle moves that point, the last move final', () => {
    const { g, p, events } = setup()
    const y = depthToY(scale, 100.2)
    g.down(p(30, y))
    g.move(p(40, y + 50))
    g.up(p(40, y + 50))
    expect(events.map((e) => e.type)).toEqual(['drag-point', 'drag-point'])
    const last = events[1]
    if (last.type !== 'drag-point') throw new Error(last.type)
    expect(last.index).toBe(0)
    expect(last.final).toBe(true)
    expect(last.p.depth).toBeCloseTo(100.3, 9)
    expect(last.p.azimuth).toBeCloseTo(40, 9)
  })

  it('dragging a pick shifts it in depth; a predicted trace is not dragged', () => {
    const { g, p, events } = setup()
    g.down(p(45, onPick(45)))
    g.move(p(45, onPick(45) + 25))
    g.up(p(45, onPick(45) + 25))
    expect(events).toEqual([
      { type: 'drag-sinusoid', key: 'pick:7', metres: expect.closeTo(0.05, 9), final: false },
      { type: 'drag-sinusoid', key: 'pick:7', metres: expect.closeTo(0.05, 9), final: true },
    ])
    const y = depthToY(scale, traceDepth(predicted, 45))
    const other = setup()
    other.g.down(other.p(45, y))
    other.g.move(other.p(45, y + 25))
    other.g.up(other.p(45, y + 25))
    expect(other.events.some((e) => e.type === 'drag-sinusoid')).toBe(false)
  })

  it('a mouse drag on the bare wall brushes where the view brushes, else pans', () => {
    const b = setup({ interactive: false, brushable: true })
    b.g.down(b.p(200, 100))
    b.g.move(b.p(200, 300))
    b.g.up(b.p(200, 350))
    expect(b.events.at(-1)).toEqual({ type: 'brush', range: [100.2, 100.7], final: true })
    const pan = setup({ interactive: false })
    pan.g.down(pan.p(200, 300))
    pan.g.move(pan.p(200, 250))
    expect(pan.events).toEqual([{ type: 'pan', metres: expect.closeTo(0.1, 9) }])
  })

  it('touch drags pan even where the mouse brushes; the middle button pans', () => {
    const t = setup({ interactive: false, brushable: true })
    t.g.down(t.p(200, 300, { pointerType: 'touch' }))
    t.g.move(t.p(200, 350, { pointerType: 'touch' }))
    expect(t.events).toEqual([{ type: 'pan', metres: expect.closeTo(-0.1, 9) }])
    const m = setup({ brushable: true })
    m.g.down(m.p(200, 300, { button: 1 }))
    m.g.move(m.p(200, 200, { button: 1 }))
    expect(m.events).toEqual([{ type: 'pan', metres: expect.closeTo(0.2, 9) }])
  })

  it('two fingers pinch to zoom about their middle; nothing is clicked', () => {
    const { g, p, events } = setup()
    g.down(p(100, 400, { id: 1, pointerType: 'touch' }))
    g.down(p(100, 600, { id: 2, pointerType: 'touch' }))
    g.move(p(100, 300, { id: 1, pointerType: 'touch' }))
    g.move(p(100, 700, { id: 2, pointerType: 'touch' }))
    g.up(p(100, 300, { id: 1, pointerType: 'touch' }))
    g.up(p(100, 700, { id: 2, pointerType: 'touch' }))
    const zooms = events.filter((e) => e.type === 'zoom')
    expect(zooms).toHaveLength(2)
    // Fingers 200 → 400 px apart: the span shrinks to half overall.
    const f = zooms.reduce((a, e) => a * (e.type === 'zoom' ? e.factor : 1), 1)
    expect(f).toBeCloseTo(0.5, 9)
    expect(events.some((e) => e.type === 'point' || e.type === 'select')).toBe(false)
  })

  it('hover reports the cursor on the wall and null on leaving; the wheel zooms at the cursor', () => {
    const { g, p, events } = setup()
    g.move(p(90, 250))
    g.leave()
    g.wheel(500, 100)
    expect(events[0]).toEqual({
      type: 'cursor',
      p: { depth: expect.closeTo(100.5, 9), azimuth: 90 },
    })
    expect(events[1]).toEqual({ type: 'cursor', p: null })
    expect(events[2]).toEqual({
      type: 'zoom',
      depth: expect.closeTo(101, 9),
      factor: expect.closeTo(Math.exp(0.15), 9),
    })
  })
})
