import { describe, expect, it, vi } from 'vitest'
import { flushPromises, mount } from '@vue/test-utils'
import ProjectSettingsEditor from '../../frontend/src/components/project/ProjectSettingsEditor.vue'
import { ApiError } from '../../frontend/src/api/client'
import type { Project, ProjectUpdate } from '../../frontend/src/api/types'
import { withPrimeVue } from './mount-options'

const project: Project = {
  id: 1,
  code: 'GSQ',
  name: 'Greyscar Quarry extension',
  crsEpsg: 27700,
  declinationMode: 'manual',
  declinationDeg: -1.35,
  convergenceMode: 'manual',
  gridConvergenceDeg: 0.42,
  referenceLine: 'bottom',
  steepThresholdDeg: 85,
  betaJumpDeg: 60,
  netProjection: 'equal-area',
  fourEyes: true,
  errorModel: {},
  version: 4,
  createdAt: '2025-01-01T00:00:00Z',
  updatedAt: '2025-01-01T00:00:00Z',
}

describe('ProjectSettingsEditor', () => {
  it('saves every setting with the version it was loaded at', async () => {
    const save = vi.fn(async (_update: ProjectUpdate) => {})
    const wrapper = mount(ProjectSettingsEditor, {
      props: { project, save, reload: vi.fn() },
      ...withPrimeVue,
    })
    await wrapper.get('#settings-name').setValue('Greyscar north wall')
    await wrapper.get('form').trigger('submit')
    await flushPromises()
    expect(save).toHaveBeenCalledWith({
      version: 4,
      name: 'Greyscar north wall',
      crsEpsg: 27700,
      declinationMode: 'manual',
      declinationDeg: -1.35,
      convergenceMode: 'manual',
      gridConvergenceDeg: 0.42,
      referenceLine: 'bottom',
      steepThresholdDeg: 85,
      netProjection: 'equal-area',
      fourEyes: true,
    })
  })

  it('on 409 offers to reload the latest settings', async () => {
    const save = vi.fn(async () => {
      throw new ApiError(409, 'stale_version', 'Changed since you loaded it')
    })
    const latest = { ...project, name: 'Renamed elsewhere', version: 5 }
    const wrapper = mount(ProjectSettingsEditor, {
      props: { project, save, reload: vi.fn() },
      ...withPrimeVue,
    })
    const reload = vi.fn(async () => {
      await wrapper.setProps({ project: latest })
    })
    await wrapper.setProps({ reload })
    await wrapper.get('#settings-name').setValue('My edit')
    await wrapper.get('form').trigger('submit')
    await flushPromises()
    expect(wrapper.find('[data-testid="settings-stale"]').exists()).toBe(true)

    await wrapper.get('[data-testid="settings-stale"] button').trigger('click')
    await flushPromises()
    expect(reload).toHaveBeenCalledTimes(1)
    expect(wrapper.find('[data-testid="settings-stale"]').exists()).toBe(false)
    expect((wrapper.get('#settings-name').element as HTMLInputElement).value).toBe(
      'Renamed elsewhere',
    )
    expect(wrapper.text()).toContain('Version 5')
  })
})
