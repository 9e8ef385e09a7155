import { beforeEach, describe, expect, it, vi } from 'vitest'
import { flushPromises, mount } from '@vue/test-utils'
import { createPinia, setActivePinia, type Pinia } from 'pinia'
import PrimeVue from 'primevue/config'
import IntervalReviewBar from '../../frontend/src/components/review/IntervalReviewBar.vue'
import ProjectSettingsEditor from '../../frontend/src/components/project/ProjectSettingsEditor.vue'
import ProjectSettingsSummary from '../../frontend/src/components/project/ProjectSettingsSummary.vue'
import { useAuthStore } from '../../frontend/src/stores/auth'
import type { Project, ProjectUpdate } from '../../frontend/src/api/types'
import { withPrimeVue } from './mount-options'

let pinia: Pinia
const lead = { id: 3, email: 'lead@greyscar.test', name: 'Lin Lead', isAdmin: false }
const interval = { id: 11, name: 'upper', status: 'checked' as const, version: 4, checkedBy: 3 }

beforeEach(() => {
  pinia = createPinia()
  setActivePinia(pinia)
  useAuthStore().user = lead
})

const bar = (props: Record<string, unknown>) =>
  mount(IntervalReviewBar, {
    props: { projectId: '1', holeId: '2', interval, role: 'lead', ...props },
    global: { plugins: [pinia, [PrimeVue, { theme: 'none' }]] as never[] },
  })
const approve = (w: ReturnType<typeof bar>) =>
  w.get('[data-testid="review-approve"]').element as HTMLButtonElement

describe('IntervalReviewBar four eyes', () => {
  it('IntervalReviewBar: the lead who checked sees Approve disabled and why', () => {
    const w = bar({ fourEyes: true })
    expect(approve(w).disabled).toBe(true)
    expect(w.get('[data-testid="review-own-check"]').text()).toBe(
      'You checked this interval, so another lead must approve it.',
    )
    expect(w.get('[data-testid="review-four-eyes"]').text()).toBe(
      'Four-eyes rule: approver ≠ checker',
    )
  })

  it('IntervalReviewBar: another lead may approve; with the rule off the checker may too', () => {
    const other = bar({ interval: { ...interval, checkedBy: 9 } })
    expect(approve(other).disabled).toBe(false)
    expect(other.find('[data-testid="review-own-check"]').exists()).toBe(false)
    const off = bar({ fourEyes: false })
    expect(approve(off).disabled).toBe(false)
    expect(off.get('[data-testid="review-four-eyes"]').text()).toBe(
      'Four-eyes rule off for this project',
    )
  })
})

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

describe('ProjectSettingsEditor four eyes', () => {
  it('ProjectSettingsEditor: turning the four-eyes switch off saves fourEyes false', async () => {
    const save = vi.fn(async (_update: ProjectUpdate) => {})
    const w = mount(ProjectSettingsEditor, {
      props: { project, save, reload: vi.fn() },
      ...withPrimeVue,
    })
    await w.get('#settings-four-eyes').setValue(false)
    await w.get('form').trigger('submit')
    await flushPromises()
    expect(save).toHaveBeenCalledWith(expect.objectContaining({ version: 4, fourEyes: false }))
  })

  it('ProjectSettingsSummary shows the four-eyes rule', () => {
    const on = mount(ProjectSettingsSummary, { props: { project } })
    expect(on.get('[data-testid="setting-four-eyes"]').text()).toBe('On: approver ≠ checker')
    const off = mount(ProjectSettingsSummary, {
      props: { project: { ...project, fourEyes: false } },
    })
    expect(off.get('[data-testid="setting-four-eyes"]').text()).toBe('Off: a checker may approve')
  })
})
