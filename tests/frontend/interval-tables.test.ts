import { describe, expect, it } from 'vitest'
import { mount } from '@vue/test-utils'
import {
  angleBetweenPlanes,
  fisherStats,
  planeIntersection,
  planeOfPole,
  poleOf,
  terzaghiWeight,
  type Plane,
} from '../../orient/index'
import IntervalSetTable from '../../frontend/src/components/interval/IntervalSetTable.vue'
import IntervalIntersectionTable from '../../frontend/src/components/interval/IntervalIntersectionTable.vue'
import type { AnalysisSet, SetIntersection } from '../../frontend/src/api/interval-types'
import { formatAngle, formatAzimuth, formatNumber } from '../../frontend/src/logic/format'
import { withPrimeVue } from './mount-options'

// [pub] Harrison & Hudson (2000), Engineering Rock Mechanics part 2, Q/A 7.10: borehole 136/55,
// six fractures (dip/dip direction); Terzaghi weights 2.066 2.338 3.645 1.866 1.340 1.183 and the
// normalised weighted mean pole (E, N, Down) 0.483, 0.571, 0.664.
const hole = { trend: 136, plunge: 55 }
const planes: Plane[] = [
  [39, 201],
  [50, 213],
  [63, 215],
  [52, 230],
  [42, 247],
  [28, 253],
].map(([dip, dipDirection]) => ({ dip, dipDirection }))

/** A set row as the analysis sends it: orient's Fisher statistics, rounded as the API rounds. */
function setRow(weighted: boolean): {
  row: AnalysisSet
  stats: NonNullable<ReturnType<typeof fisherStats>>
} {
  const poles = planes.map((p) => poleOf(p)!)
  const weights = planes.map((p) => (weighted ? terzaghiWeight(p, hole)! : 1))
  const stats = fisherStats(poles, { weights })!
  const mean = planeOfPole(stats.mean)!
  const r = (x: number, d = 2) => Number(x.toFixed(d))
  const row: AnalysisSet = {
    id: 1,
    name: 'J1',
    rule: 'cone',
    centreTrend: 40,
    centrePlunge: 40,
    coneAngle: 30,
    count: 6,
    weightedCount: r(
      weights.reduce((a, b) => a + b, 0),
      1,
    ),
    percent: 100,
    mean: { dip: r(mean.dip), dipDirection: r(mean.dipDirection) },
    meanPole: { trend: r(stats.mean.trend), plunge: r(stats.mean.plunge) },
    kappa: r(stats.kappa, 1),
    alpha95: r(stats.alpha95),
    sphericalVariance: r(stats.sphericalVariance, 4),
    spacing: { apparent: 0.9, true: 0.41, isrmClass: 'moderate' },
    systematic95: null,
    uncertainty95: null,
    version: 1,
  }
  return { row, stats }
}

const cell = (wrapper: ReturnType<typeof mount>, field: string) =>
  wrapper.get(`[data-testid="set-row-J1"] [data-field="${field}"]`).text()

describe('IntervalSetTable', () => {
  it('orient reproduces the published Terzaghi weights and weighted mean [pub]', () => {
    const published = [2.066, 2.338, 3.645, 1.866, 1.34, 1.183]
    planes.forEach((p, i) => expect(terzaghiWeight(p, hole)).toBeCloseTo(published[i], 2))
    const { stats } = setRow(true)
    const t = (stats.mean.trend * Math.PI) / 180
    const p = (stats.mean.plunge * Math.PI) / 180
    expect(Math.sin(t) * Math.cos(p)).toBeCloseTo(0.483, 2)
    expect(Math.cos(t) * Math.cos(p)).toBeCloseTo(0.571, 2)
    expect(Math.sin(p)).toBeCloseTo(0.664, 2)
  })

  for (const weighted of [false, true]) {
    it(`shows orient's fisherStats for the same data (${weighted ? 'Terzaghi-weighted' : 'unweighted'})`, () => {
      const { row, stats } = setRow(weighted)
      const wrapper = mount(IntervalSetTable, {
        ...withPrimeVue,
        props: { sets: [row], canEdit: false, weighted },
      })
      const mean = planeOfPole(stats.mean)!
      expect(cell(wrapper, 'name')).toBe('J1')
      expect(cell(wrapper, 'count')).toMatch(/^6\s+small$/) // six poles: flagged as a small sample
      expect(cell(wrapper, 'mean')).toBe(
        `${formatAngle(mean.dip)} / ${formatAzimuth(mean.dipDirection)}`,
      )
      expect(cell(wrapper, 'kappa')).toBe(formatNumber(stats.kappa, 1))
      expect(cell(wrapper, 'alpha95')).toBe(formatAngle(stats.alpha95))
      expect(cell(wrapper, 'sphericalVariance')).toBe(formatNumber(stats.sphericalVariance, 4))
      expect(Number(cell(wrapper, 'weightedCount'))).toBeCloseTo(weighted ? 12.438 : 6, 1) // Σ published weights
      expect(cell(wrapper, 'spacing')).toContain('0.41 m')
      expect(cell(wrapper, 'spacing')).toContain('moderate')
    })
  }

  it('offers rename and delete to engineers only', () => {
    const { row } = setRow(false)
    const reader = mount(IntervalSetTable, {
      ...withPrimeVue,
      props: { sets: [row], canEdit: false, weighted: false },
    })
    expect(reader.find('[aria-label="Delete J1"]').exists()).toBe(false)
    const engineer = mount(IntervalSetTable, {
      ...withPrimeVue,
      props: { sets: [row], canEdit: true, weighted: false },
    })
    expect(engineer.find('[aria-label="Delete J1"]').exists()).toBe(true)
  })
})

describe('IntervalIntersectionTable', () => {
  // Hoek & Bray (1981), Rock Slope Engineering, wedge example (published; from memory): planes
  // 45/105 and 70/235 intersect in a line plunging 31.2 toward 157.7.
  it('shows orient planeIntersection and angleBetweenPlanes for a pair of set means', () => {
    const a = { dip: 45, dipDirection: 105 }
    const b = { dip: 70, dipDirection: 235 }
    const line = planeIntersection(a, b)!
    const angle = angleBetweenPlanes(a, b)!
    const row: SetIntersection = {
      setA: 1,
      setB: 2,
      nameA: 'J1',
      nameB: 'J2',
      trend: Number(line.trend.toFixed(2)),
      plunge: Number(line.plunge.toFixed(2)),
      angle: Number(angle.toFixed(2)),
    }
    const wrapper = mount(IntervalIntersectionTable, { props: { intersections: [row] } })
    const get = (f: string) =>
      wrapper.get(`[data-testid="intersection-J1-J2"] [data-field="${f}"]`).text()
    expect(get('trend')).toBe(formatAzimuth(line.trend))
    expect(get('plunge')).toBe(formatAngle(line.plunge))
    expect(get('angle')).toBe(formatAngle(angle))
    expect(get('trend')).toBe('157.7°')
    expect(get('plunge')).toBe('31.2°')
  })

  it('says "parallel" when two means have no line of intersection', () => {
    const row: SetIntersection = {
      setA: 1,
      setB: 2,
      nameA: 'J1',
      nameB: 'J2',
      trend: null,
      plunge: null,
      angle: null,
    }
    const wrapper = mount(IntervalIntersectionTable, { props: { intersections: [row] } })
    expect(wrapper.get('[data-field="angle"]').text()).toBe('parallel')
    expect(wrapper.get('[data-field="trend"]').text()).toBe('—')
  })
})
