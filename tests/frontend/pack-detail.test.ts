import { afterEach, describe, expect, it, vi } from 'vitest'
import { defineComponent, h } from 'vue'
import { flushPromises, mount } from '@vue/test-utils'
import PacksDetail from '../../frontend/src/components/packs/PacksDetail.vue'
import { usePacks } from '../../frontend/src/composables/use-packs'
import { usePackDetail } from '../../frontend/src/composables/use-pack-detail'
import type { PackDetail } from '../../frontend/src/api/packs'
import { setCsrfToken } from '../../frontend/src/api/client'
import { mockFetch } from './fetch-mock'
import { withPrimeVue } from './mount-options'

const pack: PackDetail = {
  id: '4234f911-1c8c-47e3-b10d-ced7ee38f595',
  projectId: 1,
  status: 'ready',
  draft: false,
  selection: {},
  progress: 100,
  message: 'Ready: 2 files',
  inputsHash: 'a'.repeat(64),
  contentHash: null,
  createdAt: '2026-12-01T10:00:00Z',
  createdBy: 2,
  createdByName: 'Lead Greyscar',
  issuedAt: null,
  issuedBy: null,
  issuedByName: null,
  files: [
    { name: 'report.pdf', mime: 'application/pdf', size: 21532, sha256: 'b'.repeat(64) },
    { name: 'sets.csv', mime: 'text/csv', size: 512, sha256: 'c'.repeat(64) },
  ],
  intervals: [{ id: 11, holeId: 7, holeName: 'GSQ-BH01', name: 'upper', status: 'approved' }],
}

afterEach(() => {
  vi.unstubAllGlobals()
  vi.useRealTimers()
})

describe('PacksDetail', () => {
  it('PacksDetail lists files with sizes and download links for those who may download', () => {
    const wrapper = mount(PacksDetail, {
      props: { projectId: '1', pack, isLead: false, canDownload: true, busy: false },
      ...withPrimeVue,
    })
    const rows = wrapper.findAll('tbody tr').map((r) => r.text())
    expect(rows[0]).toContain('report.pdf')
    expect(rows[0]).toContain('21.0 kB')
    expect(rows[1]).toContain('512 B')
    expect(wrapper.get('a[download="sets.csv"]').attributes('href')).toBe(
      `/api/projects/1/packs/${pack.id}/files/sets.csv`,
    )
    expect(wrapper.find('[data-testid="pack-issue"]').exists()).toBe(false)
  })

  it('PacksDetail without download rights shows names only and says why', () => {
    const wrapper = mount(PacksDetail, {
      props: { projectId: '1', pack, isLead: false, canDownload: false, busy: false },
      ...withPrimeVue,
    })
    expect(wrapper.find('a[download]').exists()).toBe(false)
    expect(wrapper.text()).toContain('once the pack is issued')
  })

  it('PacksDetail issue asks first (freezes, marks intervals issued), then emits issue', async () => {
    const wrapper = mount(PacksDetail, {
      props: { projectId: '1', pack, isLead: true, canDownload: true, busy: false },
      attachTo: document.body,
      ...withPrimeVue,
    })
    await wrapper.get('[data-testid="pack-issue"]').trigger('click')
    await flushPromises()
    expect(document.body.textContent).toContain('freezes the pack')
    expect(document.body.textContent).toContain('marked issued')
    expect(wrapper.emitted('issue')).toBeUndefined()
    ;(document.querySelector('[data-testid="pack-issue-confirm"]') as HTMLElement).click()
    await flushPromises()
    expect(wrapper.emitted('issue')).toHaveLength(1)
    wrapper.unmount()
  })
})

describe('PacksDetail of a pack that cannot be issued', () => {
  it('PacksDetail of a draft pack → DRAFT tag, no Issue button, the reason in words', () => {
    const draft: PackDetail = {
      ...pack,
      draft: true,
      message: 'Draft preview: 2 files',
      intervals: [
        ...pack.intervals,
        { id: 12, holeId: 7, holeName: 'GSQ-BH01', name: 'lower', status: 'checked' },
      ],
    }
    const wrapper = mount(PacksDetail, {
      props: { projectId: '1', pack: draft, isLead: true, canDownload: true, busy: false },
      ...withPrimeVue,
    })
    expect(wrapper.get('[data-testid="pack-draft-tag"]').text()).toBe('DRAFT — not for design')
    expect(wrapper.find('[data-testid="pack-issue"]').exists()).toBe(false)
    expect(wrapper.get('[data-testid="pack-issue-blocked"]').text()).toContain('draft pack')
    expect(wrapper.get('[data-testid="pack-intervals"]').text()).toContain('lower · checked')
  })

  it('PacksDetail of a ready pack whose interval was reopened → no Issue button, names it', () => {
    const reopened: PackDetail = {
      ...pack,
      intervals: [{ ...pack.intervals[0], status: 'draft' }],
    }
    const wrapper = mount(PacksDetail, {
      props: { projectId: '1', pack: reopened, isLead: true, canDownload: true, busy: false },
      ...withPrimeVue,
    })
    expect(wrapper.find('[data-testid="pack-draft-tag"]').exists()).toBe(false)
    expect(wrapper.find('[data-testid="pack-issue"]').exists()).toBe(false)
    expect(wrapper.get('[data-testid="pack-issue-blocked"]').text()).toBe(
      'Not issuable: GSQ-BH01 upper is draft.',
    )
  })
})

describe('usePacks()', () => {
  it('usePacks() polls every second while a pack builds and stops when it is ready', async () => {
    vi.useFakeTimers()
    setCsrfToken('t')
    let progress = 40
    const calls = mockFetch(() => {
      const status = progress >= 100 ? 'ready' : 'building'
      return { body: { data: [{ ...pack, status, progress, files: undefined }] } }
    })
    let state: ReturnType<typeof usePacks> | undefined
    const Host = defineComponent({
      setup() {
        state = usePacks(() => '1')
        return () => h('div')
      },
    })
    mount(Host)
    await state!.refresh()
    expect(state!.building.value).toBe(true)
    const before = calls.length
    await vi.advanceTimersByTimeAsync(1000)
    expect(calls.length).toBe(before + 1)
    progress = 100
    await vi.advanceTimersByTimeAsync(1000)
    expect(state!.packs.value[0].status).toBe('ready')
    const settled = calls.length
    await vi.advanceTimersByTimeAsync(3000)
    expect(calls.length).toBe(settled)
  })
})

describe('usePackDetail()', () => {
  it('usePackDetail() fileUrl → the file route with the name encoded; issueBlocked null when all approved', () => {
    const d = usePackDetail(
      () => '1',
      () => pack,
    )
    expect(d.fileUrl('net upper.svg')).toBe(
      `/api/projects/1/packs/${pack.id}/files/net%20upper.svg`,
    )
    expect(d.issueBlocked.value).toBeNull()
  })
})
