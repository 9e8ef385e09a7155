import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest'
import { flushPromises, mount } from '@vue/test-utils'
import ProjectErrorModel from '../../frontend/src/components/project/ProjectErrorModel.vue'
import { setCsrfToken } from '../../frontend/src/api/client'
import type { ErrorModelAnswer, ErrorModelValues } from '../../frontend/src/api/error-model'
import { errorModelFields } from '../../frontend/src/logic/project/error-model-fields'
import { ErrorModelBody } from '../../schema/index'
import { mockFetch, type Call } from './fetch-mock'
import { withPrimeVue } from './mount-options'

// Synthetic project: a gyro-surveyed hole set (tighter azimuth) and a coarser alpha reading.
// The defaults as the server sends them (orient/error-model.ts, common practice, from memory).
const defaults: ErrorModelValues = {
  surveyAzimuthSdMagnetic: 1.5,
  surveyAzimuthSdGyro: 0.5,
  surveyInclinationSd: 0.2,
  alphaSd: 2,
  betaSd: 5,
  pickHeightSdMm: 3,
  pickTroughSd: 3,
  trueDipSd: 2,
  trueDipDirectionSd: 3,
  depthSd: 0.05,
}
const model: ErrorModelValues = { ...defaults, surveyAzimuthSdGyro: 0.3, alphaSd: 3 }
const answer: ErrorModelAnswer = {
  model,
  defaults,
  changed: ['surveyAzimuthSdGyro', 'alphaSd'],
  version: 7,
}
const URL_ = '/api/projects/12/error-model'

type Reply = { status?: number; body?: unknown }
function serve(
  put: (call: Call) => Reply = (c) => ({
    body: { data: { ...answer, version: 8, model: (c.body as { model: ErrorModelValues }).model } },
  }),
) {
  return mockFetch((call) => {
    if (call.url !== URL_) return { status: 404 }
    return call.method === 'PUT' ? put(call) : { body: { data: answer } }
  })
}

async function mountEditor(canEdit: boolean) {
  const wrapper = mount(ProjectErrorModel, { props: { projectId: '12', canEdit }, ...withPrimeVue })
  await flushPromises()
  return wrapper
}

const input = (w: Awaited<ReturnType<typeof mountEditor>>, key: keyof ErrorModelValues) =>
  w.get<HTMLInputElement>(`#error-model-${key}`)
const row = (w: Awaited<ReturnType<typeof mountEditor>>, key: keyof ErrorModelValues) =>
  w.get(`[data-testid="error-model-row-${key}"]`)

beforeEach(() => setCsrfToken('test-token'))
afterEach(() => vi.unstubAllGlobals())

