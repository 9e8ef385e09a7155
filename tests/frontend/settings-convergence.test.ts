import { describe, expect, it, vi } from 'vitest'
import { flushPromises, mount } from '@vue/test-utils'
import ProjectSettingsEditor from '../../frontend/src/components/project/ProjectSettingsEditor.vue'
import ProjectSettingsSummary from '../../frontend/src/components/project/ProjectSettingsSummary.vue'
import { ApiError } from '../../frontend/src/api/client'
import type { Project, ProjectUpdate } from '../../frontend/src/api/types'
import { withPrimeVue } from './mount-options'

const project: Project = {
  id: 1,
  code: 'GSQ',
  name: 'Greyscar Quarry extension',
  crsEpsg: 32630,
  declinationMode: 'auto',
  declinationDeg: 0,
  convergenceMode: 'auto',
  gridConvergenceDeg: 0.16,
  collarConvergence: [
    { holeId: 1, name: 'GSQ-BH01', convergenceDeg: 0.1546, source: 'crs' },
    { holeId: 2, name: 'GSQ-BH06', convergenceDeg: 0.1612, source: 'crs' },
  ],
  referenceLine: 'bottom',
  steepThresholdDeg: 85,
  betaJumpDeg: 60,
  netProjection: 'equal-area',
  fourEyes: true,
  errorModel: {},
  version: 4,
  createdAt: '2026-01-01T00:00:00Z',
  updatedAt: '2026-01-01T00:00:00Z',
}

describe('ProjectSettingsSummary — grid convergence', () => {
  it('shows the range the CRS gives over the collars, or the manual value', async () => {
    const wrapper = mount(ProjectSettingsSummary, { props: { project } })
    expect(wrapper.get('[data-testid="setting-convergence"]').text()).toBe(
      'From EPSG:32630: 0.155° E to 0.161° E at the collars',
    )
    await wrapper.setProps({ project: { ...project, convergenceMode: 'manual' } })
    expect(wrapper.get('[data-testid="setting-convergence"]').text()).toBe('Manual, 0.160° E')
  })
})

describe('ProjectSettingsEditor — grid convergence', () => {
  it('lists the value at each collar, types a manual value only in manual mode, and sends the mode', async () => {
    const save = vi.fn(async (_update: ProjectUpdate) => {})
    const wrapper = mount(ProjectSettingsEditor, {
      props: { project, save, reload: vi.fn() },
      ...withPrimeVue,
    })
    expect(wrapper.get('[data-testid="settings-collar-convergence"]').text()).toContain(
      'GSQ-BH01 0.155° E · GSQ-BH06 0.161° E',
    )
    expect(wrapper.get('#settings-convergence').attributes('disabled')).toBeDefined()
    const manual = wrapper.findAll('[aria-label="Grid convergence mode"] button')[1]!
    await manual.trigger('click')
    expect(wrapper.get('#settings-convergence').attributes('disabled')).toBeUndefined()
    await wrapper.get('form').trigger('submit')
    await flushPromises()
    expect(save.mock.calls[0]![0]).toMatchObject({ version: 4, convergenceMode: 'manual' })
  })

  it('shows why a recompute was refused (409 interval_approved) instead of offering a reload', async () => {
    const save = vi.fn(async () => {
      throw new ApiError(
        409,
        'interval_approved',
        'Changing the project\'s declination or convergence (hole GSQ-BH01) would change the approved interval "Upper" (10–40 m): a lead must reopen it first.',
      )
    })
    const wrapper = mount(ProjectSettingsEditor, {
      props: { project, save, reload: vi.fn() },
      ...withPrimeVue,
    })
    await wrapper.get('#settings-name').setValue('Renamed')
    await wrapper.get('form').trigger('submit')
    await flushPromises()
    expect(wrapper.find('[data-testid="settings-stale"]').exists()).toBe(false)
    expect(wrapper.text()).toContain('approved interval "Upper" (10–40 m)')
  })
})
