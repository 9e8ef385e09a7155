import { describe, expect, it, vi } from 'vitest'
import { flushPromises, mount } from '@vue/test-utils'
import ConfirmationService from 'primevue/confirmationservice'
import PrimeVue from 'primevue/config'
import ProjectMembersEditor from '../../frontend/src/components/project/ProjectMembersEditor.vue'
import {
  useProjectMembers,
  type MemberActions,
} from '../../frontend/src/composables/use-project-members'
import { ApiError } from '../../frontend/src/api/client'
import type { Member } from '../../frontend/src/api/types'

const actions = (over: Partial<MemberActions> = {}): MemberActions => ({
  add: vi.fn(async (email: string) => ({ email, mailed: true })),
  changeRole: vi.fn(async () => {}),
  remove: vi.fn(async () => {}),
  ...over,
})

describe('useProjectMembers()', () => {
  it('useProjectMembers() roleOptions → the ladder viewer to lead with its labels', () => {
    const { roleOptions } = useProjectMembers(() => actions())
    expect(roleOptions).toEqual([
      { value: 'viewer', label: 'Viewer' },
      { value: 'logger', label: 'Logger' },
      { value: 'engineer', label: 'Engineer' },
      { value: 'lead', label: 'Lead' },
    ])
  })

  it('useProjectMembers() invite → the trimmed address with the role, the outcome in words', async () => {
    const a = actions()
    const m = useProjectMembers(() => a)
    m.email.value = '  kim@greyscar.test '
    m.role.value = 'engineer'
    await m.invite()
    expect(a.add).toHaveBeenCalledWith('kim@greyscar.test', 'engineer')
    expect(m.invited.value).toBe(
      'Invitation mailed to kim@greyscar.test: they join as engineer when they accept it.',
    )
    expect(m.email.value).toBe('')
  })

  it('useProjectMembers() invite whose mail failed → says so and that it can be tried later', async () => {
    const m = useProjectMembers(() =>
      actions({ add: vi.fn(async (email: string) => ({ email, mailed: false })) }),
    )
    m.email.value = 'kim@greyscar.test'
    await m.invite()
    expect(m.invited.value).toBe(
      'Invitation made, but the mail could not be sent to kim@greyscar.test. Try again later.',
    )
  })

  it('useProjectMembers() setRole refused → the server’s message, busy released', async () => {
    const refused = new ApiError(409, 'last_lead', 'A project keeps at least one lead.')
    const m = useProjectMembers(() =>
      actions({ changeRole: vi.fn(async () => Promise.reject(refused)) }),
    )
    await m.setRole(3, 'viewer')
    expect(m.error.value).toBe('A project keeps at least one lead.')
    expect(m.busy.value).toBe(false)
  })
})

describe('ProjectMembersEditor', () => {
  it('ProjectMembersEditor without manage rights → names and role labels, no invite form', async () => {
    const members: Member[] = [
      { userId: 4, name: 'Eve Mason', email: 'eve@greyscar.test', role: 'engineer' },
    ]
    const wrapper = mount(ProjectMembersEditor, {
      props: { members, canManage: false, ...actions() },
      global: { plugins: [[PrimeVue, { theme: 'none' }], ConfirmationService] as never[] },
    })
    await flushPromises()
    expect(wrapper.find('form').exists()).toBe(false)
    const cells = wrapper.findAll('tbody tr td').map((td) => td.text())
    expect(cells).toEqual(['Eve Mason', 'eve@greyscar.test', 'Engineer'])
  })
})