describe('ProjectErrorModel', () => {
  it('GET /error-model: shows each stored value, its default and the changed keys', async () => {
    const calls = serve()
    const w = await mountEditor(true)
    expect(calls.map((c) => `${c.method} ${c.url}`)).toEqual([`GET ${URL_}`])
    for (const f of errorModelFields) {
      expect(input(w, f.key).element.value).toBe(String(model[f.key]))
      expect(row(w, f.key).get('[data-field="default"]').text()).toBe(String(defaults[f.key]))
      const changed = row(w, f.key).find('[data-field="changed"]').exists()
      expect(changed, f.key).toBe(answer.changed.includes(f.key))
    }
    expect(w.get('[data-testid="error-model-summary"]').text()).toContain('2 of 10')
    // units beside each value
    expect(row(w, 'pickHeightSdMm').text()).toContain('mm')
    expect(row(w, 'depthSd').findAll('td')[1].text()).toBe('m')
    expect(w.text()).toContain("recomputes every structure's cone in the project")
  })

  it('PUT /error-model (lead): sends all ten keys as numbers with the version read', async () => {
    const calls = serve()
    const w = await mountEditor(true)
    await input(w, 'betaSd').setValue('7.5')
    await w.get('form').trigger('submit')
    await flushPromises()
    const put = calls.find((c) => c.method === 'PUT')!
    expect(put.url).toBe(URL_)
    expect(put.body).toEqual({ model: { ...model, betaSd: 7.5 }, version: 7 })
    expect(Object.keys((put.body as { model: object }).model)).toHaveLength(10)
    expect(ErrorModelBody.safeParse((put.body as { model: object }).model).success).toBe(true)
    expect(w.find('[data-testid="error-model-saved"]').exists()).toBe(true)
    expect(w.text()).toContain('Version 8')
  })

  it('PUT /error-model → 400: the detail appears at its field, what was typed is kept', async () => {
    serve(() => ({
      status: 400,
      body: {
        error: {
          code: 'invalid_input',
          message: 'Some fields are not valid.',
          details: [{ path: 'model.alphaSd', message: 'Number must be less than or equal to 30' }],
        },
      },
    }))
    const w = await mountEditor(true)
    await input(w, 'alphaSd').setValue('25')
    await w.get('form').trigger('submit')
    await flushPromises()
    expect(w.get('[data-testid="error-model-error-alphaSd"]').text()).toBe(
      'Number must be less than or equal to 30',
    )
    expect(input(w, 'alphaSd').element.value).toBe('25')
    expect(w.find('[data-testid="error-model-error-betaSd"]').exists()).toBe(false)
  })

  it('save with a value out of range: marked at its field and nothing is sent', async () => {
    const calls = serve()
    const w = await mountEditor(true)
    await input(w, 'depthSd').setValue('6')
    await input(w, 'betaSd').setValue('')
    await w.get('form').trigger('submit')
    await flushPromises()
    expect(calls.filter((c) => c.method === 'PUT')).toHaveLength(0)
    expect(w.get('[data-testid="error-model-error-depthSd"]').text()).toBe('Must be at most 5 m.')
    expect(w.get('[data-testid="error-model-error-betaSd"]').text()).toBe('Enter a number.')
    expect(input(w, 'depthSd').element.value).toBe('6')
  })

  it('PUT /error-model → 409 interval_approved: the server message is shown in place', async () => {
    const message =
      'Changing the error model (hole GSQ-BH02) would change approved interval 40.0–55.0 m.'
    serve(() => ({ status: 409, body: { error: { code: 'interval_approved', message } } }))
    const w = await mountEditor(true)
    await input(w, 'alphaSd').setValue('2.5')
    await w.get('form').trigger('submit')
    await flushPromises()
    expect(w.get('[data-testid="error-model-approved"]').text()).toContain(message)
    expect(input(w, 'alphaSd').element.value).toBe('2.5')
  })

  it('PUT /error-model → 409 stale_version: offers to reload the latest model', async () => {
    const calls = serve(() => ({
      status: 409,
      body: { error: { code: 'stale_version', message: 'Someone else changed this.' } },
    }))
    const w = await mountEditor(true)
    await input(w, 'alphaSd').setValue('2.5')
    await w.get('form').trigger('submit')
    await flushPromises()
    const stale = w.get('[data-testid="error-model-stale"]')
    expect(stale.text()).toContain('Someone else changed this.')
    await stale.get('button').trigger('click')
    await flushPromises()
    expect(calls.filter((c) => c.method === 'GET')).toHaveLength(2)
    expect(w.find('[data-testid="error-model-stale"]').exists()).toBe(false)
    expect(input(w, 'alphaSd').element.value).toBe('3')
  })

  it('Reset to defaults fills the defaults; the save then sends them', async () => {
    const calls = serve()
    const w = await mountEditor(true)
    await w.get('[data-testid="error-model-defaults"]').trigger('click')
    expect(input(w, 'alphaSd').element.value).toBe(String(defaults.alphaSd))
    expect(w.findAll('[data-field="changed"]')).toHaveLength(0)
    await w.get('form').trigger('submit')
    await flushPromises()
    expect(calls.find((c) => c.method === 'PUT')!.body).toEqual({ model: defaults, version: 7 })
  })

  it('GET /error-model (engineer): read-only, no save or reset', async () => {
    const calls = serve()
    const w = await mountEditor(false)
    for (const f of errorModelFields)
      expect(input(w, f.key).attributes('readonly'), f.key).toBeDefined()
    expect(w.find('[data-testid="error-model-save"]').exists()).toBe(false)
    expect(w.find('[data-testid="error-model-defaults"]').exists()).toBe(false)
    expect(w.get('[data-testid="error-model-readonly"]').text()).toContain('project lead')
    await w.get('form').trigger('submit')
    await flushPromises()
    expect(calls.filter((c) => c.method === 'PUT')).toHaveLength(0)
  })

  it('errorModelFields: the form bounds are the schema ErrorModelBody bounds', () => {
    for (const f of errorModelFields) {
      const at = (v: number) => ErrorModelBody.safeParse({ ...defaults, [f.key]: v }).success
      expect(at(f.max), f.key).toBe(true)
      expect(at(f.max + 1e-6), f.key).toBe(false)
      expect(at(0), f.key).toBe(true)
      expect(at(-1e-6), f.key).toBe(false)
    }
    expect(new Set(errorModelFields.map((f) => f.key))).toEqual(new Set(Object.keys(defaults)))
  })
})
