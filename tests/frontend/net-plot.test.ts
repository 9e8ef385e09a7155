import { describe, expect, it } from 'vitest'
import { mount } from '@vue/test-utils'
import NetPlot from '../../frontend/src/components/net/NetPlot.vue'
import type { NetPole } from '../../frontend/src/logic/net/net-types'

/** Centres of the dots in a pole path: each marker's sub-path starts `M x,y`. */
function centres(d: string): [number, number][] {
  return [...d.matchAll(/M(-?[\d.]+),(-?[\d.]+)/g)].map((m) => [Number(m[1]), Number(m[2])])
}

const pole = (
  id: number,
  trend: number,
  plunge: number,
  extra: Partial<NetPole> = {},
): NetPole => ({
  id,
  trend,
  plunge,
  dip: 90 - plunge,
  dipDirection: (trend + 180) % 360,
  group: -1,
  flagged: false,
  weight: 1,
  ...extra,
})

describe('NetPlot projection', () => {
  // Derived from r = R√2 sin(c/2) (Lambert equal-area) and r = R tan(c/2) (stereographic), c = 90 −
  // plunge: R = 100, line 045/30 → equal-area (50.00, −50.00), equal-angle (40.825, −40.825) in
  // screen coordinates (y down).
  it('places line 045/30 at (50.00, −50.00) on an equal-area net of R = 100 [derived]', () => {
    const wrapper = mount(NetPlot, {
      props: { poles: [pole(1, 45, 30)], projection: 'equal-area', radius: 100 },
    })
    const [[x, y]] = centres(wrapper.get('path.poles').attributes('d')!)
    expect(x).toBeCloseTo(50.0, 2)
    expect(y).toBeCloseTo(-50.0, 2)
  })

  it('places line 045/30 at (40.825, −40.825) on an equal-angle net of R = 100 [derived]', () => {
    const wrapper = mount(NetPlot, {
      props: { poles: [pole(1, 45, 30)], projection: 'equal-angle', radius: 100 },
    })
    const [[x, y]] = centres(wrapper.get('path.poles').attributes('d')!)
    expect(x).toBeCloseTo(40.825, 2)
    expect(y).toBeCloseTo(-40.825, 2)
  })

  it('puts a vertical line at the centre and horizontal lines on the primitive, north up', () => {
    const poles = [pole(1, 0, 90), pole(2, 0, 0), pole(3, 90, 0), pole(4, 180, 0), pole(5, 270, 0)]
    for (const projection of ['equal-area', 'equal-angle'] as const) {
      const wrapper = mount(NetPlot, { props: { poles, projection, radius: 100 } })
      const pts = centres(wrapper.get('path.poles').attributes('d')!)
      const expected = [
        [0, 0],
        [0, -100],
        [100, 0],
        [0, 100],
        [-100, 0],
      ]
      pts.forEach(([x, y], i) => {
        expect(x).toBeCloseTo(expected[i][0], 6)
        expect(y).toBeCloseTo(expected[i][1], 6)
      })
    }
  })

  it('marks an intersection at its trend/plunge (045/30, equal-area R = 100)', () => {
    const wrapper = mount(NetPlot, {
      props: {
        poles: [],
        projection: 'equal-area',
        radius: 100,
        intersections: [{ key: '1-2', label: 'J1 × J2', trend: 45, plunge: 30 }],
      },
    })
    const ring = wrapper.get('[data-key="1-2"] circle')
    expect(Number(ring.attributes('cx'))).toBeCloseTo(50, 6)
    expect(Number(ring.attributes('cy'))).toBeCloseTo(-50, 6)
    expect(wrapper.text()).toContain('J1 × J2')
  })

  it('keeps a square viewBox so the net stays round at any size', () => {
    const wrapper = mount(NetPlot, { props: { poles: [], projection: 'equal-area' } })
    const svg = wrapper.get('svg')
    const [, , w, h] = svg.attributes('viewBox')!.split(' ').map(Number)
    expect(w).toBe(h)
    expect(svg.attributes('preserveAspectRatio')).toBe('xMidYMid meet')
    expect(wrapper.text()).toContain('N')
    expect(wrapper.findAll('.ticks line')).toHaveLength(36)
  })

  it('rings flagged poles and keeps them drawn', () => {
    const poles = [pole(1, 100, 40), pole(2, 200, 20, { flagged: true })]
    const wrapper = mount(NetPlot, { props: { poles, projection: 'equal-area', radius: 100 } })
    expect(centres(wrapper.get('path.poles').attributes('d')!)).toHaveLength(2)
    expect(centres(wrapper.get('[data-testid="net-flagged"]').attributes('d')!)).toHaveLength(1)
  })
})
