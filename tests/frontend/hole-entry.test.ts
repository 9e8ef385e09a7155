import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest'
import { flushPromises, mount, type VueWrapper } from '@vue/test-utils'
import PrimeVue from 'primevue/config'
import ConfirmationService from 'primevue/confirmationservice'
import HoleEntryPanel from '../../frontend/src/components/hole/HoleEntryPanel.vue'
import { setCsrfToken } from '../../frontend/src/api/client'
import type { Station, Structure } from '../../frontend/src/api/types'
import { computeStructures } from '../../orient/index'
import { mockFetch, type Call } from './fetch-mock'
import { hole, project, run, station, stored } from './hole-entry-fixtures'

type Reply = { status?: number; body?: unknown }
let wrapper: VueWrapper | undefined

async function mountPanel(
  opts: {
    stations?: Station[]
    rows?: Structure[]
    canEdit?: boolean
    post?: (c: Call) => Reply
    route?: (c: Call) => Reply
  } = {},
) {
  // The server's list: what was there, plus what was posted since.
  const rows = [...(opts.rows ?? [])]
  const calls = mockFetch(
    opts.route ??
      ((call) => {
        if (call.method === 'POST' && opts.post) {
          const reply = opts.post(call)
          if (reply.status === 201) rows.push((reply.body as { data: Structure }).data)
          return reply
        }
        if (call.url.endsWith('/structures')) return { body: { data: rows, meta: {} } }
        return { status: 404 }
      }),
  )
  wrapper = mount(HoleEntryPanel, {
    props: {
      projectId: '1',
      holeId: '4',
      project,
      hole,
      stations: opts.stations ?? [station(0), station(100)],
      runs: [run],
      canEdit: opts.canEdit ?? true,
    },
    attachTo: document.body,
    global: { plugins: [[PrimeVue, { theme: 'none' }], ConfirmationService] as never[] },
  })
  await flushPromises()
  return { wrapper, calls }
}

const entryInput = (field: string) =>
  wrapper!.get<HTMLInputElement>(`[data-testid="entry-row"] input[data-field="${field}"]`)
const focused = () => (document.activeElement as HTMLElement | null)?.dataset.field

