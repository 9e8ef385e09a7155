import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest'
import { flushPromises, mount, type VueWrapper } from '@vue/test-utils'
import PrimeVue from 'primevue/config'
import ConfirmationService from 'primevue/confirmationservice'
import HoleEntryPanel from '../../frontend/src/components/hole/HoleEntryPanel.vue'
import { setCsrfToken } from '../../frontend/src/api/client'
import type { Structure, StructureInput } from '../../frontend/src/api/types'
import { hole, project, run, station, stored } from './hole-entry-fixtures'

type Reply = { status: number; body?: unknown } | 'network'
interface Held {
  body: StructureInput
  key: string | undefined
  answer: (reply: Reply) => void
}

let wrapper: VueWrapper | undefined

/**
 * A server that lists `list` at once and holds every POST until the test answers it, so the
 * test decides when each save lands while the logger types on.
 */
async function mountHeld(list: Structure[] = []) {
  const held: Held[] = []
  const gets: string[] = []
  const reply = (status: number, body: unknown) =>
    new Response(body === undefined ? null : JSON.stringify(body), {
      status,
      headers: { 'Content-Type': 'application/json' },
    })
  vi.stubGlobal(
    'fetch',
    vi.fn(async (input: RequestInfo | URL, init: RequestInit = {}) => {
      if ((init.method ?? 'GET') === 'GET') {
        gets.push(String(input))
        return reply(200, { data: [...list], meta: {} })
      }
      const body = JSON.parse(String(init.body)) as StructureInput
      const key = (init.headers as Record<string, string> | undefined)?.['Idempotency-Key']
      const r = await new Promise<Reply>((answer) => held.push({ body, key, answer }))
      if (r === 'network') throw new TypeError('Failed to fetch')
      if (r.status === 201) list.push((r.body as { data: Structure }).data)
      return reply(r.status, r.body)
    }),
  )
  wrapper = mount(HoleEntryPanel, {
    props: {
      projectId: '1',
      holeId: '4',
      project,
      hole,
      stations: [station(0), station(100)],
      runs: [run],
      canEdit: true,
    },
    attachTo: document.body,
    global: { plugins: [[PrimeVue, { theme: 'none' }], ConfirmationService] as never[] },
  })
  await flushPromises()
  let nextId = 501
  return {
    gets,
    posted: () => held.map((h) => h.body.depth),
    bodies: () => held.map((h) => h.body),
    keys: () => held.map((h) => h.key),
    /** Answers the i-th POST: 201 with the row as the server stores it, or the reply given. */
    async answer(i: number, r?: Reply) {
      const { body, answer } = held[i]!
      if (r) answer(r)
      else
        answer({
          status: 201,
          body: {
            data: stored({
              ...body,
              type: body.type as Structure['type'],
              id: nextId++,
              beta: body.beta ?? null,
            }),
          },
        })
      await flushPromises()
    },
  }
}

const entryInput = (field: string, row = 'entry-row') =>
  wrapper!.get<HTMLInputElement>(`[data-testid="${row}"] input[data-field="${field}"]`)
const focused = () => (document.activeElement as HTMLElement | null)?.dataset.field
const pendingRows = () =>
  wrapper!
    .findAll('[data-testid="entry-pending"]')
    .map((r) => [r.attributes('data-depth'), r.attributes('data-status')])
const notes = (row = 'entry-row') =>
  wrapper!
    .findAll(`[data-testid="${row}"] ~ .notes-row [data-testid="entry-note"]`)
    .map((n) => n.text())

/** Fills the new row's cells as typed and commits it with Ctrl+Enter from the alpha cell. */
async function commit(cells: { depth?: string; type: string; alpha: string; beta?: string }) {
  if (cells.depth !== undefined) await entryInput('depth').setValue(cells.depth)
  await entryInput('type').setValue(cells.type)
  await entryInput('alpha').setValue(cells.alpha)
  if (cells.beta !== undefined) await entryInput('beta').setValue(cells.beta)
  await entryInput('alpha').trigger('keydown', { key: 'Enter', ctrlKey: true })
  await flushPromises()
}

beforeEach(() => {
  setCsrfToken('test-token')
  localStorage.clear()
})

afterEach(() => {
  wrapper?.unmount()
  wrapper = undefined
  vi.unstubAllGlobals()
})

