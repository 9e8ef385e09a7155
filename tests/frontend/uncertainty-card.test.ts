import { describe, expect, it } from 'vitest'
import { mount } from '@vue/test-utils'
import TrackStructureCard from '../../frontend/src/components/track/TrackStructureCard.vue'
import IntervalSetTable from '../../frontend/src/components/interval/IntervalSetTable.vue'
import HoleEntrySavedRow from '../../frontend/src/components/hole/HoleEntrySavedRow.vue'
import type { AnalysisSet, DepthStructure } from '../../frontend/src/api/interval-types'
import { betaText, coneText, depthText } from '../../frontend/src/logic/track/structure-uncertainty'
import { withPrimeVue } from './mount-options'
import { stored } from './hole-entry-fixtures'

// Synthetic structures as the server stores them after the Monte Carlo cone (values ours).
const structure = (fields: Partial<DepthStructure> = {}): DepthStructure => ({
  id: 31,
  depth: 42.35,
  type: 'joint',
  source: 'core',
  alpha: 84,
  beta: 120,
  dip: 12.4,
  dipDirection: 231.6,
  poleTrend: 51.6,
  polePlunge: 77.6,
  holeTrend: 40,
  holePlunge: 88,
  declinationApplied: 0,
  terzaghiWeight: 1.03,
  flags: [],
  confidence: null,
  comment: '',
  betaRotationApplied: 24.6,
  depthShiftApplied: 0,
  uncertainty95: 18.34,
  uncertaintyMajor: 21.2,
  uncertaintyMinor: 6.8,
  uncertaintyAxisTrend: 47.2,
  uncertaintyAxisPlunge: 12,
  uncertaintyReasons: ['steep-hole', 'alpha-near-90'],
  ...fields,
})

const rowsOf = (w: ReturnType<typeof mount>) =>
  Object.fromEntries(
    w.findAll('dt').map((dt, i) => [dt.text(), w.findAll('dd')[i].text()] as [string, string]),
  )

describe('TrackStructureCard uncertainty', () => {
  it('TrackStructureCard: a large cone is shown with its ellipse and reasons in words', () => {
    const w = mount(TrackStructureCard, { props: { structure: structure() } })
    const rows = rowsOf(w)
    expect(rows['Pole cone']).toBe('±18.3° (95 %)')
    // 21.2 / 6.8 = 3.1 > 1.5: the ellipse is named, its long axis by trend
    expect(w.get('[data-testid="structure-ellipse"]').text()).toBe(
      'ellipse 21.2 × 6.8°, long axis toward 047°',
    )
    const reasons = w.findAll('[data-testid="structure-cone-reasons"] li').map((li) => li.text())
    expect(reasons).toEqual([
      'near-vertical hole: the bottom-of-hole mark is poorly defined',
      'alpha near 90°: beta is barely defined',
    ])
    expect(rows['Alpha / beta']).toBe('84.0° / 120.0° (+24.6° run adjustment)')
  })

  it('TrackStructureCard compact: the cone and its reasons still show on hover', () => {
    const w = mount(TrackStructureCard, { props: { structure: structure(), compact: true } })
    expect(rowsOf(w)['Pole cone']).toBe('±18.3° (95 %)')
    expect(w.findAll('[data-testid="structure-cone-reasons"] li')).toHaveLength(2)
    expect(w.find('[data-testid="structure-ellipse"]').exists()).toBe(false)
  })

  it('TrackStructureCard: a near-round cone names no ellipse (ratio 1.4 ≤ 1.5)', () => {
    const s = structure({
      uncertainty95: 4.21,
      uncertaintyMajor: 4.9,
      uncertaintyMinor: 3.5,
      uncertaintyReasons: [],
      betaRotationApplied: null,
    })
    const w = mount(TrackStructureCard, { props: { structure: s } })
    expect(rowsOf(w)['Pole cone']).toBe('±4.2° (95 %)')
    expect(w.find('[data-testid="structure-ellipse"]').exists()).toBe(false)
    expect(w.find('[data-testid="structure-cone-reasons"]').exists()).toBe(false)
    expect(rowsOf(w)['Alpha / beta']).toBe('84.0° / 120.0°')
  })

  it('TrackStructureCard: an unoriented structure says the cone is not computed and why', () => {
    const s = structure({
      dip: null,
      dipDirection: null,
      poleTrend: null,
      polePlunge: null,
      uncertainty95: null,
      uncertaintyMajor: null,
      uncertaintyMinor: null,
      uncertaintyAxisTrend: null,
      uncertaintyAxisPlunge: null,
      uncertaintyReasons: [],
    })
    const w = mount(TrackStructureCard, { props: { structure: s } })
    expect(rowsOf(w)['Pole cone']).toBe('not computed: unoriented, so there is no pole')
  })

  it('coneText(): no hole direction, then unknown cause; unknown reason codes kept as sent', () => {
    const base = structure({ uncertainty95: null, uncertaintyReasons: [] })
    expect(coneText({ ...base, holeTrend: null }).figure).toBe(
      'not computed: no hole direction at this depth',
    )
    expect(coneText(base).figure).toBe('not computed')
    expect(coneText(structure({ uncertaintyReasons: ['no-survey', 'new-code'] })).reasons).toEqual([
      'no survey: the planned hole direction stood in',
      'new-code',
    ])
  })

  it('betaText() and depthText(): adjustments are named beside the logged values', () => {
    expect(betaText(120, -3.25)).toBe('120.0° (−3.3° run adjustment)')
    expect(betaText(120, 0)).toBe('120.0°')
    expect(betaText(null, 10)).toBe('—')
    // stored depth = logged − shift: 42.35 stored with +0.35 shift was logged at 42.70
    expect(depthText(42.35, 0.35)).toBe('42.35 m (logged 42.70 m, image shift +0.35 m)')
    expect(depthText(42.35, 0)).toBe('42.35 m')
  })
})

