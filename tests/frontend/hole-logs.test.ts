import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest'
import { flushPromises, mount } from '@vue/test-utils'
import HoleLogsPanel from '../../frontend/src/components/hole/HoleLogsPanel.vue'
import { useHoleLogs } from '../../frontend/src/composables/use-hole-logs'
import type { LasPreview, StoredCurve } from '../../frontend/src/api/logs'
import { setCsrfToken } from '../../frontend/src/api/client'
import { mockFetch } from './fetch-mock'
import { withPrimeVue } from './mount-options'

const logs = '/api/projects/1/holes/2/logs'
const preview: LasPreview = {
  importId: 'imp-1',
  fileName: 'GSQ-BH01.las',
  version: '2.0',
  wrap: false,
  depthUnit: 'M',
  curves: [
    { mnemonic: 'GR', unit: 'GAPI', description: 'Gamma ray', nullCount: 0, min: 12, max: 140 },
    { mnemonic: 'DEN', unit: 'G/C3', description: 'Density', nullCount: 3, min: 2.1, max: 2.7 },
  ],
  depthRange: { from: 2, to: 118.5 },
  step: 0.1,
  sampleCount: 1166,
  problems: [],
  wellNameMatchesHole: true,
  deviation: null,
  dataSets: [],
}
const stored: StoredCurve = {
  id: 31,
  mnemonic: 'GR',
  unit: 'GAPI',
  description: 'Gamma ray',
  sourceFile: 'GSQ-BH01.las',
  depthShift: 0.35,
  minDepth: 2.35,
  maxDepth: 118.85,
  sampleCount: 1166,
  importId: 'imp-1',
}
const file = () => new File(['~VERSION INFORMATION\n'], 'GSQ-BH01.las', { type: 'text/plain' })

beforeEach(() => setCsrfToken('t'))
afterEach(() => vi.unstubAllGlobals())

describe('useHoleLogs()', () => {
  it('useHoleLogs() read → a preview with every curve kept; commit sends the shift and the kept curves, then relists', async () => {
    const calls = mockFetch((call) => {
      if (call.url === logs && call.method === 'POST') return { body: { data: preview } }
      if (call.url.endsWith('/commit')) return { body: { data: { curves: [{ id: 31 }] } } }
      return { body: { data: [stored] } }
    })
    const state = useHoleLogs(
      () => '1',
      () => '2',
    )
    await state.read(file())
    expect(state.preview.value?.fileName).toBe('GSQ-BH01.las')
    expect(state.chosen.value).toEqual(['GR', 'DEN'])
    state.chosen.value = ['GR']
    state.depthShift.value = 0.35
    await state.commit()
    const commit = calls.find((c) => c.url.endsWith('/commit'))!
    expect(commit.url).toBe(`${logs}/imports/imp-1/commit`)
    expect(commit.body).toEqual({ depthShift: 0.35, curves: ['GR'] })
    expect(state.preview.value).toBeNull()
    expect(state.curves.value).toEqual([stored])
    expect(state.fileUrl('imp-1')).toBe(`${logs}/imports/imp-1/file`)
  })

  it('useHoleLogs() read refused with 400 → the message, each line problem, and no preview', async () => {
    mockFetch(() => ({
      status: 400,
      body: {
        error: {
          code: 'invalid_las',
          message: 'The file is not LAS.',
          details: [{ path: 'file.line.3', message: 'no ~A section' }],
        },
      },
    }))
    const state = useHoleLogs(
      () => '1',
      () => '2',
    )
    await state.read(file())
    expect(state.preview.value).toBeNull()
    expect(state.error.value).toBe('The file is not LAS. file.line.3: no ~A section')
    expect(state.problems.value).toEqual([{ path: 'file.line.3', message: 'no ~A section' }])
    expect(state.busy.value).toBe(false)
  })
})

describe('HoleLogsPanel', () => {
  it('HoleLogsPanel lists the stored curves with a link to the original file', async () => {
    const calls = mockFetch(() => ({ body: { data: [stored] } }))
    const wrapper = mount(HoleLogsPanel, {
      props: { projectId: '1', holeId: '2', canEdit: false },
      ...withPrimeVue,
    })
    await flushPromises()
    expect(calls.map((c) => `${c.method} ${c.url}`)).toEqual([`GET ${logs}`])
    const row = wrapper.get('[data-testid="las-curves"] tbody tr')
    expect(row.text()).toContain('2.35 m')
    expect(row.text()).toContain('0.350 m')
    expect(row.get('a').attributes('href')).toBe(`${logs}/imports/imp-1/file`)
    expect(wrapper.find('[data-testid="las-file"]').exists()).toBe(false)
  })
})
