import { computed, ref } from 'vue'
import { reviewInterval, submitInterval, type IntervalStatus, type ReviewStep } from '../api/review'
import { roleAtLeast } from '../api/roles'
import type { ProjectRole } from '../api/types'
import { useAuthStore } from '../stores/auth'
import { describeError } from '../logic/format'

/** What the review bar needs of its interval. */
export interface ReviewTarget {
  projectId: string
  holeId: string
  interval: { id: number; status: IntervalStatus; version: number; checkedBy?: number | null }
  role: ProjectRole | null
  fourEyes: boolean
}

/**
 * One interval's review steps (ask for a check, check, approve, reopen with a reason): which the
 * role may take now, and the call with its outcome in words. `changed` runs after a step succeeds.
 */
export function useIntervalReview(target: () => ReviewTarget, changed: () => void) {
  const auth = useAuthStore()
  const busy = ref(false)
  const message = ref<string | null>(null)
  const reopening = ref(false)
  const reason = ref('')

  const status = computed(() => target().interval.status)
  const can = (min: ProjectRole) => roleAtLeast(target().role, min)
  const canSubmit = computed(() => status.value === 'draft' && can('logger'))
  const canCheck = computed(() => status.value === 'draft' && can('engineer'))
  const canApprove = computed(() => status.value === 'checked' && can('lead'))
  /** The server refuses the checker's own approval (409 four_eyes): say so before the click. */
  const ownCheck = computed(() => {
    const { fourEyes, interval } = target()
    return fourEyes && interval.checkedBy != null && interval.checkedBy === auth.user?.id
  })
  const canReopen = computed(
    () =>
      (status.value === 'checked' && can('engineer')) ||
      (status.value === 'approved' && can('lead')),
  )
  const ids = () => {
    const t = target()
    return { projectId: t.projectId, holeId: t.holeId, intervalId: t.interval.id }
  }

  async function run(action: () => Promise<unknown>, done: string) {
    busy.value = true
    message.value = null
    try {
      await action()
      message.value = done
      changed()
    } catch (err: unknown) {
      message.value = describeError(err, 'That step did not go through.')
    } finally {
      busy.value = false
    }
  }

  const step = (s: ReviewStep, label: string) =>
    run(() => reviewInterval(ids(), s, { version: target().interval.version }), label)
  const submit = () => run(() => submitInterval(ids()), 'The engineers have been told.')
  async function reopen() {
    const body = { version: target().interval.version, reason: reason.value }
    await run(() => reviewInterval(ids(), 'reopen', body), 'Reopened as draft.')
    reopening.value = false
    reason.value = ''
  }

  return {
    busy,
    message,
    reopening,
    reason,
    status,
    canSubmit,
    canCheck,
    canApprove,
    ownCheck,
    canReopen,
    step,
    submit,
    reopen,
  }
}
