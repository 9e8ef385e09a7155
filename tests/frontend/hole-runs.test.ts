import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest'
import { flushPromises, mount } from '@vue/test-utils'
import PrimeVue from 'primevue/config'
import ConfirmationService from 'primevue/confirmationservice'
import HoleRunsPanel from '../../frontend/src/components/hole/HoleRunsPanel.vue'
import HoleRunsTable from '../../frontend/src/components/hole/HoleRunsTable.vue'
import {
  parseRun,
  rowFromRun,
  runSequence,
  type RunRow,
} from '../../frontend/src/logic/hole/run-rows'
import { useHoleRuns } from '../../frontend/src/composables/use-hole-runs'
import { setCsrfToken } from '../../frontend/src/api/client'
import type { Run } from '../../frontend/src/api/types'
import { runMetrics } from '../../orient/index'
import { mockFetch } from './fetch-mock'
import { withPrimeVue } from './mount-options'

const saved = (id: number, fields: Partial<Run>): Run => ({
  id,
  holeId: 4,
  fromDepth: 0,
  toDepth: 3,
  recovered: 2.85,
  solid: 2.4,
  rqdLength: 2.1,
  fractureCount: 4,
  markConfidence: 'good',
  comment: '',
  importId: null,
  version: 1,
  createdAt: '2026-01-01T00:00:00Z',
  metrics: null,
  ...fields,
})

const cellsOf = (row: RunRow, fields: Partial<RunRow['cells']>): RunRow => ({
  ...row,
  cells: { ...row.cells, ...fields },
})

beforeEach(() => setCsrfToken('test-token'))
afterEach(() => vi.unstubAllGlobals())

describe('HoleRunsTable', () => {
  it('shows TCR, SCR, RQD, fracture frequency and RQD class per run, as orient computes', () => {
    const rows = [rowFromRun(saved(1, {}))]
    const wrapper = mount(HoleRunsTable, {
      props: { rows, states: {}, readonly: false },
      ...withPrimeVue,
    })
    const row = wrapper.get('[data-testid="run-row-0"]')
    // 2.85 / 3 = 95 %, 2.4 / 3 = 80 %, 2.1 / 3 = 70 % (Deere: fair), 4 fractures / 3 m.
    expect(row.get('[data-field="tcr"]').text()).toBe('95.0')
    expect(row.get('[data-field="scr"]').text()).toBe('80.0')
    expect(row.get('[data-field="rqd"]').text()).toBe('70.0')
    expect(row.get('[data-field="frequency"]').text()).toBe('1.33')
    expect(row.get('[data-field="rqdClass"]').text()).toBe('fair')
    const m = runMetrics({
      from: 0,
      to: 3,
      recovered: 2.85,
      solid: 2.4,
      rqdLength: 2.1,
      fractures: 4,
    })
    expect(m).toMatchObject({ rqdClass: 'fair' })
    expect(m!.frequency.toFixed(2)).toBe('1.33')
  })

  it('names recovery longer than the run, overlaps and gaps', () => {
    const a = cellsOf(rowFromRun(saved(1, {})), { recovered: '3.2' })
    const b = rowFromRun(saved(2, { fromDepth: 2.5, toDepth: 5.5 }))
    const c = rowFromRun(saved(3, { fromDepth: 6, toDepth: 9 }))
    const wrapper = mount(HoleRunsTable, {
      props: { rows: [a, b, c], states: {}, readonly: false },
      ...withPrimeVue,
    })
    const messages = wrapper.findAll('.run-messages').map((m) => m.text())
    expect(messages[0]).toContain('Recovered: 3.2 m is longer than the run (3 m)')
    expect(messages[0]).toContain('This run overlaps the run 2.5–5.5 m.')
    expect(messages[1]).toContain('This run overlaps the run 0–3 m.')
    expect(wrapper.get('[data-testid="run-gap"]').text()).toBe('Gap 5.50–6.00 m: no run logged')
    // TCR above 100 % is shown as measured, never clipped.
    expect(wrapper.get('[data-testid="run-row-0"] [data-field="tcr"]').text()).toBe('106.7')
  })
})