/** Types a value into the focused cell and presses a key there, as a logger would. */
async function typeAndPress(value: string, key = 'Enter', init: KeyboardEventInit = {}) {
  const field = focused()!
  const input = entryInput(field)
  await input.setValue(value)
  await input.trigger('keydown', { key, ...init })
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

describe('HoleEntryPanel: live orientation while typing', () => {
  it('hole 000/60, alpha 60 beta 90 → dip 41.41, dip direction 229.11, as orient computes', async () => {
    // Check value worked by the vector method for a bottom-of-hole reference line: the pole lies
    // 30° off the core axis, 90° clockwise from the bottom line looking down-hole.
    await mountPanel()
    await typeAndPress('10')
    await typeAndPress('jt')
    await typeAndPress('60')
    await entryInput('beta').setValue('90')
    const row = wrapper!.get('[data-testid="entry-row"]')
    expect(row.get('[data-field="dip"]').text()).toBe('41.4°')
    expect(row.get('[data-field="dipDirection"]').text()).toBe('229.1°')
    const [expected] = computeStructures(
      {
        steepThresholdDeg: 85,
        betaJumpDeg: 60,
        referenceLine: 'bottom',
        collar: { east: 1000, north: 2000, elevation: 100 },
        planned: { trend: 0, plunge: 60 },
        stations: [station(0), station(100)],
        runs: [run],
      },
      [{ depth: 10, type: 'joint', source: 'core', alpha: 60, beta: 90 }],
    )
    expect(expected!.dip).toBeCloseTo(41.41, 2)
    expect(expected!.dipDirection).toBeCloseTo(229.11, 2)
    expect(row.get('[data-field="dip"]').text()).toBe(`${expected!.dip!.toFixed(1)}°`)
    expect(wrapper!.find('[data-testid="entry-note"]').exists()).toBe(false)
  })

  it('warns when the hole is steeper than the project threshold', async () => {
    await mountPanel({ stations: [station(0, 88), station(100, 88)] })
    await entryInput('depth').setValue('10')
    await entryInput('alpha').setValue('45')
    await entryInput('beta').setValue('30')
    const chip = wrapper!.get('[data-testid="entry-row"] [data-flag="steep-hole"]')
    expect(chip.text()).toBe('Steep hole')
    expect(chip.find('i').exists()).toBe(true)
    const note = wrapper!.get('[data-testid="entry-note"][data-flag="steep-hole"]')
    expect(note.text()).toBe(
      "Hole plunges 88.0° here, at or above the project's steep-hole threshold of 85°: the orientation mark is unreliable.",
    )
  })

  it('names alpha and beta outside their range, outside-run depths and beta jumps', async () => {
    const previous = stored({ id: 7, depth: 9, beta: 300, dipDirection: 10 })
    await mountPanel({ rows: [previous] })
    await entryInput('depth').setValue('10')
    await entryInput('type').setValue('jt')
    await entryInput('alpha').setValue('95')
    await entryInput('beta').setValue('361')
    const notes = () => wrapper!.findAll('[data-testid="entry-note"]').map((n) => n.text())
    expect(notes()).toEqual(['alpha must be 0–90°', 'beta must be 0–360°'])
    await entryInput('alpha').setValue('60')
    await entryInput('beta').setValue('90')
    // 300° → 90°: 150° apart, more than the project's 60°, same type, same run.
    expect(notes()).toEqual([
      'Beta differs by more than 60° from the previous structure of this type in the run.',
    ])
    await entryInput('depth').setValue('60')
    expect(notes()).toEqual([
      'No core run covers this depth: check the depth or enter the run first.',
    ])
  })

  it('accepts our type codes and words, and writes the word out on leaving the cell', async () => {
    await mountPanel()
    const type = entryInput('type')
    await type.setValue('fa')
    expect(wrapper!.get('[data-testid="type-hint"]').text()).toBe('fault')
    await type.trigger('keydown', { key: 'Enter' })
    expect(type.element.value).toBe('fault')
    await type.setValue('bz')
    expect(wrapper!.get('[data-testid="type-hint"]').text()).toBe('broken-zone')
    await type.setValue('Vein')
    expect(wrapper!.get('[data-testid="type-hint"]').text()).toBe('vein')
    await type.setValue('xx')
    expect(wrapper!.get('[data-testid="entry-note"]').text()).toBe(
      '"xx" is not a type (jt, bd, fa… or a word)',
    )
  })
})

describe('HoleEntryPanel: keyboard and saving', () => {
  it('Enter walks depth → type → alpha → beta → gamma → comment, then saves and starts a new row', async () => {
    const saved = stored({ id: 501, depth: 12.3, comment: 'calcite' })
    const { calls } = await mountPanel({ post: () => ({ status: 201, body: { data: saved } }) })
    expect(focused()).toBe('depth')
    const walk: string[] = []
    for (const value of ['12.3', 'jt', '60', '90', '']) {
      await typeAndPress(value)
      walk.push(focused()!)
    }
    expect(walk).toEqual(['type', 'alpha', 'beta', 'gamma', 'comment'])
    await typeAndPress('calcite')
    await flushPromises()
    const post = calls.find((c) => c.method === 'POST')!
    expect(post.url).toBe('/api/projects/1/holes/4/structures')
    expect(post.body).toEqual({
      source: 'core',
      depth: 12.3,
      type: 'joint',
      alpha: 60,
      beta: 90,
      persistence: 'not determined',
      comment: 'calcite',
    })
    // The list is fetched again after the save: the server recomputes the run's other rows.
    const at = calls.indexOf(post)
    expect(calls.slice(at + 1).map((c) => `${c.method} ${c.url}`)).toEqual([
      'GET /api/projects/1/holes/4/structures',
    ])
    const row = wrapper!.get('[data-testid="structure-501"]')
    expect(row.get('[data-field="dip"]').text()).toBe('41.4°')
    expect(row.get('[data-field="dipDirection"]').text()).toBe('229.1°')
    // A new row, one default step (0.10 m) deeper, with the keyboard back on its depth.
    expect(entryInput('depth').element.value).toBe('12.4')
    expect(entryInput('type').element.value).toBe('')
    expect(focused()).toBe('depth')
  })

  it('Tab and Shift+Tab move in the same order; Alt+A opens the attributes in the path', async () => {
    await mountPanel()
    await typeAndPress('5', 'Tab')
    expect(focused()).toBe('type')
    await typeAndPress('bd', 'Tab', { shiftKey: true })
    expect(focused()).toBe('depth')
    await typeAndPress('5', 'Tab')
    await typeAndPress('bd', 'Tab')
    await typeAndPress('20', 'Tab')
    await typeAndPress('180', 'Tab')
    await typeAndPress('', 'a', { altKey: true, code: 'KeyA' })
    await flushPromises()
    expect(focused()).toBe('roughness')
    const rough = wrapper!.get<HTMLInputElement>('input[data-field="roughness"]')
    await rough.setValue('7')
    await rough.trigger('keydown', { key: 'Enter' })
    expect(rough.element.value).toBe('VII')
    expect(focused()).toBe('jrc')
  })

  it('F2 repeats the last row one step deeper', async () => {
    await mountPanel({ rows: [stored({ id: 3, depth: 20, alpha: 35, beta: 120, jrc: 8 })] })
    await entryInput('depth').trigger('keydown', { key: 'F2' })
    expect(entryInput('depth').element.value).toBe('20.1')
    expect(entryInput('type').element.value).toBe('joint')
    expect(entryInput('alpha').element.value).toBe('35')
    expect(entryInput('beta').element.value).toBe('120')
    expect(wrapper!.get('[data-testid="entry-legend"]').text()).toContain('F2')
  })

  it('does not send a row with alpha out of range', async () => {
    const { calls } = await mountPanel({
      post: () => ({ status: 201, body: { data: stored({}) } }),
    })
    await entryInput('depth').setValue('10')
    await entryInput('type').setValue('jt')
    await entryInput('alpha').setValue('95')
    await entryInput('comment').trigger('keydown', { key: 'Enter' })
    await flushPromises()
    expect(calls.some((c) => c.method === 'POST')).toBe(false)
    expect(focused()).toBe('alpha')
  })

  it('shows the 403 of a checked interval in the row', async () => {
    const message = 'Depth 10 m lies in a checked interval: only engineers and leads can change it.'
    await mountPanel({
      post: () => ({ status: 403, body: { error: { code: 'forbidden', message, details: [] } } }),
    })
    await entryInput('depth').setValue('10')
    await entryInput('type').setValue('jt')
    await entryInput('alpha').setValue('60')
    await entryInput('comment').trigger('keydown', { key: 'Enter' })
    await flushPromises()
    expect(wrapper!.get('[data-testid="entry-message"]').text()).toBe(message)
  })

  it('is read-only for viewers: no entry row, no row actions', async () => {
    await mountPanel({ canEdit: false, rows: [stored({})] })
    expect(wrapper!.find('[data-testid="entry-row"]').exists()).toBe(false)
    expect(wrapper!.find('[data-testid="structure-delete"]').exists()).toBe(false)
    expect(wrapper!.get('[data-testid="structure-101"] [data-field="dip"]').text()).toBe('41.4°')
  })
})

describe('HoleEntryPanel: editing in place', () => {
  it('PATCHes only what changed with the version; on 409 says so and reloads that row', async () => {
    const row = stored({ id: 77, depth: 15, version: 3 })
    const theirs = stored({ id: 77, depth: 15, alpha: 50, version: 4 })
    const { calls } = await mountPanel({
      route: (call) => {
        if (call.method === 'PATCH') {
          const error = { code: 'stale_version', message: 'Changed elsewhere.', details: [] }
          return { status: 409, body: { error } }
        }
        if (call.url.endsWith('/structures/77')) return { body: { data: theirs } }
        return { body: { data: [row], meta: {} } }
      },
    })
    const view = wrapper!
    await view.get('[data-testid="structure-77"]').trigger('keydown', { key: 'Enter' })
    await flushPromises()
    expect(focused()).toBe('depth')
    const alpha = view.get<HTMLInputElement>(
      '[data-testid="entry-edit-77"] input[data-field="alpha"]',
    )
    await alpha.setValue('62')
    await alpha.trigger('keydown', { key: 'Enter', ctrlKey: true })
    await flushPromises()
    expect(calls.find((c) => c.method === 'PATCH')).toMatchObject({
      url: '/api/projects/1/holes/4/structures/77',
      body: { alpha: 62, version: 3 },
    })
    expect(view.get('[data-testid="entry-message"]').text()).toContain(
      'Someone else changed this structure since you loaded it.',
    )
    await view.get('[data-testid="entry-reload"]').trigger('click')
    await flushPromises()
    const edit = view.get<HTMLInputElement>(
      '[data-testid="entry-edit-77"] input[data-field="alpha"]',
    )
    expect(edit.element.value).toBe('50')
    expect(view.find('[data-testid="entry-message"]').exists()).toBe(false)
  })
})
