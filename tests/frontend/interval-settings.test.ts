import { describe, expect, it } from 'vitest'
import { nextTick, ref, shallowRef } from 'vue'
import { mount } from '@vue/test-utils'
import IntervalSettingsBar from '../../frontend/src/components/interval/IntervalSettingsBar.vue'
import IntervalKinematics from '../../frontend/src/components/interval/IntervalKinematics.vue'
import { analysisSearch } from '../../frontend/src/api/intervals'
import type { Analysis, AnalysisSettings, Interval } from '../../frontend/src/api/interval-types'
import { useIntervalSettings } from '../../frontend/src/composables/use-interval-settings'
import { useIntervalNet } from '../../frontend/src/composables/use-interval-net'
import InputNumber from 'primevue/inputnumber'
import { withPrimeVue } from './mount-options'

const saved: AnalysisSettings = {
  weighting: 'terzaghi',
  contourMethod: 'kamb',
  faceDip: 70,
  faceDipDirection: 190,
  frictionDeg: 30,
  lateralLimitDeg: 20,
  topplingLimitDeg: 30,
}
const interval = (version: number, settings: Partial<AnalysisSettings> = {}): Interval => ({
  id: 4,
  holeId: 7,
  domainId: null,
  domainName: null,
  name: 'upper',
  fromDepth: 5,
  toDepth: 40,
  status: 'draft',
  checkedBy: null,
  checkedAt: null,
  approvedBy: null,
  approvedAt: null,
  version,
  createdAt: '2026-01-01T00:00:00Z',
  updatedAt: '2026-01-01T00:00:00Z',
  structureCount: 9,
  ...saved,
  ...settings,
})
const bar = (props: Partial<InstanceType<typeof IntervalSettingsBar>['$props']>) =>
  mount(IntervalSettingsBar, {
    ...withPrimeVue,
    props: {
      saved,
      shown: saved,
      differences: [],
      frozen: false,
      canEdit: true,
      busy: false,
      ...props,
    },
  })

describe('IntervalSettingsBar', () => {
  it('IntervalSettingsBar shows the saved settings in one line, with no note while they are shown', () => {
    const w = bar({})
    const item = (k: string) => w.get(`[data-setting="${k}"]`).text()
    expect(item('weighting')).toContain('Terzaghi-weighted')
    expect(item('contourMethod')).toContain('Kamb')
    expect(item('face')).toContain('70.0°/190.0°')
    expect(item('frictionDeg')).toContain('30.0°')
    expect(item('lateralLimitDeg')).toContain('±20.0°')
    expect(w.find('[data-testid="settings-differ"]').exists()).toBe(false)
    expect(w.find('[data-testid="settings-locked"]').exists()).toBe(false)
  })

  it('IntervalSettingsBar with explored settings marks them, names the saved value and offers save', async () => {
    const shown = { ...saved, weighting: 'none' as const }
    const w = bar({ shown, differences: ['weighting'] })
    const item = w.get('[data-setting="weighting"]')
    expect(item.classes()).toContain('differs')
    expect(item.text()).toContain('unweighted')
    expect(item.text()).toContain('(saved Terzaghi-weighted)')
    expect(w.get('[data-testid="settings-differ"]').text()).toContain('not saved')
    await w.get('[data-testid="settings-save"]').trigger('click')
    await w.get('[data-testid="settings-reset"]').trigger('click')
    expect(w.emitted('save')).toHaveLength(1)
    expect(w.emitted('reset')).toHaveLength(1)
    const reader = bar({ shown, differences: ['weighting'], canEdit: false })
    expect(reader.find('[data-testid="settings-save"]').exists()).toBe(false)
    expect(reader.find('[data-testid="settings-reset"]').exists()).toBe(true)
  })

  it('IntervalSettingsBar on an approved interval is locked and never offers save', () => {
    const w = bar({ frozen: true, canEdit: false, shown: { ...saved, faceDip: 60 } })
    expect(w.get('[data-testid="settings-locked"]').text()).toContain('a lead must reopen')
    expect(w.find('[data-testid="settings-save"]').exists()).toBe(false)
    expect(w.find('.pi-lock').exists()).toBe(true)
  })
})

