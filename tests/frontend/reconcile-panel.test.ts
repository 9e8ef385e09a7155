import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest'
import { flushPromises, mount, type VueWrapper } from '@vue/test-utils'
import { createPinia, setActivePinia, type Pinia } from 'pinia'
import PrimeVue from 'primevue/config'
import ReconcilePanel from '../../frontend/src/components/reconcile/ReconcilePanel.vue'
import { setCsrfToken } from '../../frontend/src/api/client'
import { OPTIONS_DEBOUNCE_MS } from '../../frontend/src/composables/use-reconciliation'
import { useAuthStore } from '../../frontend/src/stores/auth'
import type { ProjectRole } from '../../frontend/src/api/types'
import type { ReconciliationAnswer } from '../../schema/index'
import { mockFetch, type Call } from './fetch-mock'
import { adjustments, reconciliationAnswer } from './reconcile-fixture'

const base = '/api/projects/1/holes/7/reconciliation'
let pinia: Pinia
let wrapper: VueWrapper | undefined

function signIn(role: ProjectRole) {
  const auth = useAuthStore()
  auth.user = { id: 4, email: 'erin@greyscar.test', name: 'Erin', isAdmin: false }
  auth.memberships = [{ projectId: 1, projectCode: 'GSQ', projectName: 'Greyscar', role }]
}

type Route = (call: Call) => { status?: number; body?: unknown } | undefined

/** Answers the GET with `answer` unless `route` answers first. */
function serve(answer: ReconciliationAnswer, route: Route = () => undefined) {
  return mockFetch((call) => route(call) ?? { body: { data: answer } })
}

async function mountPanel() {
  wrapper = mount(ReconcilePanel, {
    props: { projectId: '1', holeId: '7' },
    attachTo: document.body,
    global: { plugins: [pinia, [PrimeVue, { theme: 'none' }]] as never[] },
  })
  await flushPromises()
  return wrapper
}

const inDocument = (selector: string) => document.querySelector<HTMLElement>(selector)

async function click(selector: string) {
  inDocument(selector)!.click()
  await flushPromises()
}

beforeEach(() => {
  pinia = createPinia()
  setActivePinia(pinia)
  setCsrfToken('token')
  signIn('engineer')
})
afterEach(() => {
  wrapper?.unmount()
  wrapper = undefined
  vi.unstubAllGlobals()
})

