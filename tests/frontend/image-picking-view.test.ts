import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest'
import { flushPromises, mount, type VueWrapper } from '@vue/test-utils'
import PrimeVue from 'primevue/config'
import ToastService from 'primevue/toastservice'
import ImagePickView from '../../frontend/src/components/image/ImagePickView.vue'
import { setCsrfToken } from '../../frontend/src/api/client'
import type { ImageMeta, ImagePickRecord, TracePoint } from '../../frontend/src/api/images'
import { fitSinusoid } from '../../orient/index'

// An invented GSQ-BH02 image: 30–34 m, 2 mm rows, 360 samples a turn from true north.
const image: ImageMeta = {
  id: 7,
  holeId: 2,
  kind: 'amplitude',
  source: 'raster',
  name: 'gsq-bh02-atv.png',
  fileName: 'gsq-bh02-atv.png',
  mediaType: 'image/png',
  fileSize: 1000,
  topDepth: 30,
  bottomDepth: 34,
  width: 360,
  height: 2000,
  channels: 1,
  sampleBits: 8,
  valueMin: null,
  valueMax: null,
  valueUnit: null,
  leftAzimuth: 0,
  azimuthReference: 'north',
  northReference: 'true',
  diameterMm: 96,
  diameterSource: 'hole',
  tileRows: 256,
  levels: 4,
  status: 'ready',
  progress: 100,
  message: '',
  notes: [],
  createdAt: '2026-04-01T10:00:00Z',
  createdBy: 1,
  pickCount: 0,
}

/** What the server suggests in the window (mm heights, as the API sends them). */
let suggestions = [
  { depth: 31.2, height: 35, troughAzimuth: 160, dip: 20, dipDirection: 160, score: 0.91 },
  { depth: 32.7, height: 60, troughAzimuth: 20, dip: 32, dipDirection: 20, score: 0.42 },
]

interface Call {
  method: string
  url: string
  body: { points?: TracePoint[]; type?: string } | undefined
}

