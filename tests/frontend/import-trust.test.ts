import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest'
import { flushPromises, mount } from '@vue/test-utils'
import ImportCsv from '../../frontend/src/components/imports/ImportCsv.vue'
import HoleImportsPanel from '../../frontend/src/components/hole/HoleImportsPanel.vue'
import { setCsrfToken } from '../../frontend/src/api/client'
import { mockFetch, type Call } from './fetch-mock'
import { withPrimeVue } from './mount-options'

const id = 'a6f1c2d0-0000-4000-8000-000000000001'
const record = (status: string, extra: object = {}) => ({
  id,
  kind: 'runs',
  status,
  fileName: 'runs.csv',
  rowCount: 3,
  progress: status === 'committed' ? 100 : 0,
  message: '',
  createdAt: '2026-03-02T10:00:00Z',
  committedAt: status === 'previewed' ? null : '2026-03-02T10:01:00Z',
  undoneAt: null,
  replacedCount: 2,
  ...extra,
})
const preview = (extra: object) => ({
  importId: id,
  kind: 'structures',
  fileName: 'again.csv',
  headers: ['depth', 'type', 'alpha', 'beta'],
  mapping: { depth: 'depth', type: 'type', alpha: 'alpha', beta: 'beta' },
  options: { mode: 'core' },
  rowCount: 3,
  background: false,
  sample: [],
  flagCounts: {},
  duplicateOf: null,
  intervalsReached: [],
  ...extra,
})

beforeEach(() => setCsrfToken('test-token'))
afterEach(() => vi.unstubAllGlobals())

async function previewed(reply: object) {
  const calls = mockFetch((call: Call) =>
    call.url.endsWith('/commit')
      ? { body: { data: record('committed') } }
      : { status: 201, body: { data: reply } },
  )
  const wrapper = mount(ImportCsv, {
    props: { projectId: '1', holeId: '4', kind: 'structures' },
    ...withPrimeVue,
  })
  const picker = wrapper.get<HTMLInputElement>('[data-testid="import-file"]')
  Object.defineProperty(picker.element, 'files', {
    value: [new File(['depth,type,alpha,beta\n'], 'again.csv')],
  })
  await picker.trigger('change')
  await flushPromises()
  return { wrapper, calls }
}

describe('ImportCsv — duplicate file and reviewed intervals', () => {
  it('warns of a file already committed and commits only after the confirmation, saying so', async () => {
    const { wrapper, calls } = await previewed(
      preview({
        duplicateOf: { importId: 'x', fileName: 'first.csv', committedAt: '2026-03-01T09:00:00Z' },
      }),
    )
    expect(wrapper.get('[data-testid="import-duplicate"]').text()).toContain('first.csv')
    const commit = () => wrapper.get('[data-testid="import-commit"]')
    expect(commit().attributes('disabled')).toBeDefined()
    await wrapper.get('#import-confirm-duplicate').setValue(true)
    expect(commit().attributes('disabled')).toBeUndefined()
    await commit().trigger('click')
    await flushPromises()
    expect(calls.at(-1)).toMatchObject({
      method: 'POST',
      url: `/api/projects/1/holes/4/imports/${id}/commit`,
      body: { confirmDuplicate: true },
    })
  })

  it('names an approved interval the rows reach and keeps the commit closed; a checked one is only told', async () => {
    const reached = (status: string, name: string) => ({
      id: name.length,
      name,
      fromDepth: 10,
      toDepth: 20,
      status,
    })
    const { wrapper } = await previewed(
      preview({ intervalsReached: [reached('approved', 'Upper'), reached('checked', 'Lower')] }),
    )
    expect(wrapper.get('[data-testid="import-frozen"]').text()).toContain('Upper (10–20 m)')
    expect(wrapper.get('[data-testid="import-demoted"]').text()).toContain('Lower (10–20 m)')
    expect(wrapper.get('[data-testid="import-commit"]').attributes('disabled')).toBeDefined()
  })
})

describe('HoleImportsPanel — undo', () => {
  it('asks with the row counts, then undoes the import and reloads the list', async () => {
    let undone = false
    const calls = mockFetch((call: Call) => {
      if (call.url.endsWith('/undo')) {
        undone = true
        return { body: { data: { ...record('undone'), removed: 3, restored: 2, recomputed: 0 } } }
      }
      return { body: { data: [record(undone ? 'undone' : 'committed')] } }
    })
    const wrapper = mount(HoleImportsPanel, {
      props: { projectId: '1', holeId: '4', canEdit: true },
      ...withPrimeVue,
      attachTo: document.body,
    })
    await flushPromises()
    await wrapper.get(`[data-testid="import-undo-${id}"]`).trigger('click')
    await flushPromises()
    const effect = document.querySelector('[data-testid="import-undo-effect"]')!
    expect(effect.textContent).toBe(
      'Undoing runs.csv removes the 3 core runs it added and puts back the 2 core runs it replaced.',
    )
    ;(document.querySelector('[data-testid="import-undo-confirm"]') as HTMLElement).click()
    await flushPromises()
    expect(calls.filter((c) => c.method === 'POST').map((c) => c.url)).toEqual([
      `/api/projects/1/holes/4/imports/${id}/undo`,
    ])
    expect(wrapper.get(`[data-testid="import-${id}"]`).attributes('data-status')).toBe('undone')
    expect(wrapper.find(`[data-testid="import-undo-${id}"]`).exists()).toBe(false)
    expect(wrapper.emitted('changed')).toHaveLength(1)
    wrapper.unmount()
  })

  it('offers no undo to a reader who cannot import', async () => {
    mockFetch(() => ({ body: { data: [record('committed')] } }))
    const wrapper = mount(HoleImportsPanel, {
      props: { projectId: '1', holeId: '4', canEdit: false },
      ...withPrimeVue,
    })
    await flushPromises()
    expect(wrapper.find(`[data-testid="import-undo-${id}"]`).exists()).toBe(false)
  })
})
