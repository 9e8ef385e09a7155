import { describe, expect, it } from 'vitest'
import { mount } from '@vue/test-utils'
import TrackTadpoles from '../../frontend/src/components/track/TrackTadpoles.vue'
import { dipScale, UNORIENTED_LANE } from '../../frontend/src/logic/track/tadpole-layout'
import { TAIL_LENGTH } from '../../frontend/src/logic/track/structure-symbols'
import type { TrackStructure } from '../../frontend/src/logic/track/track-types'

const s = (
  id: number,
  depth: number,
  dip: number | null,
  dipDirection: number | null,
  extra: Partial<TrackStructure> = {},
): TrackStructure => ({
  id,
  depth,
  type: 'joint',
  dip,
  dipDirection,
  flagged: false,
  ...extra,
})

/** Tail segments of a path: `M x1,y1 L x2,y2` per tadpole. */
function tails(d: string) {
  return [...d.matchAll(/M(-?[\d.]+),(-?[\d.]+)L(-?[\d.]+),(-?[\d.]+)/g)].map((m) =>
    m.slice(1).map(Number),
  )
}

const props = { title: 'Core', width: 200, height: 400, domain: [0, 100] as [number, number] }

describe('TrackTadpoles', () => {
  it('points each tail toward the dip direction, north up the page', () => {
    const structures = [
      s(1, 10, 30, 90),
      s(2, 30, 30, 180),
      s(3, 50, 30, 0),
      s(4, 70, 30, 270),
      s(5, 90, 30, 45),
    ]
    const wrapper = mount(TrackTadpoles, { props: { ...props, structures } })
    const segs = tails(wrapper.get('[data-type="joint"] path.tails').attributes('d')!)
    expect(segs).toHaveLength(5)
    const dirs = segs.map(([x1, y1, x2, y2]) => [x2 - x1, y2 - y1])
    const L = TAIL_LENGTH
    const expected = [
      [L, 0], // east: right
      [0, L], // south: down the page
      [0, -L], // north: up the page
      [-L, 0], // west: left
      [L * Math.SQRT1_2, -L * Math.SQRT1_2], // north-east
    ]
    dirs.forEach(([dx, dy], i) => {
      expect(dx).toBeCloseTo(expected[i][0], 1)
      expect(dy).toBeCloseTo(expected[i][1], 1)
    })
  })

  it('places the symbol at x = dip and y = depth', () => {
    const wrapper = mount(TrackTadpoles, { props: { ...props, structures: [s(1, 25, 60, 120)] } })
    const [[x, y]] = tails(wrapper.get('path.tails').attributes('d')!)
    expect(x).toBeCloseTo(dipScale(200)(60), 2)
    expect(y).toBeCloseTo(100, 2) // 25 m of 0–100 m on 400 px
  })

  it('draws unoriented structures hollow in their lane, never with a tail', () => {
    const wrapper = mount(TrackTadpoles, {
      props: { ...props, structures: [s(1, 50, null, null), s(2, 60, 40, null)] },
    })
    expect(wrapper.get('path.tails').attributes('d')).toBe('')
    expect(wrapper.get('path.symbols').attributes('d')).toBe('')
    const hollow = wrapper.get('path.hollow').attributes('d')!
    const xs = [...hollow.matchAll(/M(-?[\d.]+),/g)].map((m) => Number(m[1]))
    expect(xs).toHaveLength(2)
    for (const x of xs) expect(x).toBeLessThan(UNORIENTED_LANE)
  })

  it('rings flagged structures and keeps them drawn', () => {
    const wrapper = mount(TrackTadpoles, {
      props: { ...props, structures: [s(1, 20, 30, 10, { flagged: true }), s(2, 40, 30, 10)] },
    })
    expect(tails(wrapper.get('path.tails').attributes('d')!)).toHaveLength(2)
    expect(wrapper.get('[data-testid="tadpoles-flagged"]').attributes('d')).toMatch(/^M/)
  })

  it('leaves out structures outside the depth window', () => {
    const wrapper = mount(TrackTadpoles, {
      props: {
        ...props,
        domain: [20, 40],
        structures: [s(1, 10, 30, 10), s(2, 30, 30, 10), s(3, 50, 30, 10)],
      },
    })
    expect(tails(wrapper.get('path.tails').attributes('d')!)).toHaveLength(1)
  })

  it('uses one symbol and colour per type from the legend', () => {
    const wrapper = mount(TrackTadpoles, {
      props: { ...props, structures: [s(1, 10, 30, 10), s(2, 20, 40, 200, { type: 'fault' })] },
    })
    const joint = wrapper.get('[data-type="joint"] path.symbols').attributes('fill')
    const fault = wrapper.get('[data-type="fault"] path.symbols').attributes('fill')
    expect(joint).not.toBe(fault)
  })
})