describe('ReconcilePanel', () => {
  it('GET reconciliation: the summary shows counts, the shift ± spread, the trend and the shift in force', async () => {
    const calls = serve(reconciliationAnswer())
    const w = await mountPanel()
    expect(calls[0]).toMatchObject({ method: 'GET', url: base })
    expect(w.get('[data-testid="reconcile-count-core"] dd').text()).toBe('14')
    expect(w.get('[data-testid="reconcile-count-image"] dd').text()).toBe('15')
    expect(w.get('[data-testid="reconcile-count-matched"] dd').text()).toBe('13')
    // Mean of the thirteen invented differences: 0.34919 m.
    expect(w.get('[data-testid="reconcile-shift"] dd').text()).toBe('+0.349 m± 0.040 m')
    // Slope 0.0012 m/m = 0.012 m per 10 m, its error 0.0004 m/m = 0.004 m per 10 m.
    expect(w.get('[data-testid="reconcile-trend"] dd').text()).toBe('+0.012 m per 10 m (± 0.004)')
    expect(w.get('[data-testid="reconcile-in-force"] dd').text()).toBe('none')
    expect(w.get('[data-testid="reconcile-caution"]').text()).toContain('competent person')
    expect(w.findAll('[data-testid="plot-point"]')).toHaveLength(13)
    expect(w.find('[data-testid="plot-trend"]').exists()).toBe(true)
  })

  it('GET reconciliation: the runs table shows rotations with spread, verdict words and reasons', async () => {
    serve(reconciliationAnswer())
    const w = await mountPanel()
    const row = (id: number) => w.get(`[data-testid="reconcile-run-${id}"]`)
    expect(row(11).get('[data-field="rotation"]').text()).toBe('+1.8° ± 2.1°')
    expect(row(11).get('[data-field="applied"]').text()).toBe('+1.5°')
    expect(row(11).get('[data-field="verdict"]').text()).toBe('ok')
    expect(row(12).get('[data-field="rotation"]').text()).toBe('+24.6° ± 3.4°')
    expect(row(12).get('[data-field="residual"]').text()).toBe('22.9°')
    expect(row(12).get('[data-field="verdict"]').text()).toBe('wrong')
    expect(row(12).get('[data-field="reason"]').text()).toBe('residual 22.9° is above 15°')
    expect(row(13).get('[data-field="verdict"]').text()).toBe('no verdict')
    expect(row(13).get('[data-field="reason"]').text()).toBe('only 2 pairs; 3 needed')
    // A run without a verdict cannot be ticked.
    expect(w.get<HTMLInputElement>('#reconcile-run-pick-13').element.disabled).toBe(true)
    expect(w.get<HTMLInputElement>('#reconcile-run-pick-12').element.disabled).toBe(false)
  })

  it('POST reconciliation/apply: ticking the wrong run sends its rotation exactly as the GET gave it', async () => {
    const calls = serve(reconciliationAnswer(), (c) =>
      c.method === 'POST'
        ? { status: 201, body: { data: { adjustments: [adjustments[1]], recomputed: 6 } } }
        : undefined,
    )
    const w = await mountPanel()
    await w.get('#reconcile-run-pick-12').setValue(true)
    await w.get('[data-testid="reconcile-apply"]').trigger('click')
    await flushPromises()
    const lines = [...document.querySelectorAll('[data-testid="reconcile-apply-lines"] li')]
    expect(lines.map((l) => l.textContent)).toEqual([
      'Run 42.0–45.0 m: logged betas turn by +24.6° clockwise looking down-hole.',
      "The hole's structures are recomputed; the logged values are kept, and each adjustment can be undone.",
    ])
    await click('[data-testid="reconcile-apply-confirm"]')
    const post = calls.find((c) => c.method === 'POST')!
    expect(post.url).toBe(`${base}/apply`)
    expect(post.body).toEqual({ runRotations: [{ runId: 12, rotation: 24.6 }] })
    expect(post.headers['Idempotency-Key']).toMatch(/\S{8,}/)
    // Reloaded after the write, and the result said.
    expect(calls.filter((c) => c.method === 'GET')).toHaveLength(2)
    expect(w.get('[data-testid="reconcile-apply-result"]').text()).toBe(
      'Recorded 1 adjustment; 6 structures recomputed.',
    )
    expect(inDocument('[data-testid="reconcile-apply-lines"]')).toBeNull()
  })

  it('POST reconciliation/apply: with the depth shift ticked the GET value goes unrounded, and the dialog says the move', async () => {
    const answer = reconciliationAnswer({ appliedDepthShift: 0.3 })
    const calls = serve(answer, (c) =>
      c.method === 'POST'
        ? { status: 201, body: { data: { adjustments: [], recomputed: 29 } } }
        : undefined,
    )
    const w = await mountPanel()
    await w.get('#reconcile-apply-shift').setValue(true)
    await w.get('#reconcile-run-pick-12').setValue(true)
    await w.get('[data-testid="reconcile-apply"]').trigger('click')
    await flushPromises()
    expect(inDocument('[data-testid="reconcile-apply-lines"] li')!.textContent).toBe(
      'Image depths move by −0.349 m from their logged values onto core depths (a shift of +0.300 m is in force now and is replaced).',
    )
    const reason = inDocument('[data-testid="reconcile-apply-reason"]') as HTMLTextAreaElement
    reason.value = ' checked against box photos '
    reason.dispatchEvent(new Event('input'))
    await click('[data-testid="reconcile-apply-confirm"]')
    expect(calls.find((c) => c.method === 'POST')!.body).toEqual({
      depthShift: answer.depthShift,
      runRotations: [{ runId: 12, rotation: 24.6 }],
      reason: 'checked against box photos',
    })
  })

  it('POST reconciliation/apply → 409 interval_approved: the message naming the interval shows in the dialog', async () => {
    const message =
      'This change would change the approved interval "upper" (40–44 m): a lead must reopen it first.'
    serve(reconciliationAnswer(), (c) =>
      c.method === 'POST'
        ? { status: 409, body: { error: { code: 'interval_approved', message } } }
        : undefined,
    )
    const w = await mountPanel()
    await w.get('#reconcile-run-pick-12').setValue(true)
    await w.get('[data-testid="reconcile-apply"]').trigger('click')
    await flushPromises()
    await click('[data-testid="reconcile-apply-confirm"]')
    expect(
      inDocument('[role="dialog"] [data-testid="reconcile-apply-error"]')!.textContent,
    ).toContain('"upper" (40–44 m)')
  })

  it('DELETE reconciliation/adjustments/:id: Undo asks first, then deletes that adjustment', async () => {
    const calls = serve(reconciliationAnswer(), (c) =>
      c.method === 'DELETE'
        ? { body: { data: { undone: { ...adjustments[1], undoneAt: 'x' }, recomputed: 5 } } }
        : undefined,
    )
    const w = await mountPanel()
    // The undone adjustment offers no undo; the one in force does.
    expect(w.find('[data-testid="adjustment-undo-5"]').exists()).toBe(false)
    await w.get('[data-testid="adjustment-undo-6"]').trigger('click')
    await flushPromises()
    expect(calls.some((c) => c.method === 'DELETE')).toBe(false)
    expect(inDocument('[data-testid="reconcile-undo-effect"]')!.textContent).toContain(
      'Run rotation 39.0–42.0 m +1.5° is undone',
    )
    await click('[data-testid="reconcile-undo-confirm"]')
    const del = calls.find((c) => c.method === 'DELETE')!
    expect(del.url).toBe(`${base}/adjustments/6`)
    expect(calls.filter((c) => c.method === 'GET')).toHaveLength(2)
    expect(w.get('[data-testid="reconcile-undo-result"]').text()).toBe(
      'Undone; 5 structures recomputed.',
    )
  })

  it('ReconcilePanel: a logger sees the estimates but no ticks, no apply and no undo', async () => {
    signIn('logger')
    serve(reconciliationAnswer())
    const w = await mountPanel()
    expect(w.find('[data-testid="reconcile-run-12"]').exists()).toBe(true)
    expect(w.find('#reconcile-run-pick-12').exists()).toBe(false)
    expect(w.find('[data-testid="reconcile-apply-bar"]').exists()).toBe(false)
    expect(w.find('[data-testid="adjustment-undo-6"]').exists()).toBe(false)
    expect(w.get('[data-testid="reconcile-read-only"]').text()).toContain('Engineers and leads')
  })

  it('ReconcilePanel: a hole without image structures says so', async () => {
    const empty = reconciliationAnswer({
      counts: { core: 14, image: 0 },
      matches: [],
      depthShift: null,
      depthShiftSpread: null,
      depthTrend: null,
    })
    serve(empty)
    const w = await mountPanel()
    expect(w.get('[data-testid="reconcile-no-image"]').text()).toContain('no image structures')
    expect(w.find('[data-testid="reconcile-no-core"]').exists()).toBe(false)
    expect(w.get('[data-testid="reconcile-shift"] dd').text()).toBe('no estimate without pairs')
    expect(w.find('[data-testid="reconcile-shift-plot"]').exists()).toBe(false)
  })

  it('GET reconciliation?depthWindow=: a bad value is named and not sent; a good one is, after the pause', async () => {
    const calls = serve(reconciliationAnswer())
    const w = await mountPanel()
    await w.get('#reconcile-depthWindow').setValue('7')
    expect(w.get('[data-error="depthWindow"]').text()).toBe('more than 0, at most 5 m')
    await w.get('#reconcile-wrongAngle').setValue('4')
    expect(w.get('[data-error="wrongAngle"]').text()).toBe('must be at least the ok limit')
    await new Promise((r) => setTimeout(r, OPTIONS_DEBOUNCE_MS + 50))
    expect(calls).toHaveLength(1)
    await w.get('#reconcile-depthWindow').setValue('1.5')
    await w.get('#reconcile-wrongAngle').setValue('15')
    await new Promise((r) => setTimeout(r, OPTIONS_DEBOUNCE_MS + 50))
    await flushPromises()
    expect(calls.map((c) => c.url)).toEqual([base, `${base}?depthWindow=1.5`])
  })
})