describe('ImagePickView: picking by keyboard alone', () => {
  let calls: Call[]
  let wrapper: VueWrapper | undefined
  let nextId = 900

  beforeEach(() => {
    setCsrfToken('token')
    calls = []
    vi.stubGlobal(
      'fetch',
      vi.fn(async (url: string, init: RequestInit = {}) => {
        const method = init.method ?? 'GET'
        const body = init.body ? JSON.parse(String(init.body)) : undefined
        calls.push({ method, url: String(url), body })
        const ok = (data: unknown, status = 200) =>
          new Response(JSON.stringify({ data }), { status })
        if (url.endsWith('/fit'))
          return ok({
            depth: 31,
            height: 20,
            troughAzimuth: 0,
            rmsMm: 0,
            dip: 11.8,
            dipDirection: 0,
          })
        if (method === 'POST' && url.endsWith('/picks')) {
          const id = nextId++
          const record: ImagePickRecord = {
            structureId: id,
            imageId: 7,
            points: body.points,
            centreDepth: 31,
            heightMm: 20,
            troughAzimuth: 0,
            diameterMm: 96,
            azimuthReference: 'north',
            northReference: 'true',
            rmsMm: 0,
            suggested: false,
            structure: {
              id,
              depth: 31,
              type: body.type,
              confidence: null,
              comment: '',
              dip: 11.8,
              dipDirection: 0,
              flags: [],
              version: 1,
            },
          }
          return ok(record, 201)
        }
        if (method === 'DELETE') return new Response(null, { status: 204 })
        if (url.includes('/suggestions')) return ok(suggestions)
        return ok([])
      }),
    )
  })
  afterEach(() => {
    wrapper?.unmount()
    vi.unstubAllGlobals()
  })

  const press = async (key: string, extra: KeyboardEventInit = {}) => {
    const wall = wrapper!.get('[data-testid="pick-wall"]')
    const target = wall.find('[data-testid="image-canvas"]').exists()
      ? wall.get('[data-testid="image-canvas"]')
      : wall
    await target.trigger('keydown', { key, ...extra })
    await flushPromises()
  }
  const posts = () => calls.filter((c) => c.method === 'POST' && c.url.endsWith('/picks'))

  it('arrows and Space place three points, Enter opens the type step, a code and Enter keep it', async () => {
    wrapper = mount(ImagePickView, {
      props: { projectId: '1', holeId: '2', image, canEdit: true, projection: 'equal-area' },
      attachTo: document.body,
      global: {
        plugins: [[PrimeVue, { theme: 'none' }], ToastService] as never[],
        stubs: { ImageCanvas: true },
      },
    })
    await flushPromises()
    await press(' ')
    await press('ArrowRight', { shiftKey: true })
    for (let i = 0; i < 11; i++) await press('ArrowRight', { shiftKey: true })
    await press('ArrowDown', { shiftKey: true })
    await press(' ')
    for (let i = 0; i < 12; i++) await press('ArrowRight', { shiftKey: true })
    await press(' ')
    const trace = wrapper.get('[data-testid="pick-trace"]')
    expect(trace.attributes('data-points')).toBe('3')
    // Backspace takes the last off, Space puts it back.
    await press('Backspace')
    expect(trace.attributes('data-points')).toBe('2')
    await press(' ')
    await press('Enter')
    expect(document.activeElement?.id).toBe('pick-type')
    const type = wrapper.get('#pick-type')
    await type.setValue('fa')
    expect(wrapper.get('[data-testid="pick-type-word"]').text()).toBe('fault')
    await type.trigger('keydown', { key: 'Enter' })
    await flushPromises()
    expect(posts()).toHaveLength(1)
    const sent = posts()[0]!.body!
    expect(sent.type).toBe('fault')
    // Three points 120 sample columns apart (Shift: ten columns a press), on sample centres.
    expect(sent.points!.map((p) => p.azimuth)).toEqual([0.5, 120.5, 240.5])
    // Opened at 1:20 a screen pixel (20 × 0.2646 mm) is longer than a 2 mm row, so Shift+↓ moves
    // ten pixels: 10 × 20 × 0.0254/96 m.
    expect(sent.points![1]!.depth - sent.points![0]!.depth).toBeCloseTo((10 * 20 * 0.0254) / 96, 9)
    expect(wrapper.findAll('[data-testid="pick-table"] tr[data-status="saved"]')).toHaveLength(1)

    // ] chooses it, Delete deletes it, U brings it back as a new structure.
    await press('Escape')
    await press(']')
    expect(wrapper.find('[data-testid="pick-selected"]').exists()).toBe(true)
    await press('Delete')
    expect(calls.some((c) => c.method === 'DELETE' && c.url.endsWith('/picks/900?version=1'))).toBe(
      true,
    )
    expect(wrapper.get('[data-testid="pick-undo"]').text()).toMatch(/deleted/)
    await press('u')
    expect(posts()).toHaveLength(2)
    expect(posts()[1]!.body).toEqual({ points: sent.points, type: 'fault' })
    expect(wrapper.find('[data-testid="pick-undo"]').exists()).toBe(false)
  })

  it('S looks for candidates in view; Take fills the trace with points along one, kept only by hand', async () => {
    wrapper = mount(ImagePickView, {
      props: { projectId: '1', holeId: '2', image, canEdit: true, projection: 'equal-area' },
      attachTo: document.body,
      global: {
        plugins: [[PrimeVue, { theme: 'none' }], ToastService] as never[],
        stubs: { ImageCanvas: true },
      },
    })
    await flushPromises()
    await press('s')
    const asked = calls.find((c) => c.url.includes('/suggestions'))!
    expect(asked.url).toMatch(/from=30&to=32\.6/)
    expect(wrapper.findAll('[data-testid="suggestion"]')).toHaveLength(2)
    // Nothing is kept by itself.
    expect(posts()).toHaveLength(0)
    // Rejected: hidden, and back on request.
    await wrapper.findAll('[data-testid="suggestion-reject"]')[1]!.trigger('click')
    expect(wrapper.findAll('[data-testid="suggestion"]')).toHaveLength(1)
    expect(wrapper.get('[data-testid="suggest-summary"]').text()).toMatch(/1 shown, 1 rejected/)
    await wrapper.get('[data-testid="suggestion-take"]').trigger('click')
    await flushPromises()
    expect(wrapper.get('[data-testid="pick-trace"]').attributes('data-points')).toBe('12')
    expect(document.activeElement?.id).toBe('pick-type')
    await wrapper.get('#pick-type').setValue('jt')
    await wrapper.get('#pick-type').trigger('keydown', { key: 'Enter' })
    await flushPromises()
    const sent = posts()[0]!.body as { points: TracePoint[]; type: string; suggested: boolean }
    expect(sent.type).toBe('joint')
    expect(sent.suggested).toBe(true)
    const fit = fitSinusoid(sent.points)!
    expect(fit.depth).toBeCloseTo(31.2, 9)
    expect(fit.height * 1000).toBeCloseTo(35, 9)
    expect(fit.troughAzimuth).toBeCloseTo(160, 6)
    // Taken, it leaves the list; the rejected one stays rejected.
    expect(wrapper.findAll('[data-testid="suggestion"]')).toHaveLength(0)
    suggestions = []
    await press('s')
    expect(wrapper.get('[data-testid="suggest-summary"]').text()).toMatch(/no candidate traces/)
  })
})
