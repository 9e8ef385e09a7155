import { ref } from 'vue'
import { projectRoles } from '../../../schema/vocabulary'
import { roleLabels } from '../api/roles'
import type { Id, ProjectRole } from '../api/types'
import { describeError } from '../logic/format'

/** The member calls the project's page state makes (useProject): the editor only starts them. */
export interface MemberActions {
  /** Invites the address into the project with the role; the same answer whether or not it has an account. */
  add: (email: string, role: ProjectRole) => Promise<{ email: string; mailed: boolean }>
  changeRole: (userId: Id, role: ProjectRole) => Promise<void>
  remove: (userId: Id) => Promise<void>
}

const roleOptions = projectRoles.map((value) => ({ value, label: roleLabels[value] }))

/** The members editor's state: the invitation being written, one call at a time, its outcome. */
export function useProjectMembers(actions: () => MemberActions) {
  const email = ref('')
  const role = ref<ProjectRole>('viewer')
  const busy = ref(false)
  const error = ref<string | null>(null)
  const invited = ref<string | null>(null)

  async function run(action: () => Promise<void>) {
    busy.value = true
    error.value = null
    try {
      await action()
    } catch (err: unknown) {
      error.value = describeError(err)
    } finally {
      busy.value = false
    }
  }

  /**
   * Members join by invitation: the mail's link lets someone with an account join, and someone
   * without one create it. The page never learns which of the two the address is.
   */
  function invite() {
    const address = email.value.trim()
    if (!address) return Promise.resolve()
    invited.value = null
    return run(async () => {
      const invitation = await actions().add(address, role.value)
      invited.value = invitation.mailed
        ? `Invitation mailed to ${invitation.email}: they join as ${roleLabels[role.value].toLowerCase()} when they accept it.`
        : `Invitation made, but the mail could not be sent to ${invitation.email}. Try again later.`
      email.value = ''
    })
  }

  const setRole = (userId: Id, next: ProjectRole) => run(() => actions().changeRole(userId, next))
  const removeMember = (userId: Id) => run(() => actions().remove(userId))
  const roleLabel = (r: ProjectRole) => roleLabels[r]

  return {
    email,
    role,
    busy,
    error,
    invited,
    roleOptions,
    roleLabel,
    invite,
    setRole,
    removeMember,
  }
}
