import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest'
import { flushPromises, mount } from '@vue/test-utils'
import { createPinia, setActivePinia, type Pinia } from 'pinia'
import PrimeVue from 'primevue/config'
import { createMemoryHistory, createRouter, type Router } from 'vue-router'
import AcceptInvitationView from '../../frontend/src/views/AcceptInvitationView.vue'
import { getCsrfToken, setCsrfToken } from '../../frontend/src/api/client'
import { useAuthStore } from '../../frontend/src/stores/auth'
import { mockFetch, type Call } from './fetch-mock'

const TOKEN = 'k'.repeat(43)
const preview = {
  email: 'rhian.tall@greyscar.test',
  projectName: 'Greyscar Quarry extension',
  role: 'engineer',
  expiresAt: '2026-12-04T10:00:00Z',
  existingAccount: false,
}
const user = { id: 9, email: 'rhian.tall@greyscar.test', name: 'Rhian Tall', isAdmin: false }
const memberships = [
  { projectId: 1, projectCode: 'GSQ', projectName: 'Greyscar Quarry extension', role: 'engineer' },
]

let pinia: Pinia
let router: Router
beforeEach(async () => {
  pinia = createPinia()
  setActivePinia(pinia)
  setCsrfToken(null)
  router = createRouter({
    history: createMemoryHistory(),
    routes: [
      { path: '/invitations/accept', name: 'accept-invitation', component: AcceptInvitationView },
      { path: '/projects', name: 'projects', component: { template: '<p>projects</p>' } },
    ],
  })
  await router.push(`/invitations/accept?token=${TOKEN}`)
})
afterEach(() => vi.unstubAllGlobals())

const mountView = () =>
  mount(AcceptInvitationView, {
    global: { plugins: [[PrimeVue, { theme: 'none' }], pinia, router] as never[] },
  })

/** A fake server: the session's CSRF token changes when accepting signs the user in. */
function fakeServer(invitation: object | null) {
  let sessionToken = 'anon'
  return (call: Call) => {
    if (call.url === `/api/invitations/${TOKEN}`)
      return invitation
        ? { body: { data: invitation } }
        : {
            status: 410,
            body: { error: { code: 'token_used', message: 'This link has already been used.' } },
          }
    if (call.url === '/api/auth/csrf') return { body: { data: { csrfToken: sessionToken } } }
    if (call.url === '/api/invitations/accept') {
      sessionToken = 'after'
      return { body: { data: { user, memberships, csrfToken: sessionToken } } }
    }
    if (call.url === '/api/auth/me') return { body: { data: { user, memberships } } }
    return { status: 404 }
  }
}

describe('AcceptInvitationView', () => {
  it('shows the project and role, sends name + password, signs in and opens Projects', async () => {
    const calls = mockFetch(fakeServer(preview))
    const wrapper = mountView()
    await flushPromises()
    expect(wrapper.get('[data-testid="invitation-summary"]').text()).toBe(
      'You are invited to Greyscar Quarry extension as Engineer.',
    )
    const submit = wrapper.get('[data-testid="accept-submit"]')
    expect(submit.attributes('disabled')).toBeDefined()
    await wrapper.get('#invite-name').setValue('Rhian Tall')
    await wrapper.get('#invite-password').setValue('north-wall-72')
    await wrapper.get('#invite-repeat').setValue('north-wall-72')
    expect(submit.attributes('disabled')).toBeUndefined()
    await wrapper.get('form').trigger('submit')
    await flushPromises()
    const accept = calls.find((c) => c.url === '/api/invitations/accept')
    expect(accept).toMatchObject({
      method: 'POST',
      body: { token: TOKEN, name: 'Rhian Tall', password: 'north-wall-72' },
    })
    expect(accept!.headers['X-CSRF-Token']).toBe('anon')
    expect(getCsrfToken()).toBe('after')
    expect(useAuthStore().user).toEqual(user)
    expect(useAuthStore().roleIn(1)).toBe('engineer')
    expect(router.currentRoute.value.name).toBe('projects')
  })

  it('keeps the button off while the two passwords differ', async () => {
    mockFetch(fakeServer(preview))
    const wrapper = mountView()
    await flushPromises()
    await wrapper.get('#invite-name').setValue('Rhian Tall')
    await wrapper.get('#invite-password').setValue('north-wall-72')
    await wrapper.get('#invite-repeat').setValue('north-wall-73')
    expect(wrapper.text()).toContain('The two passwords differ.')
    expect(wrapper.get('[data-testid="accept-submit"]').attributes('disabled')).toBeDefined()
  })

  it('asks only for the password of an existing account', async () => {
    const calls = mockFetch(fakeServer({ ...preview, existingAccount: true }))
    const wrapper = mountView()
    await flushPromises()
    expect(wrapper.find('#invite-name').exists()).toBe(false)
    expect(wrapper.find('#invite-repeat').exists()).toBe(false)
    await wrapper.get('#invite-password').setValue('my-old-password')
    await wrapper.get('form').trigger('submit')
    await flushPromises()
    expect(calls.find((c) => c.url === '/api/invitations/accept')!.body).toEqual({
      token: TOKEN,
      password: 'my-old-password',
    })
  })

  it('says so when the link was already used, and offers no form', async () => {
    mockFetch(fakeServer(null))
    const wrapper = mountView()
    await flushPromises()
    expect(wrapper.get('[data-testid="invitation-error"]').text()).toBe(
      'This link has already been used.',
    )
    expect(wrapper.find('form').exists()).toBe(false)
  })
})
