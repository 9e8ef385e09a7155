import { describe, expect, it } from 'vitest'
import { mount } from '@vue/test-utils'
import ProjectCollarPlan from '../../frontend/src/components/project/ProjectCollarPlan.vue'
import {
  boxesOverlap,
  layoutCollarPlan,
  type CollarPoint,
} from '../../frontend/src/logic/project/collar-plan-layout'

// Frame 400 × 300 with margins 16/16/44/78 → inner 306 × 240 at (78, 16); 44 px padding each side
// leaves 218 × 152 for the collars. Collars span 100 m E and 50 m N, so the scale is
// min(218/100, 152/50) = 2.18 px/m along both axes, centred on (1050, 2025) = pixel (231, 136).
const holes: CollarPoint[] = [
  { id: 1, name: 'A', east: 1000, north: 2000, plannedAzimuth: 90 },
  { id: 2, name: 'B', east: 1100, north: 2000, plannedAzimuth: 180 },
  { id: 3, name: 'C', east: 1000, north: 2050 },
]

function circle(wrapper: ReturnType<typeof mount>, name: string) {
  const c = wrapper.get(`[data-testid="collar-${name}"] circle`)
  return { cx: Number(c.attributes('cx')), cy: Number(c.attributes('cy')) }
}

describe('ProjectCollarPlan', () => {
  it('places known collars at their pixel positions', () => {
    const wrapper = mount(ProjectCollarPlan, { props: { holes, width: 400, height: 300 } })
    expect(circle(wrapper, 'A').cx).toBeCloseTo(122, 6)
    expect(circle(wrapper, 'A').cy).toBeCloseTo(190.5, 6)
    expect(circle(wrapper, 'B').cx).toBeCloseTo(340, 6)
    expect(circle(wrapper, 'B').cy).toBeCloseTo(190.5, 6)
    expect(circle(wrapper, 'C').cx).toBeCloseTo(122, 6)
    expect(circle(wrapper, 'C').cy).toBeCloseTo(81.5, 6)
  })

  it('uses one scale for easting and northing', () => {
    const wrapper = mount(ProjectCollarPlan, { props: { holes, width: 640, height: 260 } })
    const a = circle(wrapper, 'A')
    const b = circle(wrapper, 'B')
    const c = circle(wrapper, 'C')
    const pxPerMetreEast = (b.cx - a.cx) / 100
    const pxPerMetreNorth = (a.cy - c.cy) / 50
    expect(pxPerMetreEast).toBeGreaterThan(0)
    expect(pxPerMetreNorth).toBeCloseTo(pxPerMetreEast, 9)
  })

  it('draws azimuth ticks toward the planned azimuth', () => {
    const wrapper = mount(ProjectCollarPlan, { props: { holes, width: 400, height: 300 } })
    const east = wrapper.get('[data-testid="collar-A"] line.tick')
    expect(Number(east.attributes('x2'))).toBeCloseTo(122 + 20, 6)
    expect(Number(east.attributes('y2'))).toBeCloseTo(190.5, 6)
    const south = wrapper.get('[data-testid="collar-B"] line.tick')
    expect(Number(south.attributes('x2'))).toBeCloseTo(340, 6)
    expect(Number(south.attributes('y2'))).toBeCloseTo(190.5 + 20, 6)
    expect(wrapper.find('[data-testid="collar-C"] line.tick').exists()).toBe(false)
  })

  it('labels the axes with easting and northing ticks', () => {
    const wrapper = mount(ProjectCollarPlan, { props: { holes, width: 400, height: 300 } })
    const text = wrapper.text()
    expect(text).toContain('Easting (m)')
    expect(text).toContain('Northing (m)')
    const ticks = wrapper
      .findAll('g.axis')[0]!
      .findAll('.tick text')
      .map((t) => t.text())
    expect(ticks).toEqual(['1000', '1050', '1100'])
  })

  it('emits select with the clicked hole', async () => {
    const wrapper = mount(ProjectCollarPlan, { props: { holes, width: 400, height: 300 } })
    await wrapper.get('[data-testid="collar-B"]').trigger('click')
    expect(wrapper.emitted('select')).toEqual([[holes[1]]])
  })
})

describe('layoutCollarPlan()', () => {
  it('keeps labels of a tight cluster apart', () => {
    const cluster: CollarPoint[] = Array.from({ length: 6 }, (_, i) => ({
      name: `GSQ-BH0${i + 1}`,
      east: 5000 + (i % 3) * 12,
      north: 8000 + Math.floor(i / 3) * 9,
      plannedAzimuth: 190,
    }))
    const { collars } = layoutCollarPlan(cluster, 480, 360)
    for (const [i, a] of collars.entries()) {
      for (const b of collars.slice(i + 1)) {
        expect(boxesOverlap(a.label.box, b.label.box), `${a.name} vs ${b.name}`).toBe(false)
      }
    }
  })

  it('scales ticks between the shortest and longest planned length', () => {
    const { collars } = layoutCollarPlan(
      [
        { name: 'short', east: 0, north: 0, plannedAzimuth: 0, plannedLength: 50 },
        { name: 'long', east: 200, north: 0, plannedAzimuth: 0, plannedLength: 200 },
      ],
      500,
      400,
    )
    const length = (c: (typeof collars)[number]) => c.cy - (c.tick?.y2 ?? c.cy)
    expect(length(collars[1]!)).toBeCloseTo(30, 6)
    expect(length(collars[0]!)).toBeCloseTo(10 + 20 * 0.25, 6)
  })

  it('turns true azimuths into grid ones with the convergence', () => {
    const { collars } = layoutCollarPlan(
      [{ name: 'A', east: 0, north: 0, plannedAzimuth: 92 }],
      400,
      300,
      2,
    )
    const c = collars[0]!
    expect(c.tick!.x2 - c.cx).toBeCloseTo(20, 6)
    expect(c.tick!.y2 - c.cy).toBeCloseTo(0, 6)
  })
})
