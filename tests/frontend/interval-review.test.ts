import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest'
import { reactive } from 'vue'
import { createPinia, setActivePinia } from 'pinia'
import { setCsrfToken } from '../../frontend/src/api/client'
import type { ProjectRole } from '../../frontend/src/api/types'
import { useAuthStore } from '../../frontend/src/stores/auth'
import {
  useIntervalReview,
  type ReviewTarget,
} from '../../frontend/src/composables/use-interval-review'
import { mockFetch } from './fetch-mock'

const path = '/api/projects/1/holes/2/intervals/11'
const target = (status: ReviewTarget['interval']['status'], role: ProjectRole | null) =>
  reactive<ReviewTarget>({
    projectId: '1',
    holeId: '2',
    interval: { id: 11, status, version: 4, checkedBy: 9 },
    role,
    fourEyes: true,
  })

beforeEach(() => {
  setActivePinia(createPinia())
  useAuthStore().user = { id: 3, email: 'lead@greyscar.test', name: 'Lin Lead', isAdmin: false }
  setCsrfToken('t')
})
afterEach(() => vi.unstubAllGlobals())

describe('useIntervalReview()', () => {
  it('useIntervalReview() offers each step by status and role (the ladder viewer < logger < engineer < lead)', () => {
    const offered = (status: ReviewTarget['interval']['status'], role: ProjectRole | null) => {
      const r = useIntervalReview(() => target(status, role), vi.fn())
      return [r.canSubmit, r.canCheck, r.canApprove, r.canReopen]
        .map((c, i) => (c.value ? ['submit', 'check', 'approve', 'reopen'][i] : ''))
        .filter(Boolean)
    }
    expect(offered('draft', 'viewer')).toEqual([])
    expect(offered('draft', null)).toEqual([])
    expect(offered('draft', 'logger')).toEqual(['submit'])
    expect(offered('draft', 'engineer')).toEqual(['submit', 'check'])
    expect(offered('checked', 'engineer')).toEqual(['reopen'])
    expect(offered('checked', 'lead')).toEqual(['approve', 'reopen'])
    expect(offered('approved', 'engineer')).toEqual([])
    expect(offered('approved', 'lead')).toEqual(['reopen'])
    expect(offered('issued', 'lead')).toEqual([])
  })

  it('useIntervalReview() ownCheck → true only for the checker while the four-eyes rule is on', () => {
    const t = target('checked', 'lead')
    const r = useIntervalReview(() => t, vi.fn())
    expect(r.ownCheck.value).toBe(false)
    t.interval.checkedBy = 3
    expect(r.ownCheck.value).toBe(true)
    t.fourEyes = false
    expect(r.ownCheck.value).toBe(false)
  })

  it('useIntervalReview() step → POST …/check with the version sent, then changed() once', async () => {
    const calls = mockFetch(() => ({ body: { data: { id: 11, status: 'checked', version: 5 } } }))
    const changed = vi.fn()
    const r = useIntervalReview(() => target('draft', 'engineer'), changed)
    await r.step('check', 'Marked checked.')
    expect(calls[0]).toMatchObject({ method: 'POST', url: `${path}/check`, body: { version: 4 } })
    expect(r.message.value).toBe('Marked checked.')
    expect(changed).toHaveBeenCalledTimes(1)
  })

  it('useIntervalReview() step refused with 409 → the server’s reason, changed() not called', async () => {
    mockFetch(() => ({
      status: 409,
      body: { error: { code: 'four_eyes', message: 'The checker cannot approve.' } },
    }))
    const changed = vi.fn()
    const r = useIntervalReview(() => target('checked', 'lead'), changed)
    await r.step('approve', 'Approved.')
    expect(r.message.value).toBe('The checker cannot approve.')
    expect(r.busy.value).toBe(false)
    expect(changed).not.toHaveBeenCalled()
  })

  it('useIntervalReview() reopen → POST …/reopen with the version and reason, dialog closed', async () => {
    const calls = mockFetch(() => ({ body: { data: { id: 11, status: 'draft', version: 5 } } }))
    const r = useIntervalReview(() => target('approved', 'lead'), vi.fn())
    r.reopening.value = true
    r.reason.value = 'Survey revised at 60 m'
    await r.reopen()
    expect(calls[0]).toMatchObject({
      url: `${path}/reopen`,
      body: { version: 4, reason: 'Survey revised at 60 m' },
    })
    expect(r.message.value).toBe('Reopened as draft.')
    expect(r.reopening.value).toBe(false)
    expect(r.reason.value).toBe('')
  })
})