describe('useIntervalSettings()', () => {
  it('useIntervalSettings() starts from the saved settings and sends only what differs', async () => {
    const current = ref<Interval | null>(null)
    const s = useIntervalSettings(current)
    expect(s.overrides.value).toEqual({})
    current.value = interval(1, { weighting: 'none', lateralLimitDeg: 25 })
    await nextTick()
    expect(s.explore).toMatchObject({ weighting: 'none', lateralLimitDeg: 25 })
    expect(s.differences.value).toEqual([])
    s.explore.weighting = 'terzaghi'
    s.apply({ faceDip: 65 })
    expect(s.overrides.value).toEqual({ weighting: 'terzaghi', faceDip: 65 })
    // The analysis reloading (same version) keeps the trial; a new version resets it.
    current.value = interval(1, { weighting: 'none', lateralLimitDeg: 25 })
    await nextTick()
    expect(s.differences.value).toEqual(['weighting', 'faceDip'])
    current.value = interval(2, { weighting: 'terzaghi', faceDip: 65, lateralLimitDeg: 25 })
    await nextTick()
    expect(s.differences.value).toEqual([])
    s.explore.topplingLimitDeg = 40
    s.reset()
    expect(s.explore.topplingLimitDeg).toBe(30)
  })

  it('analysisSearch() → empty without overrides (the saved settings); named like the interval fields', () => {
    expect(analysisSearch({})).toBe('')
    expect(analysisSearch({ weighting: 'none', faceDip: null, lateralLimitDeg: 15 })).toBe(
      'weighting=none&lateralLimitDeg=15',
    )
    expect(analysisSearch({ types: ['joint', 'fault'], contourMethod: 'exponential' })).toBe(
      'types=joint%2Cfault&contourMethod=exponential',
    )
  })

  it('useIntervalNet() contour and weighting controls read and write the explored settings', () => {
    const current = ref<Interval | null>(interval(1, { contourMethod: 'exponential' }))
    const s = useIntervalSettings(current)
    const net = useIntervalNet(shallowRef<Analysis | null>(null), ref(undefined), s.explore)
    expect(net.method.value).toBe('exponential')
    expect(net.weighted.value).toBe(true)
    expect(net.contours.value).toMatchObject({ method: 'exponential', weighted: true })
    net.weighted.value = false
    expect(s.overrides.value).toEqual({ weighting: 'none' })
    // Hiding the contours is a display choice: the contour setting stays as it was.
    net.method.value = 'none'
    expect(net.contours.value).toBeNull()
    expect(s.explore.contourMethod).toBe('exponential')
    net.method.value = 'kamb'
    expect(s.overrides.value).toEqual({ weighting: 'none', contourMethod: 'kamb' })
  })
})

describe('IntervalKinematics', () => {
  it('IntervalKinematics Run check → emits the face, friction and limits to try (any role)', async () => {
    const w = mount(IntervalKinematics, {
      ...withPrimeVue,
      props: {
        settings: { ...saved, faceDip: null, faceDipDirection: null, frictionDeg: null },
        kinematics: null,
        sets: [],
        oriented: 0,
        busy: false,
        zone: 'planar',
      },
    })
    const run = w.get('[data-testid="kinematic-run"]')
    expect(run.attributes('disabled')).toBeDefined()
    await w.setProps({ settings: saved })
    expect(run.attributes('disabled')).toBeDefined() // nothing changed yet
    const lateral = w.findAllComponents(InputNumber).find((c) => c.props('inputId') === 'lateral')!
    lateral.vm.$emit('update:modelValue', 15)
    await nextTick()
    expect(run.attributes('disabled')).toBeUndefined()
    await w.get('form').trigger('submit')
    expect(w.emitted('apply')).toEqual([
      [
        {
          faceDip: 70,
          faceDipDirection: 190,
          frictionDeg: 30,
          lateralLimitDeg: 15,
          topplingLimitDeg: 30,
        },
      ],
    ])
  })
})
