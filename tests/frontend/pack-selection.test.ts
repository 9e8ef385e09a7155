import { afterEach, describe, expect, it, vi } from 'vitest'
import { flushPromises, mount } from '@vue/test-utils'
import PacksSelection from '../../frontend/src/components/packs/PacksSelection.vue'
import PacksTable from '../../frontend/src/components/packs/PacksTable.vue'
import type { PackSummary } from '../../frontend/src/api/packs'
import { usePackSelection } from '../../frontend/src/composables/use-pack-selection'
import type { Hole } from '../../frontend/src/api/types'
import { mockFetch } from './fetch-mock'
import { withPrimeVue } from './mount-options'

const hole = { id: 7, name: 'GSQ-BH01' } as Hole
const interval = (
  id: number,
  name: string,
  fromDepth: number,
  toDepth: number,
  status = 'approved',
) => ({
  id,
  holeId: 7,
  name,
  fromDepth,
  toDepth,
  status,
})

afterEach(() => vi.unstubAllGlobals())

describe('PacksSelection', () => {
  it('PacksSelection whole project by default → emits build with an empty selection', async () => {
    mockFetch(() => ({ body: { data: [] } }))
    const wrapper = mount(PacksSelection, {
      props: { projectId: '1', holes: [hole], busy: false },
      ...withPrimeVue,
    })
    await flushPromises()
    await wrapper.get('[data-testid="pack-build"]').trigger('click')
    expect(wrapper.emitted('build')).toEqual([[{}]])
  })

  it('PacksSelection lists each hole’s intervals and emits the chosen interval ids', async () => {
    const calls = mockFetch(() => ({
      body: { data: [interval(11, 'upper', 0, 40), interval(12, 'lower', 40, 90)] },
    }))
    const wrapper = mount(PacksSelection, {
      props: { projectId: '1', holes: [hole], busy: false },
      ...withPrimeVue,
    })
    await flushPromises()
    expect(calls[0].url).toBe('/api/projects/1/holes/7/intervals')
    await wrapper.get('#pack-whole').setValue(false)
    expect(wrapper.text()).toContain('upper')
    expect(wrapper.text()).toContain('40–90 m')
    expect(wrapper.get('[data-testid="pack-build"]').attributes('disabled')).toBeDefined()
    await wrapper.get('#pack-interval-12').setValue(true)
    await wrapper.get('[data-testid="pack-build"]').trigger('click')
    expect(wrapper.emitted('build')).toEqual([[{ holeIds: [], intervalIds: [12] }]])
  })
})

describe('PacksSelection with intervals not approved', () => {
  it('PacksSelection warns that a selection holding a checked interval builds a draft', async () => {
    mockFetch(() => ({
      body: { data: [interval(11, 'upper', 0, 40), interval(12, 'lower', 40, 90, 'checked')] },
    }))
    const wrapper = mount(PacksSelection, {
      props: { projectId: '1', holes: [hole], busy: false },
      ...withPrimeVue,
    })
    await flushPromises()
    // The whole project holds the checked interval.
    expect(wrapper.get('[data-testid="pack-draft-note"]').text()).toContain(
      'Not approved: GSQ-BH01 lower (checked)',
    )
    await wrapper.get('#pack-whole').setValue(false)
    await wrapper.get('#pack-interval-11').setValue(true)
    expect(wrapper.find('[data-testid="pack-draft-note"]').exists()).toBe(false)
    await wrapper.get('#pack-interval-12').setValue(true)
    expect(wrapper.get('[data-testid="pack-draft-note"]').text()).toContain(
      'DRAFT — not for design',
    )
  })
})

describe('PacksTable', () => {
  it('PacksTable shows progress for a building pack and who issued an issued one', () => {
    const base: PackSummary = {
      id: 'a',
      projectId: 1,
      status: 'building',
      draft: false,
      selection: {},
      progress: 40,
      message: 'Writing files',
      inputsHash: null,
      contentHash: null,
      createdAt: '2026-12-01T10:00:00Z',
      createdBy: 2,
      createdByName: 'Lead Greyscar',
      issuedAt: null,
      issuedBy: null,
      issuedByName: null,
    }
    const issued = { ...base, id: 'b', status: 'issued' as const, progress: 100 }
    issued.issuedAt = '2026-12-02T10:00:00Z'
    issued.issuedByName = 'Lead Greyscar'
    const wrapper = mount(PacksTable, {
      props: { packs: [base, issued], selectedId: null },
      ...withPrimeVue,
    })
    const rows = wrapper.findAll('tbody tr')
    expect(rows[0].find('[role="progressbar"]').attributes('aria-valuenow')).toBe('40')
    expect(rows[1].text()).toContain('issued')
    expect(rows[1].text()).toContain('Lead Greyscar ·')
    expect(rows[0].find('[data-testid="pack-row-draft"]').exists()).toBe(false)
  })

  it('PacksTable tags a draft pack DRAFT', () => {
    const wrapper = mount(PacksTable, {
      props: {
        packs: [
          {
            id: 'c',
            projectId: 1,
            status: 'ready',
            draft: true,
            selection: {},
            progress: 100,
            message: 'Draft preview: 9 files',
            inputsHash: null,
            contentHash: null,
            createdAt: '2026-12-01T10:00:00Z',
            createdBy: 2,
            createdByName: 'Lead Greyscar',
            issuedAt: null,
            issuedBy: null,
            issuedByName: null,
          },
        ],
        selectedId: null,
      },
      ...withPrimeVue,
    })
    expect(wrapper.get('[data-testid="pack-row-draft"]').text()).toBe('DRAFT')
  })
})

describe('usePackSelection()', () => {
  it('usePackSelection() a whole hole packs its every interval; naming one interval narrows it', async () => {
    mockFetch(() => ({
      body: { data: [interval(11, 'upper', 0, 40), interval(12, 'lower', 40, 90, 'draft')] },
    }))
    const s = usePackSelection(
      () => '1',
      () => [hole],
    )
    await flushPromises()
    s.whole.value = false
    expect(s.empty.value).toBe(true)
    s.holeIds.value = [7]
    expect(s.selection.value).toEqual({ holeIds: [7], intervalIds: [] })
    expect(s.unapproved.value).toEqual(['GSQ-BH01 lower (draft)'])
    s.intervalIds.value = [11]
    expect(s.unapproved.value).toEqual([])
  })
})