describe('HoleEntryPanel: typing ahead of the save queue', () => {
  it('commitNew() while a save is in flight: one POST at a time, in order, typed depths kept', async () => {
    const server = await mountHeld()
    await commit({ depth: '12.3', type: 'jt', alpha: '60', beta: '90' })
    // The next row opens at once, one default step (0.10 m) deeper, with the keyboard on its depth.
    expect(pendingRows()).toEqual([['12.3', 'saving']])
    expect(entryInput('depth').element.value).toBe('12.4')
    expect(focused()).toBe('depth')

    await commit({ depth: '13.05', type: 'bd', alpha: '20' })
    expect(server.posted()).toEqual([12.3])
    expect(pendingRows()).toEqual([
      ['12.3', 'saving'],
      ['13.05', 'queued'],
    ])
    // Suggested from the step between the two rows just committed: 13.05 + 0.75.
    expect(entryInput('depth').element.value).toBe('13.8')
    await entryInput('depth').setValue('14.2')

    await server.answer(0)
    expect(wrapper!.find('[data-testid="structure-501"]').exists()).toBe(true)
    expect(pendingRows()).toEqual([['13.05', 'saving']])
    expect(server.posted()).toEqual([12.3, 13.05])
    expect(entryInput('depth').element.value).toBe('14.2')
    const listed = server.gets.length

    await server.answer(1)
    expect(wrapper!.find('[data-testid="structure-502"]').exists()).toBe(true)
    expect(pendingRows()).toEqual([])
    expect(entryInput('depth').element.value).toBe('14.2')
    // The list is fetched once, after the queue ran dry, not after every row.
    expect(server.gets.length).toBe(listed + 1)
  })

  it('Refresh → a new deepest row moves the suggested depth only while the cell is untouched', async () => {
    const list = [stored({ id: 3, depth: 20 })]
    await mountHeld(list)
    expect(entryInput('depth').element.value).toBe('20.1')
    list.push(stored({ id: 4, depth: 30 }))
    await wrapper!.get('[data-testid="entry-refresh"]').trigger('click')
    await flushPromises()
    expect(entryInput('depth').element.value).toBe('30.1')
    await entryInput('depth').setValue('25.5')
    list.push(stored({ id: 5, depth: 40 }))
    await wrapper!.get('[data-testid="entry-refresh"]').trigger('click')
    await flushPromises()
    expect(entryInput('depth').element.value).toBe('25.5')
  })

  it('previewStructure() counts a queued row: a beta jump against it shows before it is stored', async () => {
    await mountHeld()
    await commit({ depth: '9', type: 'jt', alpha: '60', beta: '300' })
    await entryInput('depth').setValue('10')
    await entryInput('type').setValue('jt')
    await entryInput('alpha').setValue('60')
    await entryInput('beta').setValue('90')
    // 300° → 90°: 150° apart, more than the project's 60°, same type, same run.
    expect(notes()).toEqual([
      'Beta differs by more than 60° from the previous structure of this type in the run.',
    ])
  })
})

