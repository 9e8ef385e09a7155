import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest'
import { flushPromises, mount } from '@vue/test-utils'
import CommentThread from '../../frontend/src/components/review/CommentThread.vue'
import { useComments } from '../../frontend/src/composables/use-comments'
import type { CommentRow } from '../../frontend/src/api/review'
import { setCsrfToken } from '../../frontend/src/api/client'
import { mockFetch } from './fetch-mock'
import { withPrimeVue } from './mount-options'

const row = (id: number, body: string): CommentRow => ({
  id,
  body,
  mentions: [],
  createdAt: '2026-12-01T10:00:00Z',
  userId: 4,
  userName: 'Eve Engineer',
})

beforeEach(() => setCsrfToken('t'))
afterEach(() => vi.unstubAllGlobals())

const thread = () =>
  useComments(
    () => '1',
    () => 'interval',
    () => 11,
  )

describe('useComments()', () => {
  it('useComments() send → POST /comments with the entity and the draft, draft cleared, thread reloaded', async () => {
    const rows: CommentRow[] = []
    const calls = mockFetch((call) => {
      if (call.method === 'POST') {
        rows.push(row(1, 'Set 2 looks split: check 41–44 m'))
        return { status: 201, body: { data: rows[0] } }
      }
      return { body: { data: rows } }
    })
    const state = thread()
    state.draft.value = 'Set 2 looks split: check 41–44 m'
    await state.send()
    expect(calls[0]).toMatchObject({
      method: 'POST',
      url: '/api/projects/1/comments',
      body: { entity: 'interval', entityId: 11, body: 'Set 2 looks split: check 41–44 m' },
    })
    expect(calls[1].url).toBe('/api/projects/1/comments?entity=interval&entityId=11')
    expect(state.draft.value).toBe('')
    expect(state.rows.value.map((r) => r.body)).toEqual(['Set 2 looks split: check 41–44 m'])
  })

  it('useComments() send refused → the reason shown, the draft kept as typed', async () => {
    mockFetch(() => ({
      status: 403,
      body: { error: { code: 'forbidden', message: 'Viewers cannot comment.' } },
    }))
    const state = thread()
    state.draft.value = 'Dip looks wrong at 52.3 m'
    await state.send()
    expect(state.error.value).toBe('Viewers cannot comment.')
    expect(state.draft.value).toBe('Dip looks wrong at 52.3 m')
    expect(state.busy.value).toBe(false)
  })
})

describe('CommentThread', () => {
  it('CommentThread loads its entity’s comments and reloads when the entity changes', async () => {
    const calls = mockFetch((call) => ({
      body: { data: call.url.endsWith('entityId=11') ? [row(1, 'first')] : [row(2, 'second')] },
    }))
    const wrapper = mount(CommentThread, {
      props: { projectId: '1', entity: 'interval', entityId: 11, canWrite: false },
      ...withPrimeVue,
    })
    await flushPromises()
    expect(wrapper.text()).toContain('first')
    expect(wrapper.find('form').exists()).toBe(false)
    await wrapper.setProps({ entityId: 12 })
    await flushPromises()
    expect(calls.map((c) => c.url)).toEqual([
      '/api/projects/1/comments?entity=interval&entityId=11',
      '/api/projects/1/comments?entity=interval&entityId=12',
    ])
    expect(wrapper.text()).toContain('second')
  })
})
