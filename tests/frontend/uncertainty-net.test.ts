import { describe, expect, it } from 'vitest'
import { mount } from '@vue/test-utils'
import NetSets from '../../frontend/src/components/net/NetSets.vue'
import NetLegend from '../../frontend/src/components/net/NetLegend.vue'
import { fromScreen } from '../../frontend/src/logic/net/net-geometry'
import type { NetSetMark } from '../../frontend/src/logic/net/net-types'

const R = 100
const mark = (fields: Partial<NetSetMark>): NetSetMark => ({
  id: 1,
  name: 'J1',
  colour: '#1f77b4',
  centre: { trend: 0, plunge: 90 },
  coneAngle: 20,
  meanPole: { trend: 0, plunge: 90 },
  alpha95: 3.1,
  uncertainty95: 5.22,
  ...fields,
})

function mountSets(sets: NetSetMark[]) {
  return mount(NetSets, {
    props: {
      sets,
      intersections: [],
      projection: 'equal-area',
      radius: R,
      margin: 20,
      preview: null,
    },
  })
}

/** The vertices of an SVG path written as `Mx,yLx,y…`. */
const points = (d: string) =>
  [...d.matchAll(/[ML](-?[\d.]+),(-?[\d.]+)/g)].map((m) => ({ x: Number(m[1]), y: Number(m[2]) }))

const unit = (l: { trend: number; plunge: number }) => {
  const t = (l.trend * Math.PI) / 180
  const p = (l.plunge * Math.PI) / 180
  return [Math.sin(t) * Math.cos(p), Math.cos(t) * Math.cos(p), Math.sin(p)]
}
const angleDeg = (a: { trend: number; plunge: number }, b: { trend: number; plunge: number }) => {
  const [u, v] = [unit(a), unit(b)]
  const dot = Math.min(1, u[0] * v[0] + u[1] * v[1] + u[2] * v[2])
  return (Math.acos(dot) * 180) / Math.PI
}

describe('NetSets cones about the mean pole', () => {
  it('NetSets: two rings per set when both cones are given, told apart by class and dashes', () => {
    const w = mountSets([
      mark({}),
      mark({ id: 2, name: 'J2', meanPole: { trend: 200, plunge: 40 } }),
    ])
    for (const id of [1, 2]) {
      const g = w.get(`g.mean[data-set="${id}"]`)
      expect(g.findAll('path')).toHaveLength(2)
      expect(g.findAll('path.a95')).toHaveLength(1)
      expect(g.findAll('path.u95')).toHaveLength(1)
      expect(g.get('path.u95').attributes('stroke')).toBe('#1f77b4')
      // told apart: the sampling ring solid, the combined ring dotted
      expect(g.get('path.a95').attributes('stroke-dasharray')).toBeUndefined()
      expect(g.get('path.u95').attributes('stroke-dasharray')).toBe('1.5 3.5')
    }
    expect(w.findAll('path.cone')).toHaveLength(2) // the set cones, one per set
  })

  it('NetSets: one ring when the combined cone is missing, none without a mean pole', () => {
    const w = mountSets([
      mark({ uncertainty95: null }),
      mark({ id: 2, meanPole: null, alpha95: null, uncertainty95: null }),
    ])
    expect(w.get('g.mean[data-set="1"]').findAll('path')).toHaveLength(1)
    expect(w.find('g.mean[data-set="1"] path.u95').exists()).toBe(false)
    expect(w.find('g.mean[data-set="2"]').exists()).toBe(false)
  })

  // Derived from Lambert equal-area r = R√2 sin(c/2): a cone of half-angle c about the vertical
  // draws a circle of that radius about the centre (c = 3.1 → 3.825, c = 5.22 → 6.440 for R = 100).
  it('NetSets: rings about a vertical mean have radii R√2 sin(c/2) [derived]', () => {
    const w = mountSets([mark({})])
    const radius = (cls: string) =>
      points(w.get(`g.mean path.${cls}`).attributes('d')!).map((p) => Math.hypot(p.x, p.y))
    const expected = (c: number) => R * Math.SQRT2 * Math.sin((c * Math.PI) / 360)
    expect(expected(3.1)).toBeCloseTo(3.825, 3)
    expect(expected(5.22)).toBeCloseTo(6.44, 3)
    for (const r of radius('a95')) expect(r).toBeCloseTo(expected(3.1), 2)
    for (const r of radius('u95')) expect(r).toBeCloseTo(expected(5.22), 2)
  })

  it('NetSets: an oblique mean pole, every combined-ring vertex lies 5.22° from it', () => {
    const pole = { trend: 200, plunge: 40 }
    const w = mountSets([mark({ meanPole: pole })])
    const vertices = points(w.get('g.mean path.u95').attributes('d')!)
    expect(vertices.length).toBeGreaterThan(60)
    for (const v of vertices)
      expect(angleDeg(fromScreen(v, 'equal-area', R)!, pole)).toBeCloseTo(5.22, 1)
  })

  it('NetLegend: words for the sampling ring and the combined ring', () => {
    const w = mount(NetLegend, {
      props: {
        sets: [mark({})],
        density: null,
        blindAngle: null,
        zone: null,
        hasIntersections: false,
      },
    })
    expect(w.text()).toContain('solid ring: sampling cone (α95, 95 %)')
    expect(w.text()).toContain('dotted ring: sampling and survey combined (95 %)')
  })
})