describe('HoleEntryPanel: a save the server refuses', () => {
  it('POST → 403: the row stays with its message, later rows still save, corrected it saves', async () => {
    const server = await mountHeld()
    await commit({ depth: '12.3', type: 'jt', alpha: '60', beta: '90' })
    await commit({ depth: '12.6', type: 'bd', alpha: '20' })
    const message =
      'Depth 12.3 m lies in a checked interval: only engineers and leads can change it.'
    await server.answer(0, {
      status: 403,
      body: { error: { code: 'forbidden', message, details: [] } },
    })
    const failed = wrapper!.get('[data-testid="entry-failed-1"]')
    expect(entryInput('depth', 'entry-failed-1').element.value).toBe('12.3')
    expect(entryInput('alpha', 'entry-failed-1').element.value).toBe('60')
    expect(entryInput('beta', 'entry-failed-1').element.value).toBe('90')
    expect(failed.element.nextElementSibling?.textContent).toContain(message)
    expect(wrapper!.get('[data-testid="entry-failed-count"]').text()).toContain(
      '1 committed row was not saved.',
    )
    // The queue goes on with the next row.
    expect(server.posted()).toEqual([12.3, 12.6])
    await server.answer(1)
    expect(wrapper!.find('[data-testid="structure-501"]').exists()).toBe(true)

    await entryInput('depth', 'entry-failed-1').setValue('11.9')
    await wrapper!.get('[data-testid="entry-retry"]').trigger('click')
    await flushPromises()
    expect(server.posted()).toEqual([12.3, 12.6, 11.9])
    await server.answer(2)
    expect(wrapper!.find('[data-testid="entry-failed-1"]').exists()).toBe(false)
    expect(wrapper!.find('[data-testid="entry-failed-count"]').exists()).toBe(false)
    expect(wrapper!.find('[data-testid="structure-502"]').exists()).toBe(true)
  })

  it('POST unreachable: the row is kept through Esc and leaves only by its discard button', async () => {
    const server = await mountHeld()
    await commit({ depth: '12.3', type: 'jt', alpha: '60' })
    await server.answer(0, 'network')
    expect(wrapper!.get('[data-testid="entry-message"]').text()).toBe(
      'The server could not be reached.',
    )
    await entryInput('alpha', 'entry-failed-1').trigger('keydown', { key: 'Escape' })
    await flushPromises()
    expect(entryInput('depth', 'entry-failed-1').element.value).toBe('12.3')
    expect(focused()).toBe('depth')
    expect(document.activeElement?.closest('tr')?.dataset.testid).toBe('entry-row')
    await wrapper!.get('[data-testid="entry-discard"]').trigger('click')
    expect(wrapper!.find('[data-testid="entry-failed-1"]').exists()).toBe(false)
    expect(server.posted()).toEqual([12.3])
  })

  it('POST carries one Idempotency-Key per row; a retry of the same cells sends the same key', async () => {
    const server = await mountHeld()
    await commit({ depth: '12.3', type: 'jt', alpha: '60' })
    await commit({ depth: '12.6', type: 'bd', alpha: '20' })
    await server.answer(0, 'network')
    await server.answer(1)
    await wrapper!.get('[data-testid="entry-retry"]').trigger('click')
    await flushPromises()
    const [first, second, retried] = server.keys()
    expect(first).toMatch(/^[\x21-\x7e]{8,200}$/)
    expect(second).not.toBe(first)
    expect(retried).toBe(first)
    expect(server.posted()).toEqual([12.3, 12.6, 12.3])
  })
})

describe('HoleEntryPanel: the hole final depth', () => {
  it('suggestDepth() stops at the final depth (100 m); a deeper typed depth is held with a note', async () => {
    const server = await mountHeld([stored({ id: 3, depth: 99.95 })])
    // 99.95 + 0.10 would pass the end of the hole.
    expect(entryInput('depth').element.value).toBe('100')
    await commit({ type: 'jt', alpha: '60' })
    expect(server.posted()).toEqual([100])
    expect(entryInput('depth').element.value).toBe('')
    await server.answer(0)
    expect(entryInput('depth').element.value).toBe('')

    await commit({ depth: '100.5', type: 'jt', alpha: '60' })
    expect(server.posted()).toEqual([100])
    expect(notes()).toContain(
      "depth 100.5 m is beyond the hole's final depth (100 m): extend the hole's final depth first",
    )
    expect(entryInput('depth').attributes('aria-invalid')).toBe('true')
    expect(focused()).toBe('depth')
  })

  it('submitEdit() on an older row beyond the final depth: a new depth is held, other changes go', async () => {
    const server = await mountHeld([stored({ id: 8, depth: 102, version: 2 })])
    expect(entryInput('depth').element.value).toBe('')
    await wrapper!.get('[data-testid="structure-8"]').trigger('keydown', { key: 'Enter' })
    await flushPromises()
    await entryInput('depth', 'entry-edit-8').setValue('103')
    await entryInput('depth', 'entry-edit-8').trigger('keydown', { key: 'Enter', ctrlKey: true })
    await flushPromises()
    expect(server.bodies()).toEqual([])
    expect(notes('entry-edit-8')[0]).toBe(
      "depth 103 m is beyond the hole's final depth (100 m): extend the hole's final depth first",
    )
    await entryInput('depth', 'entry-edit-8').setValue('102')
    await entryInput('comment', 'entry-edit-8').setValue('re-measured')
    await entryInput('comment', 'entry-edit-8').trigger('keydown', { key: 'Enter', ctrlKey: true })
    await flushPromises()
    expect(server.bodies()).toEqual([{ comment: 're-measured', version: 2 }])
  })
})
