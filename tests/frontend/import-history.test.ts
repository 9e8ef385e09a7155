import { afterEach, describe, expect, it, vi } from 'vitest'
import { flushPromises, mount } from '@vue/test-utils'
import HoleImportsPanel from '../../frontend/src/components/hole/HoleImportsPanel.vue'
import { mockFetch } from './fetch-mock'
import { withPrimeVue } from './mount-options'

const running = {
  id: 'b2c1d0e0-0000-4000-8000-000000000002',
  kind: 'runs',
  status: 'committing',
  fileName: 'runs-2026.csv',
  rowCount: 8000,
  progress: 50,
  message: '',
  createdAt: '2026-03-02T10:00:00Z',
  committedAt: null,
}
const done = { ...running, status: 'committed', progress: 100, committedAt: '2026-03-02T10:01:00Z' }
const old = {
  ...done,
  id: 'c3d2e1f0-0000-4000-8000-000000000003',
  kind: 'survey',
  fileName: 'survey.csv',
  rowCount: 6,
}

afterEach(() => {
  vi.useRealTimers()
  vi.unstubAllGlobals()
})

describe('HoleImportsPanel', () => {
  it('lists recent imports and resumes polling one still committing, every second', async () => {
    vi.useFakeTimers()
    let polls = 0
    const calls = mockFetch((call) => {
      if (call.url.endsWith('/imports')) return { body: { data: [running, old] } }
      polls++
      return { body: { data: polls < 2 ? { ...running, progress: 80 } : done } }
    })
    const wrapper = mount(HoleImportsPanel, {
      props: { projectId: '1', holeId: '4', canEdit: false },
      ...withPrimeVue,
    })
    await flushPromises()
    const row = () => wrapper.get(`[data-testid="import-${running.id}"]`)
    expect(row().attributes('data-status')).toBe('committing')
    expect(row().find('[role="progressbar"]').attributes('aria-valuenow')).toBe('50')
    await vi.advanceTimersByTimeAsync(1000)
    expect(row().find('[role="progressbar"]').attributes('aria-valuenow')).toBe('80')
    await vi.advanceTimersByTimeAsync(1000)
    expect(row().attributes('data-status')).toBe('committed')
    expect(wrapper.emitted('changed')).toEqual([[done]])
    const polled = calls.filter((c) => c.url.endsWith(running.id))
    expect(polled).toHaveLength(2)
    await vi.advanceTimersByTimeAsync(5000)
    expect(calls.filter((c) => c.url.endsWith(running.id))).toHaveLength(2)
    expect(wrapper.get(`[data-testid="import-${old.id}"]`).text()).toContain('committed')
  })
})