describe('parseRun() and runSequence()', () => {
  it('builds the API body and refuses an inverted run', () => {
    const row = cellsOf(rowFromRun(saved(1, {})), { markConfidence: 'f', comment: ' spun ' })
    expect(parseRun(row).input).toEqual({
      fromDepth: 0,
      toDepth: 3,
      recovered: 2.85,
      solid: 2.4,
      rqdLength: 2.1,
      fractureCount: 4,
      markConfidence: 'fair',
      comment: 'spun',
    })
    const inverted = cellsOf(row, { toDepth: '0' })
    expect(parseRun(inverted)).toMatchObject({
      input: null,
      errors: { toDepth: 'must be deeper than From' },
    })
  })

  it('reports gaps between runs sorted by depth', () => {
    const rows = [saved(1, { fromDepth: 3, toDepth: 6 }), saved(2, {})].map(rowFromRun)
    expect(runSequence(rows)).toEqual({ overlaps: {}, gaps: [] })
    const apart = [rowFromRun(saved(1, {})), rowFromRun(saved(2, { fromDepth: 4, toDepth: 7 }))]
    expect(runSequence(apart).gaps).toEqual([{ from: 3, to: 4, afterKey: apart[0]!.key }])
  })
})

describe('HoleRunsPanel', () => {
  it('Enter on Comment saves the row (POST) and moves on to a new run; a 400 shows in place', async () => {
    let posts = 0
    const calls = mockFetch((call) => {
      if (call.method === 'GET') return { body: { data: [saved(1, {})], meta: { gaps: [] } } }
      posts++
      if (posts === 1) {
        const details = [
          { path: 'body.recovered', message: 'recovered length is longer than the run' },
        ]
        return {
          status: 400,
          body: { error: { code: 'invalid_input', message: 'Invalid run.', details } },
        }
      }
      return { status: 201, body: { data: saved(2, { fromDepth: 3, toDepth: 6, version: 1 }) } }
    })
    const runs = useHoleRuns(
      () => '1',
      () => '4',
    )
    await runs.load()
    const wrapper = mount(HoleRunsPanel, {
      props: { projectId: '1', holeId: '4', runs, canEdit: true },
      attachTo: document.body,
      global: { plugins: [[PrimeVue, { theme: 'none' }], ConfirmationService] as never[] },
    })
    await wrapper.get('[data-testid="run-add"]').trigger('click')
    const input = (field: string) =>
      wrapper.get<HTMLInputElement>(`[data-testid="run-row-1"] input[data-field="${field}"]`)
    expect(input('fromDepth').element.value).toBe('3')
    expect(input('toDepth').element.value).toBe('6')
    for (const [field, value] of [
      ['recovered', '2.9'],
      ['solid', '2.5'],
      ['rqdLength', '2.2'],
      ['fractureCount', '3'],
    ]) {
      await input(field!).setValue(value!)
    }
    await input('comment').trigger('keydown', { key: 'Enter' })
    await flushPromises()
    expect(wrapper.get('[data-testid="run-row-1"] + .run-messages').text()).toContain(
      'Recovered: recovered length is longer than the run',
    )
    await input('comment').trigger('keydown', { key: 'Enter' })
    await flushPromises()
    const post = calls.filter((c) => c.method === 'POST').at(-1)!
    expect(post.body).toEqual({
      fromDepth: 3,
      toDepth: 6,
      recovered: 2.9,
      solid: 2.5,
      rqdLength: 2.2,
      fractureCount: 3,
      markConfidence: 'good',
      comment: '',
    })
    expect(runs.runs.value.map((r) => r.id)).toEqual([1, 2])
    // On to a new run after the last: 6–9 m, its From cell focused.
    const next = wrapper.get<HTMLInputElement>(
      '[data-testid="run-row-2"] input[data-field="fromDepth"]',
    )
    expect(next.element.value).toBe('6')
    expect(document.activeElement).toBe(next.element)
    wrapper.unmount()
  })
})
