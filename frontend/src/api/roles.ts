import { roleRank as ladderRank, type ProjectRole } from '../../../schema/vocabulary'

/** Rank in the role ladder (schema/vocabulary.ts: viewer < logger < engineer < lead); -1 for none. */
export function roleRank(role: ProjectRole | null | undefined): number {
  return role ? ladderRank(role) : -1
}

/** True when `role` is at least `minimum`. */
export function roleAtLeast(role: ProjectRole | null | undefined, minimum: ProjectRole): boolean {
  return roleRank(role) >= roleRank(minimum)
}

/** A global admin counts as lead in every project. */
export function effectiveRole(isAdmin: boolean, role: ProjectRole | null): ProjectRole | null {
  return isAdmin ? 'lead' : role
}

export const roleLabels: Record<ProjectRole, string> = {
  viewer: 'Viewer',
  logger: 'Logger',
  engineer: 'Engineer',
  lead: 'Lead',
}