const set = (fields: Partial<AnalysisSet>): AnalysisSet => ({
  id: 3,
  name: 'J2',
  rule: 'cone',
  centreTrend: 50,
  centrePlunge: 70,
  coneAngle: 25,
  version: 1,
  kappa: 41.2,
  alpha95: 3.1,
  sphericalVariance: 0.0241,
  count: 48,
  weightedCount: 55.3,
  percent: 62.3,
  mean: { dip: 20.1, dipDirection: 230 },
  meanPole: { trend: 50, plunge: 69.9 },
  spacing: null,
  systematic95: 4.2,
  uncertainty95: 5.22,
  ...fields,
})

describe('IntervalSetTable uncertainty', () => {
  const cell = (w: ReturnType<typeof mount>, field: string) =>
    w.get(`[data-testid="set-row-J2"] [data-field="${field}"]`).text()

  it('IntervalSetTable: sampling, survey and combined figures under explained headers', () => {
    // combined = √(3.1² + 4.2²) = √(9.61 + 17.64) = 5.220 (derived)
    expect(Math.hypot(3.1, 4.2)).toBeCloseTo(5.22, 3)
    const w = mount(IntervalSetTable, {
      ...withPrimeVue,
      props: { sets: [set({})], canEdit: false, weighted: false },
    })
    expect(cell(w, 'alpha95')).toBe('3.1°')
    expect(cell(w, 'systematic95')).toBe('4.2°')
    expect(cell(w, 'uncertainty95')).toBe('5.2°')
    const heads = Object.fromEntries(
      w.findAll('th').map((th) => [th.text(), th.attributes('title') ?? ''] as [string, string]),
    )
    expect(heads['Sampling α95']).toMatch(/Fisher α95.*shrinks as poles are added/)
    expect(heads['Survey']).toMatch(/survey error shared by a hole's structures/)
    expect(heads['Combined']).toContain('√(α95² + survey²)')
  })

  it('IntervalSetTable: a set without a survey figure shows a dash, not zero', () => {
    const w = mount(IntervalSetTable, {
      ...withPrimeVue,
      props: {
        sets: [set({ systematic95: null, uncertainty95: null })],
        canEdit: true,
        weighted: false,
      },
    })
    expect(cell(w, 'systematic95')).toBe('—')
    expect(cell(w, 'uncertainty95')).toBe('—')
    expect(cell(w, 'alpha95')).toBe('3.1°')
  })
})

describe('HoleEntrySavedRow run adjustment', () => {
  const mountRow = (betaRotationApplied: number | null) =>
    mount(
      {
        components: { HoleEntrySavedRow },
        props: ['row'],
        template:
          '<table><tbody><HoleEntrySavedRow :row="row" :index="0" :can-edit="false" :columns="12" /></tbody></table>',
      },
      { props: { row: stored({ beta: 120, betaRotationApplied }) } },
    )

  it('HoleEntrySavedRow: the logged beta keeps its value, the run adjustment shows beside it', () => {
    const adjusted = mountRow(24.6)
    expect(adjusted.get('[data-field="betaRotation"]').text()).toBe('+24.6°')
    expect(adjusted.get('[data-field="betaRotation"]').element.parentElement!.textContent).toMatch(
      /^\s*120\s+\+24\.6°\s*$/,
    )
    expect(mountRow(0).find('[data-field="betaRotation"]').exists()).toBe(false)
    expect(mountRow(null).find('[data-field="betaRotation"]').exists()).toBe(false)
  })
})
