import { computed } from 'vue'
import { packFileUrl, type PackDetail } from '../api/packs'

const approved = (status: string) => status === 'approved' || status === 'issued'

/** One built pack as its preview shows it: file addresses, and why it cannot be issued, if so. */
export function usePackDetail(projectId: () => string, pack: () => PackDetail) {
  const fileUrl = (name: string) => packFileUrl(projectId(), pack().id, name)
  /** Why Issue is not offered, in words (null when the pack can be issued). */
  const issueBlocked = computed(() => {
    const p = pack()
    if (p.draft)
      return 'A draft pack is a preview: approve every interval in it, then build a new pack to issue.'
    const open = (p.intervals ?? []).filter((i) => !approved(i.status))
    return open.length
      ? `Not issuable: ${open.map((i) => `${i.holeName} ${i.name} is ${i.status}`).join(', ')}.`
      : null
  })
  return { fileUrl, issueBlocked, approved }
}
