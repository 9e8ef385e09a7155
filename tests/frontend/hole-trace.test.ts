import { describe, expect, it } from 'vitest'
import { mount } from '@vue/test-utils'
import HoleDoglegTable from '../../frontend/src/components/hole/HoleDoglegTable.vue'
import HoleTracePlan from '../../frontend/src/components/hole/HoleTracePlan.vue'
import HoleTraceSection from '../../frontend/src/components/hole/HoleTraceSection.vue'
import {
  alongSection,
  buildTrace,
  equalFrame,
  meanAzimuth,
} from '../../frontend/src/logic/hole/trace-geometry'

/** A straight hole toward 090° plunging 30°: 100 m along it is 86.60 m east and 50 m down. */
const straight = [
  { depth: 0, azimuth: 90, plunge: 30 },
  { depth: 50, azimuth: 90, plunge: 30 },
  { depth: 100, azimuth: 90, plunge: 30 },
]
/** Turns 6° in 30 m between 30 and 60 m: 6°/30 m, above the 3°/30 m flag. */
const bending = [
  { depth: 0, azimuth: 10, plunge: 60 },
  { depth: 30, azimuth: 10, plunge: 60 },
  { depth: 60, azimuth: 10, plunge: 54 },
  { depth: 90, azimuth: 10, plunge: 53 },
]

describe('trace geometry', () => {
  it('buildTrace() follows orient desurvey from the collar', () => {
    const trace = buildTrace(straight)
    expect(trace.path[0]).toEqual({ depth: 0, east: 0, north: 0, down: 0 })
    const end = trace.path.at(-1)!
    expect(end.depth).toBe(100)
    expect(end.east).toBeCloseTo(86.6025, 3)
    expect(end.north).toBeCloseTo(0, 9)
    expect(end.down).toBeCloseTo(50, 9)
    expect(trace.stations).toHaveLength(3)
    expect(trace.sectionAzimuth).toBeCloseTo(90, 9)
    expect(alongSection(end, 90)).toBeCloseTo(86.6025, 3)
  })

  it('meanAzimuth() averages directions as vectors across north', () => {
    const across = [
      { depth: 0, azimuth: 350, plunge: 0 },
      { depth: 10, azimuth: 10, plunge: 0 },
    ]
    expect(meanAzimuth(across)).toBeCloseTo(0, 9)
  })

  it('equalFrame() keeps one metre the same length on both axes', () => {
    const f = equalFrame([0, 100], [0, 20], { width: 400, height: 300, margin: 20 })
    const perX = (f.x(100) - f.x(0)) / 100
    const perY = (f.y(0) - f.y(100)) / 100
    expect(perX).toBeCloseTo(perY, 9)
  })
})

describe('HoleTracePlan and HoleTraceSection', () => {
  it('draw the hole and one ring per station', () => {
    const plan = mount(HoleTracePlan, { props: { stations: straight } })
    expect(plan.get('path.hole').attributes('d')).toMatch(/^M/)
    expect(plan.findAll('circle.station')).toHaveLength(3)
    expect(plan.text()).toContain('100.0 m')
    const section = mount(HoleTraceSection, {
      props: { stations: straight, collarElevation: 212.4 },
    })
    expect(section.findAll('circle.station')).toHaveLength(3)
    expect(section.get('figcaption').text()).toContain('090.0° (mean azimuth)')
  })

  it('say so when there is nothing to draw', () => {
    const plan = mount(HoleTracePlan, { props: { stations: [] } })
    expect(plan.text()).toContain('No survey stations')
  })
})

describe('HoleDoglegTable', () => {
  it('lists dogleg and severity per segment and flags those above 3°/30 m', () => {
    const wrapper = mount(HoleDoglegTable, { props: { stations: bending } })
    const rows = wrapper.findAll('tbody tr')
    expect(rows).toHaveLength(3)
    expect(rows[0]!.findAll('td').map((td) => td.text())).toEqual([
      '0.0',
      '30.0',
      '0.00°',
      '0.00',
      '',
    ])
    expect(rows[1]!.findAll('td').map((td) => td.text())).toEqual([
      '30.0',
      '60.0',
      '6.00°',
      '6.00',
      'unusual',
    ])
    expect(rows[2]!.find('[data-testid="dogleg-unusual"]').exists()).toBe(false)
    expect(wrapper.get('[data-testid="dogleg-note"]').text()).toContain('above 3°/30 m')
    expect(wrapper.get('[data-testid="dogleg-note"]').text()).toContain('1 of 3 flagged')
  })
})
